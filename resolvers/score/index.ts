export { matchWeight, nonMatchWeight, levelWeight } from './weights.ts';
export { estimateByEm, levelFrequencies, countPatterns, type ComparisonVector, type EmOptions, type EmResult } from './em.ts';
export { estimateFromLabels, type LabelledVector } from './estimateFromLabels.ts';
export { decide, featureWeights, parseMatchModel, type Decision, type FeatureModel, type MatchModel } from './matchModel.ts';
export { FEATURE_LEVELS, FEATURE_NAMES, NAME_BANDS, levelIndices, nameLevel, type ComparisonLevels, type FeatureName } from './features.ts';
export { compareRecords, type Comparison } from './compareRecords.ts';
export { scorePair, scoreComparison, explainLevels, levelVector, type PairScore, type FeatureExplanation, type ScoreOptions } from './scorePair.ts';
export { trainModel, type TrainOptions } from './trainModel.ts';
export { compareCandidates, comparedVectors, randomPairVectors, scoreCompared, edgesOf, type ComparedPairs } from './compareCandidates.ts';
