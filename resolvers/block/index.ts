export { blockingKeys, acronymKeys, PREFIX_KEY_LENGTH } from './blockingKeys.ts';
export { candidatePairs, type CandidateOptions, type CandidatePairs } from './candidatePairs.ts';
export type { MatchRecord } from './matchRecord.ts';
export { nameScript, type NameScript } from './script.ts';
export { partitionRecords, type PartitionOptions, type PartitionPlan } from './partitionRecords.ts';
