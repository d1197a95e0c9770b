/**
 * B-cubed precision and recall (Bagga & Baldwin 1998): per item, the share of its predicted cluster that is
 * in its gold cluster (precision) and the share of its gold cluster that is in its predicted cluster (recall),
 * averaged over items with equal weight. From the contingency table: P = Σ n_ij² / b_j / N, R = Σ n_ij² / a_i / N.
 */
import { contingency, type Contingency } from './contingency.ts';
import { f1Of, type PrecisionRecall } from './types.ts';

export function bcubed(gold: readonly (string | number)[], predicted: readonly (string | number)[]): PrecisionRecall {
  return bcubedFromContingency(contingency(gold, predicted));
}

export function bcubedFromContingency(table: Contingency): PrecisionRecall {
  if (table.n === 0) return { precision: 1, recall: 1, f1: 1 };
  let precisionSum = 0;
  let recallSum = 0;
  for (const cell of table.cells) {
    const squared = cell.count * cell.count;
    precisionSum += squared / (table.predictedSizes[cell.predicted] as number);
    recallSum += squared / (table.goldSizes[cell.gold] as number);
  }
  const precision = precisionSum / table.n;
  const recall = recallSum / table.n;
  return { precision, recall, f1: f1Of(precision, recall) };
}
