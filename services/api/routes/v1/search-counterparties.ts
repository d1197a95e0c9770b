/** Counterparty search: scored by the match model, then partial-text hits, active counterparties only, with highlight ranges. */
import { analyse } from '../../../register/matching/analysis.ts';
import { currentModel } from '../../../register/matching/model.ts';
import { jsonScore, scoredCandidates } from '../../../register/matching/candidates.ts';
import { getSummaries } from '../../../../db/queries/counterparties.ts';
import { highlightRanges, words } from './highlight.ts';
import { legalFormFamily } from './legal-form.ts';
import { namesLike } from '../../../../db/queries/counterparty-reads.ts';
import type { Kysely } from 'kysely';
import type { Database } from '../../../../db/types.ts';

export const MAX_SEARCH_RESULTS = 50;

export const SEARCH_HIT = {
  type: 'object',
  properties: {
    id: { type: 'integer' },
    canonicalName: { type: 'string' },
    jurisdiction: { type: 'string', nullable: true },
    legalForm: { type: 'string', nullable: true },
    matchedName: { type: 'string' },
    highlight: {
      type: 'array',
      items: { type: 'array', items: { type: 'integer' }, minItems: 2, maxItems: 2 },
      description: '[start, end) UTF-16 offsets in matchedName',
    },
    score: { type: 'number', nullable: true, description: 'match score of the best name, in bits of evidence (null: found by partial text only)' },
    version: { type: 'integer' },
  },
} as const;

/** The best `wanted` hits for `q`: scored candidates first, then names that contain the folded text. */
export async function searchCounterparties(db: Kysely<Database>, q: string, wanted: number) {
  const analysis = analyse(q);
  const { model } = await currentModel(db);
  const scored = await scoredCandidates(db, { analysis, identifiers: [] }, model);
  const seen = new Set(scored.map((s) => s.counterpartyId));
  const folded = words(q)
    .map((w) => w.folded)
    .join(' ');
  const partial = (await namesLike(db, folded, wanted)).filter((p) => !seen.has(p.counterpartyId) && (seen.add(p.counterpartyId), true));
  const summaries = await getSummaries(db, [...scored.map((s) => s.counterpartyId), ...partial.map((p) => p.counterpartyId)]);
  const out = [
    ...scored.map((s) => ({ id: s.counterpartyId, matchedName: s.matchedName, score: jsonScore(s.score) })),
    ...partial.map((p) => ({ id: p.counterpartyId, matchedName: p.name, score: null })),
  ]
    .filter((hit) => summaries.get(hit.id)?.status === 'active')
    .slice(0, wanted)
    .map((hit) => {
      const s = summaries.get(hit.id)!;
      return {
        ...hit,
        canonicalName: s.canonicalName,
        jurisdiction: s.jurisdiction,
        legalForm: legalFormFamily(s.canonicalName),
        highlight: highlightRanges(hit.matchedName, q),
        version: s.version,
      };
    });
  return out;
}
