export { clusterRecords, type ClusterOptions, type ScoredEdge } from './clusterRecords.ts';
export { clustersToLabels } from './clustersToLabels.ts';
