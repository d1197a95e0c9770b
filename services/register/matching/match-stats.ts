/**
 * Counts of candidate scoring, for benchmarks and tests: no decision reads them. Passed in by whoever wants them
 * (createRegisterContext's `stats`, or a direct call's own), never kept in module state, so that two registers in
 * one process, or two tests, do not count each other's work.
 */
export interface MatchStats {
  /** Candidate lists built (one per name scored against the register). */
  probes: number;
  /** Candidates fetched into those lists. */
  fetched: number;
  /** Candidates actually scored (the rest could not matter, matching/bound.ts). */
  scored: number;
  /** Candidate names scored on their stored analysis. */
  storedAnalyses: number;
  /** Of those, the names this process did not hold and rebuilt from the stored (compact) analysis. */
  rebuilt: number;
  /** Candidate names analysed again (their stored analysis was stale or missing). */
  reanalysed: number;
}

export function newMatchStats(): MatchStats {
  return { probes: 0, fetched: 0, scored: 0, storedAnalyses: 0, rebuilt: 0, reanalysed: 0 };
}
