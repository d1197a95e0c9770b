/**
 * Candidates for one name from the register, scored: blocking keys and identifier holders (both indexed tables),
 * then resolvers/score on every stored name of each candidate (the best name speaks for the counterparty).
 */
import type { NameAnalysis } from '../../../resolvers/analyse/types.ts';
import type { MatchRecord } from '../../../resolvers/block/index.ts';
import { scorePair, type MatchModel, type PairScore } from '../../../resolvers/score/index.ts';
import type { Identifier } from '../../../resolvers/vocabulary.ts';
import { candidatesByKeys } from '../../../db/queries/blocking-keys.ts';
import { holdersOf } from '../../../db/queries/identifiers.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import { survivorsOf } from '../../../db/queries/counterparties.ts';
import { analyse } from './analysis.ts';
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
 * explanation says why.
 */
export async function scoredCandidates(
  db: Queryable,
  probe: Probe,
  model: MatchModel,
  exclude: ReadonlySet<number> = new Set(),
): Promise<ScoredCandidate[]> {
  const keys = keysOfAnalysis(probe.analysis);
  const byKeys = await candidatesByKeys(db, keys, { limit: MAX_CANDIDATES });
  const byIdentifier = await holdersOf(db, probe.identifiers);
  const ids = [...new Set([...byIdentifier.map((h) => h.counterpartyId), ...byKeys.map((c) => c.counterpartyId)])];
  if (ids.length === 0) return [];
  // Keys and identifiers only ever belong to active counterparties (a merge moves them), but a row moved by a
  // concurrent merge may still be seen here: follow to the survivor.
  const survivors = await survivorsOf(db, ids);
  const active = [...new Set(ids.map((id) => survivors.get(id) ?? id))];
  const [cps, names, identifiers] = await Promise.all([
    db.selectFrom('counterparty').select(['id', 'canonical_name', 'jurisdiction']).where('id', 'in', active).execute(),
    db.selectFrom('counterparty_name').select(['counterparty_id', 'name', 'kind']).where('counterparty_id', 'in', active).execute(),
    db.selectFrom('counterparty_identifier').select(['counterparty_id', 'scheme', 'value', 'label']).where('counterparty_id', 'in', active).execute(),
  ]);
  const namesBy = groupBy(names, (n) => Number(n.counterparty_id));
  const idsBy = groupBy(identifiers, (i) => Number(i.counterparty_id));
  const analysed = cps.map((cp) => {
    const id = Number(cp.id);
    return {
      id,
      cp,
      names: (namesBy.get(id) ?? []).filter((n) => n.kind !== 'former').map((n) => ({ name: n.name, analysis: analyse(n.name, cp.jurisdiction) })),
      identifiers: (idsBy.get(id) ?? []).map((i) => ({ scheme: i.scheme, value: i.value, ...(i.label ? { label: i.label } : {}) }) as Identifier),
    };
  });
  const idf = await idfFor(db, [probe.analysis.tokens, ...analysed.flatMap((a) => a.names.map((n) => n.analysis.tokens))].flat());
  const record = probeRecord(probe);
  const out: ScoredCandidate[] = [];
  for (const candidate of analysed) {
    let best: { name: string; pair: PairScore } | undefined;
    for (const name of candidate.names) {
      const other: MatchRecord = {
        id: `cp:${candidate.id}`,
        analysis: name.analysis,
        ...(candidate.cp.jurisdiction ? { country: candidate.cp.jurisdiction } : {}),
        identifiers: candidate.identifiers,
      };
      const pair = scorePair(record, other, model, idf, { cannotLink: exclude.has(candidate.id) });
      if (!best || pair.score > best.pair.score) best = { name: name.name, pair };
    }
    if (!best) continue;
    out.push({
      counterpartyId: candidate.id,
      canonicalName: candidate.cp.canonical_name,
      matchedName: best.name,
      score: best.pair.score,
      pair: best.pair,
    });
  }
  return out.sort((a, b) => b.score - a.score || a.counterpartyId - b.counterpartyId);
}

function groupBy<T>(rows: T[], key: (row: T) => number): Map<number, T[]> {
  const out = new Map<number, T[]>();
  for (const row of rows) {
    const k = key(row);
    const list = out.get(k) ?? [];
    list.push(row);
    out.set(k, list);
  }
  return out;
}

/** A score fit for JSON (±∞ are not JSON numbers): the explanation says which override decided. */
export function jsonScore(score: number): number {
  if (score === Infinity) return 1e6;
  if (score === -Infinity) return -1e6;
  return Math.round(score * 1e6) / 1e6;
}
