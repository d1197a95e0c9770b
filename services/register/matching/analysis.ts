/**
 * The register's one door to name analysis (resolvers/analyse). Analyses are pure, so a bounded in-process cache
 * is safe: it can be dropped at any time and another instance computes the same values. The cache is versioned
 * (ANALYSIS_VERSION is part of its key) and correctness never depends on it.
 *
 * Stored names carry their analysis in its compact form (resolvers/analyse/compact-analysis.ts,
 * migrations/20261205210000_compact_name_analysis.ts): candidateAnalysis takes a name this process already holds
 * from the cache, rebuilds one it does not from the stored form when that is of the current version and was made
 * under the candidate's jurisdiction, and analyses the name again only otherwise (a stale row, `cpreg migrate
 * reanalyse` rewrites those). A rebuilt analysis is the one analyseName gives, so it goes into the cache too.
 */
import type { MatchStats } from './match-stats.ts';
import { ANALYSIS_VERSION, analyseName, compactAnalysis, rebuildAnalysis, type CompactAnalysis, type NameAnalysis } from '../../../resolvers/analyse/index.ts';

const CACHE_LIMIT = 50_000;
const cache = new Map<string, NameAnalysis>();

/** Empties the cache (tests and benches: what a new process starts with). Nothing else changes. */
export function dropAnalysisCache(): void {
  cache.clear();
}

const cacheKey = (text: string, country: string | null | undefined) => `${ANALYSIS_VERSION}\u0000${country ?? ''}\u0000${text}`;

function remember(key: string, analysis: NameAnalysis): NameAnalysis {
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value as string);
  cache.set(key, analysis);
  return analysis;
}

export function analyse(text: string, country?: string | null): NameAnalysis {
  const key = cacheKey(text, country);
  return cache.get(key) ?? remember(key, analyseName(text, country ? { country } : undefined));
}

/** A name's analysis as the register stores it: its compact form (as read, unchecked: the version says what it is). */
export interface StoredAnalysis {
  analysis: unknown;
  version: number;
  country: string | null;
}

/** What a stored name's row holds: its analysis under its counterparty's jurisdiction, of the current version. */
export function storedAnalysisOf(name: string, country: string | null): StoredAnalysis {
  return { analysis: compactAnalysis(name, country, analyse(name, country)), version: ANALYSIS_VERSION, country };
}

/**
 * The analysis of a candidate's stored name: cached, or rebuilt from the stored one when current, else analysed here
 * (counted in `stats`: scored on the stored analysis, of those rebuilt from it, and analysed again).
 */
export function candidateAnalysis(name: string, jurisdiction: string | null, stored: StoredAnalysis | null | undefined, stats?: MatchStats): NameAnalysis {
  if (stored && stored.version === ANALYSIS_VERSION && stored.country === jurisdiction && stored.analysis !== null) {
    if (stats) stats.storedAnalyses++;
    const key = cacheKey(name, jurisdiction);
    const hit = cache.get(key);
    if (hit) return hit;
    if (stats) stats.rebuilt++;
    return remember(key, rebuildAnalysis(name, jurisdiction, stored.analysis as CompactAnalysis));
  }
  if (stats) stats.reanalysed++;
  return analyse(name, jurisdiction);
}
