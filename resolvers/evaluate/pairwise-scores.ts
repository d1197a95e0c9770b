/**
 * Pairwise precision / recall / F1: every pair of items placed together is one decision.
 * Counted from the contingency table (sum of C(n,2) per cell), never by enumerating pairs.
 */
import { contingency, pairsOf, type Contingency } from './contingency.ts';
import { f1Of, type PrecisionRecall } from './types.ts';

export interface PairwiseScores extends PrecisionRecall {
  truePositivePairs: number;
  predictedPairs: number;
  goldPairs: number;
}

/**
 * Convention for empty denominators: with no predicted pair, precision is 1 (no wrong link was made);
 * with no gold pair, recall is 1 (nothing was missed). The raw counts are returned so callers can tell.
 */
export function pairwiseScores(gold: readonly (string | number)[], predicted: readonly (string | number)[]): PairwiseScores {
  return pairwiseFromContingency(contingency(gold, predicted));
}

export function pairwiseFromContingency(table: Contingency): PairwiseScores {
  let truePositivePairs = 0;
  for (const cell of table.cells) truePositivePairs += pairsOf(cell.count);
  const predictedPairs = table.predictedSizes.reduce((sum, size) => sum + pairsOf(size), 0);
  const goldPairs = table.goldSizes.reduce((sum, size) => sum + pairsOf(size), 0);
  const precision = predictedPairs === 0 ? 1 : truePositivePairs / predictedPairs;
  const recall = goldPairs === 0 ? 1 : truePositivePairs / goldPairs;
  return { precision, recall, f1: f1Of(precision, recall), truePositivePairs, predictedPairs, goldPairs };
}
