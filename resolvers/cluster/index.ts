export { clusterRecords, clusterIndexed, type ClusterOptions, type IndexedPairs, type ScoredEdge } from './clusterRecords.ts';
export { clustersToLabels } from './clustersToLabels.ts';
