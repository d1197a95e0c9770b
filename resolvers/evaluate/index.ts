export { contingency, pairsOf, type Contingency } from './contingency.ts';
export { pairwiseScores, pairwiseFromContingency, type PairwiseScores } from './pairwiseScores.ts';
export { bcubed, bcubedFromContingency } from './bcubed.ts';
export { adjustedRandIndex, ariFromContingency, randIndex } from './adjustedRandIndex.ts';
export { blockingMetrics, type BlockingMetrics } from './blockingMetrics.ts';
export { precisionRecallSvg, type SweepPoint } from './precisionRecallSvg.ts';
export { f1Of, type PrecisionRecall } from './types.ts';
export { blockingByCategory, pairCategory, PAIR_CATEGORIES, type PairCategory, type BlockingReport, type CategoryCompleteness } from './blockingByCategory.ts';
export { pairAgreement, differingPairs, type PairAgreement } from './pairAgreement.ts';
