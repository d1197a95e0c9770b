export { matchWeight, nonMatchWeight, levelWeight } from './weights.ts';
export { estimateByEm, levelFrequencies, countPatterns, type ComparisonVector, type EmOptions, type EmResult } from './em.ts';
export { estimateFromLabels, type LabelledVector } from './estimate-from-labels.ts';
export { decide, featureWeights, parseMatchModel, type Decision, type FeatureModel, type MatchModel } from './match-model.ts';
export {
  COMMON_TOKEN_SHARE,
  FEATURE_LEVELS,
  FEATURE_NAMES,
  NAME_BANDS,
  expectedNamesWith,
  isInformativeCore,
  levelIndices,
  nameLevel,
  nameLevelOfKind,
  type ComparisonLevels,
  type FeatureName,
} from './features.ts';
export {
  capOf,
  clusterRulesOf,
  decidePair,
  decidePairAt,
  holdOf,
  indexedRules,
  linkHeldBackBy,
  ruledScore,
  worthReview,
  worthReviewAt,
  HELD_BACK_MARGIN,
  type Hold,
  type Override,
} from './decision-rules.ts';
export { compareRecords, compareWeighted, qualifierLevel, type Comparison } from './compare-records.ts';
// The per-feature levels of the context features, for the register's cheap score bound (services/register/matching/bound.ts).
export { acronymLevel, jurisdictionLevel, legalFormLevel } from './context-levels.ts';
export { scorePair, scoreComparison, explainLevels, levelVector, type PairScore, type FeatureExplanation, type ScoreOptions } from './score-pair.ts';
export { trainModel, type TrainOptions } from './train-model.ts';
export { compareCandidates, comparedVectors, randomPairVectors, scoreCompared, edgesOf, indexedPairsOf, type ComparedPairs } from './compare-candidates.ts';
export { DEFAULT_MATCH_MODEL } from './default-model.ts';
export { groupKeyOf, rankReviewItems, uncertaintyOf, type RankedReviewItem, type ReviewItemFacts, type ReviewThresholds } from './rank-review-items.ts';
export { adjustFromDecisions, type AdjustOptions, type DecidedVector, type LevelShift } from './adjust-from-decisions.ts';
