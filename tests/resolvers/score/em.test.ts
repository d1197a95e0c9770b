import { describe, expect, it } from 'vitest';
import { estimateByEm, levelFrequencies, type ComparisonVector } from '../../../resolvers/score/em.ts';
import { seededRandom } from '../../../resolvers/prng.ts';

// No published EM worked example exists (worked-examples.json → fellegi_sunter says "not found"), so the check is
// recovery: vectors drawn from a mixture with KNOWN parameters (stated below, invented) must give them back.
const TRUE_P = 0.2;
const TRUE_M = [
  [0.85, 0.1, 0.05],
  [0.9, 0.1],
  [0.7, 0.3],
];
const TRUE_U = [
  [0.02, 0.18, 0.8],
  [0.3, 0.7],
  [0.1, 0.9],
];

function draw(rows: number[], r: () => number): number {
  let x = r();
  for (let k = 0; k < rows.length; k++) {
    x -= rows[k] as number;
    if (x < 0) return k;
  }
  return rows.length - 1;
}

function sample(n: number, seed: number, missingShare = 0): ComparisonVector[] {
  const random = seededRandom(seed);
  const out: ComparisonVector[] = [];
  for (let i = 0; i < n; i++) {
    const match = random.chance(TRUE_P);
    out.push(TRUE_M.map((m, f) => (random.chance(missingShare) ? null : draw(match ? m : (TRUE_U[f] as number[]), random.next))));
  }
  return out;
}

describe('estimateByEm', () => {
  it('recovers p, m and u within 0.02 from 40,000 synthetic pairs with 10 % missing values', () => {
    const vectors = sample(40_000, 7, 0.1);
    const result = estimateByEm(vectors, {
      levels: [3, 2, 2],
      initialM: [
        [0.6, 0.3, 0.1],
        [0.7, 0.3],
        [0.6, 0.4],
      ],
      initialU: [
        [0.1, 0.2, 0.7],
        [0.5, 0.5],
        [0.3, 0.7],
      ],
      initialP: 0.1,
    });
    expect(result.converged).toBe(true);
    expect(result.p).toBeCloseTo(TRUE_P, 1);
    expect(Math.abs(result.p - TRUE_P)).toBeLessThan(0.02);
    result.m.forEach((row, f) => row.forEach((v, k) => expect(Math.abs(v - (TRUE_M[f] as number[])[k]!)).toBeLessThan(0.02)));
    result.u.forEach((row, f) => row.forEach((v, k) => expect(Math.abs(v - (TRUE_U[f] as number[])[k]!)).toBeLessThan(0.02)));
  });

  it('keeps u fixed when asked and still recovers m and p', () => {
    const vectors = sample(20_000, 11);
    const u = TRUE_U.map((r) => [...r]);
    const result = estimateByEm(vectors, {
      levels: [3, 2, 2],
      initialM: [
        [0.4, 0.3, 0.3],
        [0.5, 0.5],
        [0.5, 0.5],
      ],
      initialU: u,
      initialP: 0.5,
      fixU: true,
    });
    expect(result.u).toEqual(u);
    expect(Math.abs(result.p - TRUE_P)).toBeLessThan(0.02);
    expect(Math.abs(result.m[0]![0]! - 0.85)).toBeLessThan(0.03);
  });

  it('levelFrequencies of non-match vectors approximates u (random pairs are almost all non-matches)', () => {
    const random = seededRandom(3);
    const vectors: ComparisonVector[] = Array.from({ length: 20_000 }, () => TRUE_U.map((u) => draw(u, random.next)));
    const u = levelFrequencies(vectors, [3, 2, 2]);
    u.forEach((row, f) => row.forEach((v, k) => expect(Math.abs(v - (TRUE_U[f] as number[])[k]!)).toBeLessThan(0.015)));
  });

  it('rejects starting values of the wrong shape, naming the parameter', () => {
    expect(() => estimateByEm([[0]], { levels: [2], initialM: [[1]], initialU: [[0.5, 0.5]], initialP: 0.5 })).toThrow(/initialM\[0\]/);
  });
});
