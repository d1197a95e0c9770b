/**
 * Constrained agglomerative clustering of records from scored pairs.
 *
 * Edges are taken best first (score descending, ties broken by the record ids, so the input order never matters).
 * An edge at or above `linkAt` merges the two clusters it joins only when, over every scored pair across them:
 *  - no pair is a cannot-link (identifier conflict, reviewer decision),
 *  - no pair scores below `conflictBelow` (two members that look clearly different block the merge),
 *  - the average score stays at or above `averageAt` (average linkage; default `linkAt`).
 * This is what stops chaining: A~B and B~C do not pull A and C together when A–C conflicts or scores low.
 * Pairs that were never scored (blocking did not propose them) carry no evidence either way and are not counted.
 *
 * Cost: O(E log E) for the sort; each merge attempt reads the scored pairs of the smaller cluster's members
 * (adjacency in flat typed arrays), so clusters of a few names cost a few reads.
 */
import { UnionFind } from './union-find.ts';

export interface ScoredEdge {
  a: string;
  b: string;
  /** Match score of the pair (bits of evidence); +Infinity for a decisive identifier match. */
  score: number;
}

export interface ClusterOptions {
  linkAt: number;
  /** A scored cross pair below this forbids a merge. Default: −Infinity (only averages and cannot-links count). */
  conflictBelow?: number;
  /** Average-linkage floor over scored cross pairs. Default: linkAt. */
  averageAt?: number;
}

/** Pairs given by record index, for callers that already hold indices (no string keys, no duplicate pairs). */
export interface IndexedPairs {
  left: Int32Array;
  right: Int32Array;
  scores: Float64Array;
  count: number;
}

export function clusterRecords(
  ids: readonly string[],
  edges: readonly ScoredEdge[],
  cannotLinks: readonly (readonly [string, string])[],
  options: ClusterOptions,
): string[][] {
  const index = new Map<string, number>();
  const unique: string[] = [];
  for (const id of ids) {
    if (!index.has(id)) {
      index.set(id, unique.length);
      unique.push(id);
    }
  }
  const indexOf = (id: string, what: string): number => {
    const at = index.get(id);
    if (at === undefined) throw new Error(`clusterRecords: ${what} names record "${id}", which is not in the id list`);
    return at;
  };
  const n = unique.length;
  // One edge per unordered pair, the highest score winning; cannot-links as −Infinity.
  const best = new Map<number, number>();
  const put = (i: number, j: number, score: number, cannot: boolean): void => {
    if (i === j) return;
    const key = i < j ? i * n + j : j * n + i;
    const seen = best.get(key);
    if (cannot || seen === -Infinity) best.set(key, -Infinity);
    else if (seen === undefined || score > seen) best.set(key, score);
  };
  for (const e of edges) put(indexOf(e.a, 'an edge'), indexOf(e.b, 'an edge'), e.score, false);
  for (const [a, b] of cannotLinks) put(indexOf(a, 'a cannot-link'), indexOf(b, 'a cannot-link'), -Infinity, true);
  const pairs: IndexedPairs = { left: new Int32Array(best.size), right: new Int32Array(best.size), scores: new Float64Array(best.size), count: best.size };
  let k = 0;
  for (const [key, score] of best) {
    pairs.left[k] = Math.floor(key / n);
    pairs.right[k] = key % n;
    pairs.scores[k] = score;
    k++;
  }
  return clusterIndexed(unique, pairs, options);
}

/**
 * The same clustering over index pairs: `ids[i]` names record i; a score of −Infinity is a cannot-link.
 * Pairs must be distinct (each unordered pair at most once).
 */
