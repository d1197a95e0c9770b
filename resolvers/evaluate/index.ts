export { contingency, pairsOf, type Contingency } from './contingency.ts';
export { pairwiseScores, pairwiseFromContingency, type PairwiseScores } from './pairwise-scores.ts';
export { bcubed, bcubedFromContingency } from './bcubed.ts';
export { adjustedRandIndex, ariFromContingency, randIndex } from './adjusted-rand-index.ts';
export { blockingMetrics, type BlockingMetrics } from './blocking-metrics.ts';
export { precisionRecallSvg, type SweepPoint } from './precision-recall-svg.ts';
export { f1Of, type PrecisionRecall } from './types.ts';
export {
  blockingByCategory,
  pairCategory,
  PAIR_CATEGORIES,
  type PairCategory,
  type BlockingReport,
  type CategoryCompleteness,
} from './blocking-by-category.ts';
export { pairAgreement, differingPairs, type PairAgreement } from './pair-agreement.ts';
