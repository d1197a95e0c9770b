/**
 * Candidates for one name from the register, scored: blocking keys and identifier holders (both indexed tables),
 * then resolvers/score on every stored name of each candidate (the best name speaks for the counterparty).
 */
import type { NameAnalysis } from '../../../resolvers/analyse/types.ts';
import type { MatchRecord } from '../../../resolvers/block/index.ts';
import { scorePair, type MatchModel, type PairScore } from '../../../resolvers/score/index.ts';
import type { Identifier } from '../../../resolvers/vocabulary.ts';
import { candidateDetails } from '../../../db/queries/blocking-keys.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import { analyse } from './analysis.ts';
import type { BatchReads } from './batch-reads.ts';
import { idfFor } from './idf.ts';
import { keysOfAnalysis } from './keys.ts';

/** How many counterparties are scored at most per name (those sharing the most keys first). */
export const MAX_CANDIDATES = 25;

export interface ScoredCandidate {
  counterpartyId: number;
  canonicalName: string;
  matchedName: string;
  score: number;
  pair: PairScore;
}

export interface Probe {
  analysis: NameAnalysis;
  country?: string | null;
  identifiers: Identifier[];
}

export function probeRecord(probe: Probe): MatchRecord {
  return {
    id: 'probe',
    analysis: probe.analysis,
    ...(probe.country ? { country: probe.country } : {}),
    identifiers: probe.identifiers,
  };
}

/**
 * Scores the register's candidates for `probe`, best first. `exclude`: counterparties this name must not join
 * (cannot-links), which are scored anyway but marked by scorePair as cannot_link (score −∞) so that the
 * explanation says why. `reads`: a batch's shared reads (prefetched candidates, token counts, and the answer for
 * a probe already scored in this batch).
 */
export async function scoredCandidates(
  db: Queryable,
  probe: Probe,
  model: MatchModel,
  exclude: ReadonlySet<number> = new Set(),
  reads?: BatchReads,
): Promise<ScoredCandidate[]> {
  const memoKey = { country: probe.country ?? null, identifiers: probe.identifiers, exclude };
  const memo = reads?.scoredFor<ScoredCandidate[]>(probe.analysis, memoKey);
  if (memo) return memo;
  const out = (await scoreCandidates(db, probe, model, exclude, reads, false)).current;
  reads?.rememberScored(probe.analysis, memoKey, out);
  return out;
}

/**
 * scoredCandidates, and beside it the same candidates scored on their former names only (names of kind `former`,
 * which a contract declared: "formerly X", "f/k/a X"), from the same read. Kept apart, so that a caller always knows
 * a match came through a name the counterparty no longer uses; the current list is exactly scoredCandidates'.
 */
export async function scoredCandidatesWithFormer(
  db: Queryable,
  probe: Probe,
  model: MatchModel,
  exclude: ReadonlySet<number> = new Set(),
  reads?: BatchReads,
): Promise<{ current: ScoredCandidate[]; former: ScoredCandidate[] }> {
  const memoKey = { country: probe.country ?? null, identifiers: probe.identifiers, exclude };
  const both = await scoreCandidates(db, probe, model, exclude, reads, true);
  const memo = reads?.scoredFor<ScoredCandidate[]>(probe.analysis, memoKey);
  if (!memo) reads?.rememberScored(probe.analysis, memoKey, both.current);
  return { current: memo ?? both.current, former: both.former };
}

interface AnalysedCandidate {
  id: number;
  canonicalName: string;
  jurisdiction: string | null;
  names: { name: string; former: boolean; analysis: NameAnalysis }[];
  identifiers: Identifier[];
}

async function scoreCandidates(
  db: Queryable,
  probe: Probe,
  model: MatchModel,
  exclude: ReadonlySet<number>,
  reads: BatchReads | undefined,
  withFormer: boolean,
): Promise<{ current: ScoredCandidate[]; former: ScoredCandidate[] }> {
  const keys = keysOfAnalysis(probe.analysis);
  let details = reads?.detailsFor(keys, probe.identifiers);
  if (!details) {
    details = await candidateDetails(db, keys, probe.identifiers, { limit: MAX_CANDIDATES });
    reads?.rememberDetails(keys, probe.identifiers, details);
  }
  if (details.length === 0) return { current: [], former: [] };
  const analysed: AnalysedCandidate[] = details.map((cp) => ({
    id: cp.counterpartyId,
    canonicalName: cp.canonicalName,
    jurisdiction: cp.jurisdiction,
    names: cp.names
      .filter((n) => withFormer || n.kind !== 'former')
      .map((n) => ({ name: n.name, former: n.kind === 'former', analysis: analyse(n.name, cp.jurisdiction) })),
    identifiers: cp.identifiers.map((i) => ({ scheme: i.scheme, value: i.value, ...(i.label ? { label: i.label } : {}) }) as Identifier),
  }));
  const idf = await idfFor(db, [probe.analysis.tokens, ...analysed.flatMap((a) => a.names.map((n) => n.analysis.tokens))].flat(), reads);
  const record = probeRecord(probe);
  const best = (former: boolean): ScoredCandidate[] => {
    const out: ScoredCandidate[] = [];
    for (const candidate of analysed) {
      let top: { name: string; pair: PairScore } | undefined;
      for (const name of candidate.names) {
        if (name.former !== former) continue;
        const other: MatchRecord = {
          id: `cp:${candidate.id}`,
          analysis: name.analysis,
          ...(candidate.jurisdiction ? { country: candidate.jurisdiction } : {}),
          identifiers: candidate.identifiers,
        };
        const pair = scorePair(record, other, model, idf, { cannotLink: exclude.has(candidate.id) });
        if (!top || pair.score > top.pair.score) top = { name: name.name, pair };
      }
      if (top) out.push({ counterpartyId: candidate.id, canonicalName: candidate.canonicalName, matchedName: top.name, score: top.pair.score, pair: top.pair });
    }
    return out.sort((a, b) => b.score - a.score || a.counterpartyId - b.counterpartyId);
  };
  return { current: best(false), former: withFormer ? best(true) : [] };
}

/** A score fit for JSON (±∞ are not JSON numbers): the explanation says which override decided. */
export function jsonScore(score: number): number {
  if (score === Infinity) return 1e6;
  if (score === -Infinity) return -1e6;
  return Math.round(score * 1e6) / 1e6;
}