export function clusterIndexed(ids: readonly string[], pairs: IndexedPairs, options: ClusterOptions): string[][] {
  const conflictBelow = options.conflictBelow ?? -Infinity;
  const averageAt = options.averageAt ?? options.linkAt;
  const n = ids.length;
  const rank = idRanks(ids);
  const adjacency = buildAdjacency(n, pairs);
  const sets = new UnionFind(n);
  // The members of each set, kept at its root (the merge check reads the smaller set's members).
  const members: number[][] = Array.from({ length: n }, (_, i) => [i]);
  const find = (i: number): number => sets.find(i);

  const order: number[] = [];
  for (let k = 0; k < pairs.count; k++) if ((pairs.scores[k] as number) >= options.linkAt) order.push(k);
  const lo = (k: number): number => Math.min(rank[pairs.left[k] as number] as number, rank[pairs.right[k] as number] as number);
  const hi = (k: number): number => Math.max(rank[pairs.left[k] as number] as number, rank[pairs.right[k] as number] as number);
  order.sort((x, y) => (pairs.scores[y] as number) - (pairs.scores[x] as number) || lo(x) - lo(y) || hi(x) - hi(y));

  for (const k of order) {
    const roots = sets.roots(pairs.left[k] as number, pairs.right[k] as number);
    if (!roots) continue;
    const [big, small] = roots;
    if (!mergeAllowed(members[small] as number[], big, adjacency, find, conflictBelow, averageAt)) continue;
    sets.join(big, small);
    (members[big] as number[]).push(...(members[small] as number[]));
    members[small] = [];
  }

  const clusters: string[][] = [];
  for (let i = 0; i < n; i++) {
    if (find(i) !== i) continue;
    clusters.push((members[i] as number[]).map((m) => ids[m] as string).sort(compareIds));
  }
  return clusters.sort((x, y) => compareIds(x[0] as string, y[0] as string));
}

interface Adjacency {
  offsets: Int32Array;
  neighbours: Int32Array;
  scores: Float64Array;
}

/** Scored pairs as compressed adjacency lists (both directions). */
function buildAdjacency(n: number, pairs: IndexedPairs): Adjacency {
  const degree = new Int32Array(n + 1);
  for (let k = 0; k < pairs.count; k++) {
    degree[(pairs.left[k] as number) + 1]++;
    degree[(pairs.right[k] as number) + 1]++;
  }
  for (let i = 0; i < n; i++) degree[i + 1] = (degree[i + 1] as number) + (degree[i] as number);
  const offsets = degree;
  const fill = offsets.slice(0, n);
  const neighbours = new Int32Array(pairs.count * 2);
  const scores = new Float64Array(pairs.count * 2);
  for (let k = 0; k < pairs.count; k++) {
    const a = pairs.left[k] as number;
    const b = pairs.right[k] as number;
    const s = pairs.scores[k] as number;
    neighbours[fill[a] as number] = b;
    scores[fill[a] as number] = s;
    fill[a]++;
    neighbours[fill[b] as number] = a;
    scores[fill[b] as number] = s;
    fill[b]++;
  }
  return { offsets, neighbours, scores };
}

function mergeAllowed(
  small: readonly number[],
  bigRoot: number,
  adjacency: Adjacency,
  find: (i: number) => number,
  conflictBelow: number,
  averageAt: number,
): boolean {
  let sum = 0;
  let count = 0;
  for (const x of small) {
    for (let p = adjacency.offsets[x] as number; p < (adjacency.offsets[x + 1] as number); p++) {
      if (find(adjacency.neighbours[p] as number) !== bigRoot) continue;
      const s = adjacency.scores[p] as number;
      if (s === -Infinity || s < conflictBelow) return false;
      sum += s;
      count++;
    }
  }
  return count > 0 && sum / count >= averageAt;
}

/** Rank of each index in the sorted order of its id: the tie-break that makes the result order-independent. */
function idRanks(ids: readonly string[]): Int32Array {
  const order = ids.map((_, i) => i).sort((x, y) => compareIds(ids[x] as string, ids[y] as string));
  const rank = new Int32Array(ids.length);
  order.forEach((i, r) => (rank[i] = r));
  return rank;
}

function compareIds(x: string, y: string): number {
  return x < y ? -1 : x > y ? 1 : 0;
}
