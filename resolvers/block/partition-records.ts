/**
 * Splits a batch into partitions that can be resolved independently, in any order, on any number of machines.
 *
 * Batch clustering (resolvers/cluster) joins two records only through a chain of pairs scoring at least linkAt,
 * and every pair it can see is a candidate pair (blocking). So the connected components of the candidate pairs
 * scoring ≥ linkAt are closed: no final cluster spans two of them, and a partition made of whole components
 * clusters exactly as the whole batch would. Components are packed into partitions of about `targetSize` records,
 * in the order of their first record (so the plan depends only on the input).
 *
 * A component larger than `maxComponentSize` (a chain of similar names) is not kept whole: its pairs are joined
 * best first while the part stays under the limit, and the pairs refused are returned as `crossPairs` for a
 * final pass that reconciles the parts (services/jobs). Cost: O(p log p) for p linking pairs, O(n) memory.
 */
import { UnionFind } from '../cluster/index.ts';

export interface PartitionOptions {
  /** Pairs at or above this score can join records (the model's linkAt). */
  linkAt: number;
  /** Records per partition aimed at (a partition holds whole components). */
  targetSize: number;
  /** The largest component kept whole. Default: targetSize. */
  maxComponentSize?: number;
}

export interface PartitionPlan {
  /** For each record, its partition (0 … count-1). */
  partitionOf: Int32Array;
  count: number;
  /** Indices (into the pairs given) of linking pairs whose records fell in different partitions. */
  crossPairs: number[];
  /** Linking pairs refused because joining their parts would outgrow maxComponentSize. */
  refusedJoins: number;
}

export function partitionRecords(
  n: number,
  left: ArrayLike<number>,
  right: ArrayLike<number>,
  score: ArrayLike<number>,
  options: PartitionOptions,
): PartitionPlan {
  if (!(options.targetSize >= 1)) throw new RangeError(`targetSize must be at least 1, got ${options.targetSize}`);
  const maxComponent = options.maxComponentSize ?? options.targetSize;
  const sets = new UnionFind(n);
  const linking: number[] = [];
  for (let k = 0; k < score.length; k++) if (score[k]! >= options.linkAt) linking.push(k);
  linking.sort((a, b) => score[b]! - score[a]! || left[a]! - left[b]! || right[a]! - right[b]!);
  let refusedJoins = 0;
  for (const k of linking) {
    const roots = sets.roots(left[k]!, right[k]!);
    if (!roots) continue;
    if (sets.size(roots[0]) + sets.size(roots[1]) > maxComponent) {
      refusedJoins++;
      continue;
    }
    sets.join(roots[0], roots[1]);
  }
  // Components in the order of their first record; packed next-fit.
  const partitionOfRoot = new Map<number, number>();
  const partitionOf = new Int32Array(n);
  let count = 0;
  let fill = 0;
  for (let i = 0; i < n; i++) {
    const root = sets.find(i);
    let p = partitionOfRoot.get(root);
    if (p === undefined) {
      const s = sets.size(root);
      if (count === 0 || (fill > 0 && fill + s > options.targetSize)) {
        count++;
        fill = 0;
      }
      p = count - 1;
      fill += s;
      partitionOfRoot.set(root, p);
    }
    partitionOf[i] = p;
  }
  const crossPairs = linking.filter((k) => partitionOf[left[k]!] !== partitionOf[right[k]!]).sort((a, b) => a - b);
  return { partitionOf, count, crossPairs, refusedJoins };
}
