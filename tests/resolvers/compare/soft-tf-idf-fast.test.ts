/**
 * The fast soft TF-IDF (length bound, weights computed once, one similarity matrix) against the straightforward
 * definition of Cohen, Ravikumar & Fienberg 2003 as resolvers/compare/soft-tf-idf.ts states it: every token pair
 * compared, best match per token, strict "> θ" (equal tokens always count), each direction capped at 1, mean of
 * the two directions.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { buildIdfTable, jaroWinkler, jaroWinklerUpperBound, softTfIdf, type IdfTable } from '../../../resolvers/compare/index.ts';

/** The definition, written out with no shortcut. */
function referenceSoftTfIdf(a: readonly string[], b: readonly string[], idf: IdfTable, threshold: number): number {
  if (a.length === 0 || b.length === 0) return 0;
  const weigh = (tokens: readonly string[]): Map<string, number> => {
    const counts = new Map<string, number>();
    for (const t of tokens) counts.set(t, (counts.get(t) ?? 0) + 1);
    const raw = new Map([...counts].map(([t, c]) => [t, Math.log(c + 1) * idf.idf(t)]));
    const norm = Math.sqrt([...raw.values()].reduce((s, w) => s + w * w, 0));
    return new Map([...raw].map(([t, w]) => [t, norm > 0 ? w / norm : w]));
  };
  const one = (s: Map<string, number>, t: Map<string, number>): number => {
    let sum = 0;
    for (const [w, vw] of s) {
      let best = -1;
      let bestToken = '';
      for (const v of t.keys()) {
        const sim = jaroWinkler(w, v);
        if (sim > best) {
          best = sim;
          bestToken = v;
        }
      }
      if (best > threshold || best === 1) sum += vw * (t.get(bestToken) as number) * best;
    }
    return Math.min(sum, 1);
  };
  const wa = weigh(a);
  const wb = weigh(b);
  return (one(wa, wb) + one(wb, wa)) / 2;
}

// Short tokens over a small alphabet make near-threshold and length-skipped pairs common; lengths 1..14 cover
// ratios on both sides of the bound (common practice for property tests: shrinkable, seeded generators).
// `size: 'max'`: with fast-check's default size strings and arrays stop at about ten items whatever maxLength says,
// so tokens of 11 to 14 letters and 40-letter texts were never generated (issue 17).
const token = fc.string({ unit: fc.constantFrom(...'abcdeio'), minLength: 1, maxLength: 14, size: 'max' });
const tokens = fc.array(token, { minLength: 0, maxLength: 6, size: 'max' });

describe('jaroWinklerUpperBound (derived in resolvers/compare/jaro-winkler.ts)', () => {
  it('is reached by a prefix of the longer string (hand computation)', () => {
    // "abcd" / "abcdwxyz": m = 4, t = 0, Jaro = (1 + 4/8 + 1)/3 = 5/6, JW = 5/6 + 4 · 0.1 · 1/6 = 0.9 (Winkler 1990
    // formula); the bound 1 − (1 − 4/8)/3 · (1 − 0.4) = 0.9 equals it.
    expect(jaroWinkler('abcd', 'abcdwxyz')).toBeCloseTo(0.9, 12);
    expect(jaroWinklerUpperBound(4, 8)).toBeCloseTo(0.9, 12);
    expect(jaroWinklerUpperBound(8, 4)).toBe(jaroWinklerUpperBound(4, 8));
    expect(jaroWinklerUpperBound(0, 5)).toBe(0);
    expect(jaroWinklerUpperBound(6, 6)).toBe(1);
  });

  it('is never below the similarity of two different strings (fast-check)', () => {
    const text = fc.string({ unit: fc.constantFrom(...'abcdexyz'), minLength: 0, maxLength: 40, size: 'max' });
    let longest = 0;
    fc.assert(
      fc.property(text, text, (a, b) => {
        longest = Math.max(longest, a.length, b.length);
        if (a === b) return;
        expect(jaroWinkler(a, b)).toBeLessThanOrEqual(jaroWinklerUpperBound(a.length, b.length) + 1e-12);
      }),
      { numRuns: 20_000, seed: 5 },
    );
    expect(longest).toBe(40);
  });

  it('never skips a token pair that passes θ: every pair above θ has its bound above θ too (fast-check)', () => {
    const lengths = new Set<number>();
    fc.assert(
      fc.property(token, token, fc.double({ min: 0, max: 1, noNaN: true }), (a, b, threshold) => {
        lengths.add(a.length).add(b.length);
        if (a !== b && jaroWinkler(a, b) > threshold) expect(jaroWinklerUpperBound(a.length, b.length)).toBeGreaterThan(threshold - 1e-9);
      }),
      { numRuns: 20_000, seed: 6 },
    );
    // Every token length 1..14 the comment above relies on was generated.
    expect([...lengths].sort((x, y) => x - y)).toEqual(Array.from({ length: 14 }, (_, i) => i + 1));
  });
});

describe('softTfIdf equals the straightforward definition', () => {
  it('to 1e-12 on random token lists, IDF tables and thresholds (fast-check)', () => {
    fc.assert(
      fc.property(tokens, tokens, fc.array(tokens, { maxLength: 8, size: 'max' }), fc.constantFrom(0.9, 0.8, 0.95, 0.5, 0, 1), (a, b, corpus, threshold) => {
        const idf = buildIdfTable([a, b, ...corpus]);
        const fast = softTfIdf(a, b, idf, { threshold });
        const reference = referenceSoftTfIdf(a, b, idf, threshold);
        expect(Math.abs(fast - reference)).toBeLessThanOrEqual(1e-12);
      }),
      { numRuns: 20_000, seed: 7 },
    );
  });
});
