/**
 * Disjoint sets over the indices 0 … n−1 (union by size, path compression): the one union-find of the matching
 * stages (clustering, the batch's linking components, partitioning). Which root survives a join is fixed (the
 * larger set's; the first argument's on a tie) so that callers that keep data per root agree with it.
 */
export class UnionFind {
  private readonly parent: Int32Array;
  private readonly sizes: Int32Array;

  constructor(n: number) {
    this.parent = Int32Array.from({ length: n }, (_, i) => i);
    this.sizes = new Int32Array(n).fill(1);
  }

  find(x: number): number {
    let root = x;
    while (this.parent[root] !== root) root = this.parent[root] as number;
    while (this.parent[x] !== root) {
      const next = this.parent[x] as number;
      this.parent[x] = root;
      x = next;
    }
    return root;
  }

  /** The number of members of x's set. */
  size(x: number): number {
    return this.sizes[this.find(x)] as number;
  }

  /**
   * The roots of a's and b's sets as [survivor, joined] (the larger set's root survives; a's on a tie), or null when
   * they are one set already: for callers that check a join before making it with `join`.
   */
  roots(a: number, b: number): [survivor: number, joined: number] | null {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra === rb) return null;
    return (this.sizes[ra] as number) >= (this.sizes[rb] as number) ? [ra, rb] : [rb, ra];
  }

  /** Puts the set of root `joined` under root `survivor` (the pair `roots` answered). */
  join(survivor: number, joined: number): void {
    this.parent[joined] = survivor;
    this.sizes[survivor] = (this.sizes[survivor] as number) + (this.sizes[joined] as number);
  }

  /** Joins a's and b's sets; false when they were one set already. */
  union(a: number, b: number): boolean {
    const r = this.roots(a, b);
    if (r) this.join(r[0], r[1]);
    return r !== null;
  }
}
