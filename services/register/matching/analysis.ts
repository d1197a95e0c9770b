/**
 * The register's one door to name analysis (resolvers/analyse). Analyses are pure, so a bounded in-process cache
 * is safe: it can be dropped at any time and another instance computes the same values. The cache is versioned
 * (ANALYSIS_VERSION is part of its key) and correctness never depends on it.
 *
 * Stored names carry their analysis (migrations/20261205180000_counterparty_name_analysis.ts): candidateAnalysis
 * takes it when it is of the current version and was made under the candidate's jurisdiction, and analyses the
 * name again only otherwise (a stale row, `cpreg migrate reanalyse` rewrites those).
 */
import type { MatchStats } from './match-stats.ts';
import { ANALYSIS_VERSION, analyseName, type NameAnalysis } from '../../../resolvers/analyse/index.ts';

const CACHE_LIMIT = 50_000;
const cache = new Map<string, NameAnalysis>();

export function analyse(text: string, country?: string | null): NameAnalysis {
  const key = `${ANALYSIS_VERSION}\u0000${country ?? ''}\u0000${text}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const analysis = analyseName(text, country ? { country } : undefined);
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value as string);
  cache.set(key, analysis);
  return analysis;
}

/** A name's analysis as the register stores it. */
export interface StoredAnalysis {
  analysis: unknown;
  version: number;
  country: string | null;
}

/** What a stored name's row holds: its analysis under its counterparty's jurisdiction, of the current version. */
export function storedAnalysisOf(name: string, country: string | null): StoredAnalysis {
  return { analysis: analyse(name, country), version: ANALYSIS_VERSION, country };
}

/** The analysis of a candidate's stored name: the stored one when current, else analysed here (counted in `stats`). */
export function candidateAnalysis(name: string, jurisdiction: string | null, stored: StoredAnalysis | null | undefined, stats?: MatchStats): NameAnalysis {
  if (stored && stored.version === ANALYSIS_VERSION && stored.country === jurisdiction && stored.analysis !== null) {
    if (stats) stats.storedAnalyses++;
    return stored.analysis as NameAnalysis;
  }
  if (stats) stats.reanalysed++;
  return analyse(name, jurisdiction);
}
