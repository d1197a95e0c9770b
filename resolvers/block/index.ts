export { blockingKeys, acronymKeys, PREFIX_KEY_LENGTH, STEM_LENGTH } from './blocking-keys.ts';
export { candidatePairs, type CandidateOptions, type CandidatePairs } from './candidate-pairs.ts';
export type { MatchRecord } from './match-record.ts';
export { nameScript, type NameScript } from './script.ts';
export { partitionRecords, type PartitionOptions, type PartitionPlan } from './partition-records.ts';
