/** The Jaro–Winkler baselines an evaluation compares cpreg with: over our candidate pairs, and over all pairs. */
import type { candidatePairs, MatchRecord } from '../../resolvers/block/index.ts';
import { jaroWinkler } from '../../resolvers/compare/index.ts';

/** The plain Jaro–Winkler baseline's threshold on the whole normalised name (issue 5). */
export const JW_BASELINE_THRESHOLD = 0.9;

/** JW ≥ 0.9 on the whole normalised name over the given candidate pairs; clusters = connected components. */
export function jwOverCandidates(records: readonly MatchRecord[], pairs: ReturnType<typeof candidatePairs>): string[] {
  const components = unionFind(records.length);
  for (let k = 0; k < pairs.count; k++) {
    const i = pairs.left[k] as number;
    const j = pairs.right[k] as number;
    if (jaroWinkler(records[i]!.analysis.normalised, records[j]!.analysis.normalised) >= JW_BASELINE_THRESHOLD) components.union(i, j);
  }
  return records.map((_, i) => `c${components.find(i)}`);
}

/** Connected components over n items (path halving): the baselines' clustering. */
function unionFind(n: number): { find: (i: number) => number; union: (i: number, j: number) => void } {
  const parent = Int32Array.from({ length: n }, (_, i) => i);
  const find = (i: number): number => {
    while (parent[i] !== i) {
      parent[i] = parent[parent[i] as number] as number;
      i = parent[i] as number;
    }
    return i;
  };
  return {
    find,
    union: (i, j) => {
      const ri = find(i);
      const rj = find(j);
      if (ri !== rj) parent[ri] = rj;
    },
  };
}

/**
 * The plain Jaro–Winkler baseline: every pair of rows compared on the whole normalised name, linked at
 * JW ≥ 0.9, clusters = connected components. All pairs (no blocking), so its recall is not limited by ours.
 * Pairs whose lengths differ too much for JW to reach 0.9 are skipped without changing the result:
 * JW ≤ J + 0.4(1 − J) and J ≤ (2 + short/long) / 3, so JW ≥ 0.9 needs short/long ≥ 0.5.
 */
export function jwComponents(records: readonly MatchRecord[]): { labels: string[]; comparisons: number } {
  const names = records.map((r) => r.analysis.normalised);
  const order = names.map((_, i) => i).sort((x, y) => (names[x] as string).length - (names[y] as string).length);
  const components = unionFind(names.length);
  let comparisons = 0;
  for (let x = 0; x < order.length; x++) {
    const i = order[x] as number;
    const a = names[i] as string;
    for (let y = x + 1; y < order.length; y++) {
      const j = order[y] as number;
      const b = names[j] as string;
      if (a.length < 0.5 * b.length) break;
      comparisons++;
      if (jaroWinkler(a, b) >= JW_BASELINE_THRESHOLD) components.union(i, j);
    }
  }
  return { labels: names.map((_, i) => `c${components.find(i)}`), comparisons };
}
