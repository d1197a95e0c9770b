/**
 * Adjusted Rand index (Hubert & Arabie 1985): the Rand index corrected for chance, 1 for identical partitions,
 * about 0 for random ones, negative when worse than chance.
 */
import { contingency, pairsOf, type Contingency } from './contingency.ts';

export function adjustedRandIndex(gold: readonly (string | number)[], predicted: readonly (string | number)[]): number {
  return ariFromContingency(contingency(gold, predicted));
}

export function ariFromContingency(table: Contingency): number {
  const total = pairsOf(table.n);
  let index = 0;
  for (const cell of table.cells) index += pairsOf(cell.count);
  const goldSum = table.goldSizes.reduce((sum, size) => sum + pairsOf(size), 0);
  const predSum = table.predictedSizes.reduce((sum, size) => sum + pairsOf(size), 0);
  const expected = total === 0 ? 0 : (goldSum * predSum) / total;
  const maximum = (goldSum + predSum) / 2;
  // Both partitions trivial (all singletons or one cluster each, identically): perfect agreement by convention,
  // as in scikit-learn's special case.
  if (maximum === expected) return 1;
  return (index - expected) / (maximum - expected);
}

/** The unadjusted Rand index: share of item pairs on which both partitions agree (together / apart). */
export function randIndex(gold: readonly (string | number)[], predicted: readonly (string | number)[]): number {
  const table = contingency(gold, predicted);
  const total = pairsOf(table.n);
  if (total === 0) return 1;
  let together = 0;
  for (const cell of table.cells) together += pairsOf(cell.count);
  const goldSum = table.goldSizes.reduce((sum, size) => sum + pairsOf(size), 0);
  const predSum = table.predictedSizes.reduce((sum, size) => sum + pairsOf(size), 0);
  return (total + 2 * together - goldSum - predSum) / total;
}
