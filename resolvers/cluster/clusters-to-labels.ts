/** Turns clusters into one label per record id (the first member's id), for the evaluation metrics. */
export function clustersToLabels(clusters: readonly (readonly string[])[]): Map<string, string> {
  const labels = new Map<string, string>();
  for (const cluster of clusters) {
    const label = cluster[0];
    if (label === undefined) continue;
    for (const id of cluster) labels.set(id, label);
  }
  return labels;
}
