import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { clusterRecords, type ScoredEdge } from '../../../resolvers/cluster/index.ts';

// Scores below are invented match scores (bits); the thresholds are the options under test.
describe('clusterRecords', () => {
  it('merges a clear pair and leaves an unrelated record alone', () => {
    const clusters = clusterRecords(['a', 'b', 'c'], [{ a: 'a', b: 'b', score: 12 }, { a: 'b', b: 'c', score: -8 }], [], { linkAt: 5 });
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
    fc.assert(
      fc.property(
        fc.array(edgeArb, { maxLength: 60 }),
        fc.array(pairArb, { maxLength: 5 }),
        fc.integer(),
        (edges, cannot, seed) => {
          const options = { linkAt: 4, conflictBelow: -5 };
          const reference = clusterRecords(ids, edges, cannot, options);
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
          const again = clusterRecords(shuffle(ids), flipped, shuffle(cannot).map(([x, y]) => [y, x] as const), options);
          expect(again).toEqual(reference);
          // Every id appears exactly once.
          expect(reference.flat().sort()).toEqual([...ids].sort());
          // No cluster holds both ends of a cannot-link.
          for (const [x, y] of cannot) {
            if (x !== y) expect(reference.some((c) => c.includes(x) && c.includes(y))).toBe(false);
          }
        },
      ),
      { numRuns: 300 },
    );
  });
});
