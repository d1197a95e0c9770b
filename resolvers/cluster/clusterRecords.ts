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
 * Cost: O(E log E) for the sort plus amortised O(E log V) for merging the per-cluster neighbour tables
 * (smaller table into larger).
 */
export interface ScoredEdge {
  a: string;
  b: string;
  /** Match weight of the pair; +Infinity for a decisive identifier match. */
  score: number;
}

export interface ClusterOptions {
  linkAt: number;
  /** A scored cross pair below this forbids a merge. Default: −Infinity (only averages and cannot-links count). */
  conflictBelow?: number;
  /** Average-linkage floor over scored cross pairs. Default: linkAt. */
  averageAt?: number;
}

interface LinkStats {
  sum: number;
  count: number;
  min: number;
  cannot: boolean;
}

export function clusterRecords(
  ids: readonly string[],
  edges: readonly ScoredEdge[],
  cannotLinks: readonly (readonly [string, string])[],
  options: ClusterOptions,
): string[][] {
  const conflictBelow = options.conflictBelow ?? -Infinity;
  const averageAt = options.averageAt ?? options.linkAt;
  const index = new Map<string, number>();
  for (const id of ids) if (!index.has(id)) index.set(id, index.size);
  const n = index.size;
  const parent = Int32Array.from({ length: n }, (_, i) => i);
  const members: number[][] = Array.from({ length: n }, (_, i) => [i]);
  const links: Map<number, LinkStats>[] = Array.from({ length: n }, () => new Map());
  const find = (i: number): number => {
    let root = i;
    while (parent[root] !== root) root = parent[root] as number;
    while (parent[i] !== root) {
      const next = parent[i] as number;
      parent[i] = root;
      i = next;
    }
    return root;
  };
  const indexOf = (id: string, what: string): number => {
    const at = index.get(id);
    if (at === undefined) throw new Error(`clusterRecords: ${what} names record "${id}", which is not in the id list`);
    return at;
  };

  const unique = dedupeEdges(edges);
  for (const edge of unique) addStats(links, indexOf(edge.a, 'an edge'), indexOf(edge.b, 'an edge'), edge.score, false);
  for (const [a, b] of cannotLinks) {
    const ia = indexOf(a, 'a cannot-link');
    const ib = indexOf(b, 'a cannot-link');
    if (ia !== ib) addStats(links, ia, ib, NaN, true);
  }

  for (const edge of unique) {
    if (!(edge.score >= options.linkAt)) break;
    const ra = find(indexOf(edge.a, 'an edge'));
    const rb = find(indexOf(edge.b, 'an edge'));
    if (ra === rb) continue;
    const stats = links[ra]?.get(rb);
    if (!stats || stats.cannot || stats.min < conflictBelow || stats.sum / stats.count < averageAt) continue;
    const [big, small] = (members[ra] as number[]).length >= (members[rb] as number[]).length ? [ra, rb] : [rb, ra];
    parent[small] = big;
    (members[big] as number[]).push(...(members[small] as number[]));
    members[small] = [];
    mergeLinks(links, big, small);
  }

  const idOf = [...index.keys()];
  const clusters: string[][] = [];
  for (let i = 0; i < n; i++) {
    if (find(i) !== i) continue;
    clusters.push((members[i] as number[]).map((m) => idOf[m] as string).sort(compareIds));
  }
  return clusters.sort((x, y) => compareIds(x[0] as string, y[0] as string));
}

/** One edge per unordered pair (the highest score wins), ordered best first with ids as the tie-break. */
function dedupeEdges(edges: readonly ScoredEdge[]): ScoredEdge[] {
  const best = new Map<string, ScoredEdge>();
  for (const edge of edges) {
    if (edge.a === edge.b) continue;
    const [a, b] = compareIds(edge.a, edge.b) < 0 ? [edge.a, edge.b] : [edge.b, edge.a];
    const key = `${a}\u0000${b}`;
    const seen = best.get(key);
    if (!seen || edge.score > seen.score) best.set(key, { a, b, score: edge.score });
  }
  return [...best.values()].sort((x, y) => y.score - x.score || compareIds(x.a, y.a) || compareIds(x.b, y.b));
}

function addStats(links: Map<number, LinkStats>[], a: number, b: number, score: number, cannot: boolean): void {
  for (const [from, to] of [
    [a, b],
    [b, a],
  ] as const) {
    const table = links[from] as Map<number, LinkStats>;
    const stats = table.get(to) ?? { sum: 0, count: 0, min: Infinity, cannot: false };
    if (cannot) stats.cannot = true;
    else {
      stats.sum += score;
      stats.count += 1;
      stats.min = Math.min(stats.min, score);
    }
    table.set(to, stats);
  }
}

/** Folds the neighbour table of `small` into `big` and repoints every neighbour at `big`. */
function mergeLinks(links: Map<number, LinkStats>[], big: number, small: number): void {
  const bigTable = links[big] as Map<number, LinkStats>;
  const smallTable = links[small] as Map<number, LinkStats>;
  bigTable.delete(small);
  for (const [other, stats] of smallTable) {
    if (other === big) continue;
    const otherTable = links[other] as Map<number, LinkStats>;
    otherTable.delete(small);
    const existing = bigTable.get(other);
    const combined = existing
      ? {
          sum: existing.sum + stats.sum,
          count: existing.count + stats.count,
          min: Math.min(existing.min, stats.min),
          cannot: existing.cannot || stats.cannot,
        }
      : { ...stats };
    bigTable.set(other, combined);
    otherTable.set(big, { ...combined });
  }
  links[small] = new Map();
}

function compareIds(x: string, y: string): number {
  return x < y ? -1 : x > y ? 1 : 0;
}
