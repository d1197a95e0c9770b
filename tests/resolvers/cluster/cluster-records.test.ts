import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { clusterRecords, type ScoredEdge } from '../../../resolvers/cluster/index.ts';

// Scores below are invented match scores (bits); the thresholds are the options under test.
describe('clusterRecords', () => {
  it('merges a clear pair and leaves an unrelated record alone', () => {
    const clusters = clusterRecords(
      ['a', 'b', 'c'],
      [
        { a: 'a', b: 'b', score: 12 },
        { a: 'b', b: 'c', score: -8 },
      ],
      [],
      { linkAt: 5 },
    );
    expect(clusters).toEqual([['a', 'b'], ['c']]);
  });

  it('does not chain: A~B and B~C stay apart from each other when A–C scores low', () => {
    const edges: ScoredEdge[] = [
      { a: 'A', b: 'B', score: 10 },
      { a: 'B', b: 'C', score: 9 },
      { a: 'A', b: 'C', score: -15 },
    ];
    const clusters = clusterRecords(['A', 'B', 'C'], edges, [], { linkAt: 5, conflictBelow: 0 });
    expect(clusters).toEqual([['A', 'B'], ['C']]);
    // Without the conflict floor, average linkage still refuses: (9 − 15) / 2 < 5.
    expect(clusterRecords(['A', 'B', 'C'], edges, [], { linkAt: 5 })).toEqual([['A', 'B'], ['C']]);
  });

  it('does not chain through a cannot-link even when every scored pair is high', () => {
    const edges: ScoredEdge[] = [
      { a: 'A', b: 'B', score: 10 },
      { a: 'B', b: 'C', score: 9 },
      { a: 'A', b: 'C', score: 8 },
    ];
    expect(clusterRecords(['A', 'B', 'C'], edges, [['A', 'C']], { linkAt: 5 })).toEqual([['A', 'B'], ['C']]);
    expect(clusterRecords(['A', 'B', 'C'], edges, [], { linkAt: 5 })).toEqual([['A', 'B', 'C']]);
  });

  it('a decisive (infinite) edge links despite a weak name score, unless a cannot-link forbids it', () => {
    const edges: ScoredEdge[] = [{ a: 'x', b: 'y', score: Infinity }];
    expect(clusterRecords(['x', 'y'], edges, [], { linkAt: 5 })).toEqual([['x', 'y']]);
    expect(clusterRecords(['x', 'y'], edges, [['y', 'x']], { linkAt: 5 })).toEqual([['x'], ['y']]);
  });

  it('rejects edges naming unknown records', () => {
    expect(() => clusterRecords(['a'], [{ a: 'a', b: 'zz', score: 3 }], [], { linkAt: 1 })).toThrow(/"zz"/);
  });

  it('gives the same clusters whatever the order of ids, edges and cannot-links (property)', () => {
    const ids = Array.from({ length: 12 }, (_, i) => `r${i}`);
    const edgeArb = fc.record({
      a: fc.constantFrom(...ids),
      b: fc.constantFrom(...ids),
      score: fc.integer({ min: -20, max: 20 }),
    });
    const pairArb = fc.tuple(fc.constantFrom(...ids), fc.constantFrom(...ids));
    // `size: 'max'`: with fast-check's default size an array holds about ten edges whatever maxLength says, so
    // most records stayed alone and cannot-links rarely met a cluster (issue 17).
    let largest = 0;
    let cannotInside = 0;
    fc.assert(
      fc.property(fc.array(edgeArb, { maxLength: 60, size: 'max' }), fc.array(pairArb, { maxLength: 5, size: 'max' }), fc.integer(), (edges, cannot, seed) => {
        const options = { linkAt: 4, conflictBelow: -5 };
        const reference = clusterRecords(ids, edges, cannot, options);
        largest = Math.max(largest, ...reference.map((c) => c.length));
        // A cannot-link between two records a linking edge chain would join: the case the property is about.
        const joined = clusterRecords(ids, edges, [], options);
        if (cannot.some(([x, y]) => x !== y && joined.some((c) => c.includes(x) && c.includes(y)))) cannotInside++;
        const shuffle = <T>(xs: T[]): T[] => {
          const out = [...xs];
          let s = seed >>> 0;
          for (let i = out.length - 1; i > 0; i--) {
            s = (Math.imul(s, 1103515245) + 12345) >>> 0;
            const j = s % (i + 1);
            [out[i], out[j]] = [out[j] as T, out[i] as T];
          }
          return out;
        };
        const flipped = shuffle(edges).map((e) => ({ a: e.b, b: e.a, score: e.score }));
        const again = clusterRecords(
          shuffle(ids),
          flipped,
          shuffle(cannot).map(([x, y]) => [y, x] as const),
          options,
        );
        expect(again).toEqual(reference);
        // Every id appears exactly once.
        expect(reference.flat().sort()).toEqual([...ids].sort());
        // No cluster holds both ends of a cannot-link.
        for (const [x, y] of cannot) {
          if (x !== y) expect(reference.some((c) => c.includes(x) && c.includes(y))).toBe(false);
        }
      }),
      { numRuns: 300, seed: 51 },
    );
    // Large clusters were built and cannot-links had to split some (measured with this seed: a largest cluster of 9,
    // 94 runs with a cannot-link inside a cluster; with the default size the largest stays under 8).
    expect(largest, `largest cluster ${largest}`).toBeGreaterThanOrEqual(8);
    expect(cannotInside, `${cannotInside} of 300 runs had a cannot-link inside a cluster`).toBeGreaterThan(60);
  });
});
