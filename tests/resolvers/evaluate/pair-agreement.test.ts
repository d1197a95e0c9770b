import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { differingPairs, pairAgreement } from '../../../resolvers/evaluate/index.ts';

/** Brute force over all item pairs: the definition (Jaccard index of the co-clustered pair sets; common practice). */
function bruteForce(a: readonly string[], b: readonly string[]): { both: number; firstOnly: number; secondOnly: number } {
  let both = 0;
  let firstOnly = 0;
  let secondOnly = 0;
  for (let i = 0; i < a.length; i++) {
    for (let j = i + 1; j < a.length; j++) {
      const x = a[i] === a[j];
      const y = b[i] === b[j];
      if (x && y) both++;
      else if (x) firstOnly++;
      else if (y) secondOnly++;
    }
  }
  return { both, firstOnly, secondOnly };
}

describe('pairAgreement', () => {
  it('a worked example: {0,1,2}{3} against {0,1}{2,3} agree on 1 of 4 pairs', () => {
    // Pairs of the first: 01, 02, 12; of the second: 01, 23; together in both: 01; union: 4 (worked by hand).
    expect(pairAgreement(['a', 'a', 'a', 'b'], ['x', 'x', 'y', 'y'])).toEqual({ agreement: 0.25, both: 1, firstOnly: 2, secondOnly: 1 });
    expect(differingPairs(['a', 'a', 'a', 'b'], ['x', 'x', 'y', 'y'])).toEqual([
      { pair: [0, 2], together: 'first' },
      { pair: [1, 2], together: 'first' },
      { pair: [2, 3], together: 'second' },
    ]);
  });

  it('is 1 for two clusterings that join nothing, and for equal clusterings under other labels', () => {
    expect(pairAgreement(['a', 'b'], ['c', 'd']).agreement).toBe(1);
    expect(pairAgreement(['a', 'a', 'b'], ['z', 'z', 'q']).agreement).toBe(1);
  });

  it('refuses clusterings of different lengths', () => {
    expect(() => pairAgreement(['a'], ['a', 'b'])).toThrow(/same items/);
  });

  it('matches the brute-force count over all pairs, and lists exactly the differing pairs (property)', () => {
    // `size: 'max'`: with fast-check's default size the array held about ten labels whatever maxLength says (issue 17).
    const labels = fc.array(fc.constantFrom('p', 'q', 'r', 's', 't'), { minLength: 0, maxLength: 25, size: 'max' });
    let longest = 0;
    fc.assert(
      fc.property(labels, fc.array(fc.constantFrom('u', 'v', 'w'), { minLength: 25, maxLength: 25 }), (a, bAll) => {
        longest = Math.max(longest, a.length);
        const b = bAll.slice(0, a.length);
        const expected = bruteForce(a, b);
        const got = pairAgreement(a, b);
        expect({ both: got.both, firstOnly: got.firstOnly, secondOnly: got.secondOnly }).toEqual(expected);
        const union = expected.both + expected.firstOnly + expected.secondOnly;
        expect(got.agreement).toBeCloseTo(union === 0 ? 1 : expected.both / union, 12);
        expect(differingPairs(a, b)).toHaveLength(expected.firstOnly + expected.secondOnly);
      }),
      { numRuns: 200, seed: 61 },
    );
    expect(longest).toBeGreaterThanOrEqual(20);
  });
});
