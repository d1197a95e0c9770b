/**
 * Blocking quality (Christen, Data Matching, 2012, ch. 4): reduction ratio RR = 1 − candidates / all pairs,
 * pairs completeness PC = true pairs among candidates / all true pairs, pairs quality PQ = true pairs among
 * candidates / candidates.
 */
export interface BlockingMetrics {
  records: number;
  candidatePairs: number;
  truePairs: number;
  trueCandidatePairs: number;
  reductionRatio: number;
  pairsCompleteness: number;
  pairsQuality: number;
}

export function blockingMetrics(counts: { records: number; candidatePairs: number; truePairs: number; trueCandidatePairs: number }): BlockingMetrics {
  const all = (counts.records * (counts.records - 1)) / 2;
  return {
    ...counts,
    reductionRatio: all === 0 ? 1 : 1 - counts.candidatePairs / all,
    pairsCompleteness: counts.truePairs === 0 ? 1 : counts.trueCandidatePairs / counts.truePairs,
    pairsQuality: counts.candidatePairs === 0 ? 0 : counts.trueCandidatePairs / counts.candidatePairs,
  };
}
