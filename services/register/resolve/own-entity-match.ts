/**
 * Whether a mention names one of our own entities: scored against each entity's legal name and every other name
 * declared for it (a trading name, a former name), with a lower bar than a link (an own entity must never become a
 * counterparty).
 */
import type { MatchModel } from '../../../resolvers/score/index.ts';
import { scorePair } from '../../../resolvers/score/index.ts';
import type { Identifier } from '../../../resolvers/vocabulary.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import { listOwnEntities } from '../../../db/queries/own-entities.ts';
import type { OwnEntityOtherName } from '../../../db/tables/register-tables.ts';
import { analyse } from '../matching/analysis.ts';
import { idfFor } from '../matching/idf.ts';
import { probeRecord, type Probe } from '../matching/candidates.ts';
import type { BatchReads } from '../matching/batch-reads.ts';

export interface OwnEntityMatch {
  id: number;
  name: string;
  score: number;
  /** The declared other name it matched on, when not the legal name. */
  via?: OwnEntityOtherName;
}

export async function ownEntityMatch(
  db: Queryable,
  probe: Probe,
  model: MatchModel,
  partyIsOwn: boolean,
  reads: BatchReads | undefined,
): Promise<OwnEntityMatch | undefined> {
  const own = reads ? await reads.ownEntities() : await listOwnEntities(db);
  if (own.length === 0) return undefined;
  const idf = await idfFor(db, probe.analysis.tokens, reads);
  let best: OwnEntityMatch | undefined;
  // Each entity by its legal name and by every other name declared for it (a trading name is as much ours).
  for (const entity of own) {
    for (const other of [undefined, ...entity.otherNames]) {
      const record = {
        id: `own:${entity.id}`,
        analysis: analyse(other?.name ?? entity.name, entity.country),
        ...(entity.country ? { country: entity.country } : {}),
        identifiers: entity.identifiers as Identifier[],
      };
      const pair = scorePair(probeRecord(probe), record, model, idf);
      if (pair.score === -Infinity) continue;
      // Our own entity must never become a counterparty, so the bar is lower than for a link: a linking score, or
      // the same core name with a legal form that does not conflict (a missing country alone keeps an exact name
      // below linkAt), or the contract's own finding that this party is one of ours.
      const level = (feature: string) => pair.explanation.find((e) => e.feature === feature)?.level ?? null;
      const sameName = level('name') === 'exact' && level('legalForm') !== 'conflicting';
      if (pair.score >= model.linkAt || sameName || partyIsOwn) {
        if (!best || pair.score > best.score) best = { id: entity.id, name: entity.name, score: pair.score, ...(other ? { via: other } : {}) };
      }
    }
  }
  return best;
}
