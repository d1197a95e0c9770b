export { clusterRecords, clusterIndexed, type ClusterOptions, type IndexedPairs, type ScoredEdge } from './cluster-records.ts';
export { clustersToLabels } from './clusters-to-labels.ts';
export { UnionFind } from './union-find.ts';
