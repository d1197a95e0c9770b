import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { UnionFind } from '../../../resolvers/cluster/index.ts';

/** Connected components by breadth-first search: the reference the union-find's sets are checked against. */
function componentsBySearch(n: number, edges: readonly (readonly [number, number])[]): number[] {
  const next: number[][] = Array.from({ length: n }, () => []);
  for (const [a, b] of edges) {
    next[a]!.push(b);
    next[b]!.push(a);
  }
  const label = new Array<number>(n).fill(-1);
  for (let start = 0; start < n; start++) {
    if (label[start] !== -1) continue;
    const queue = [start];
    label[start] = start;
    while (queue.length > 0) {
      for (const m of next[queue.pop()!]!) {
        if (label[m] === -1) {
          label[m] = start;
          queue.push(m);
        }
      }
    }
  }
  return label;
}

describe('UnionFind', () => {
  it('keeps the larger set’s root on a join, the first argument’s on a tie, and counts members', () => {
    const sets = new UnionFind(5);
    expect(sets.roots(1, 2)).toEqual([1, 2]);
    expect(sets.union(1, 2)).toBe(true);
    expect(sets.find(2)).toBe(1);
    // {3} joins the set of two: the set of two keeps its root although 3 is named first.
    expect(sets.roots(3, 2)).toEqual([1, 3]);
    sets.union(3, 2);
    expect(sets.size(3)).toBe(3);
    expect(sets.union(1, 3)).toBe(false);
    expect(sets.roots(2, 3)).toBeNull();
    expect(sets.size(0)).toBe(1);
    expect(sets.find(4)).toBe(4);
  });

  it('lets a caller check a join before making it (roots, then join)', () => {
    const sets = new UnionFind(3);
    const roots = sets.roots(0, 1)!;
    expect(sets.find(1)).toBe(1);
    sets.join(...roots);
    expect(sets.find(1)).toBe(0);
    expect(sets.size(1)).toBe(2);
  });

  it('answers the connected components of any edge list (property, against a breadth-first search)', () => {
    const graph = fc
      .integer({ min: 1, max: 40 })
      .chain((n) => fc.tuple(fc.constant(n), fc.array(fc.tuple(fc.integer({ min: 0, max: n - 1 }), fc.integer({ min: 0, max: n - 1 })), { maxLength: 80 })));
    fc.assert(
      fc.property(graph, ([n, edges]) => {
        const sets = new UnionFind(n);
        for (const [a, b] of edges) sets.union(a, b);
        // Each member labelled with the first member of its set, as componentsBySearch labels it.
        const first = new Map<number, number>();
        const labels = Array.from({ length: n }, (_, i) => (first.has(sets.find(i)) ? first.get(sets.find(i))! : (first.set(sets.find(i), i), i)));
        const expected = componentsBySearch(n, edges);
        expect(labels).toEqual(expected);
        expect(Array.from({ length: n }, (_, i) => sets.size(i))).toEqual(expected.map((l) => expected.filter((m) => m === l).length));
      }),
    );
  });
});
