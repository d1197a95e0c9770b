/** What a resolve answers for one mention, read from its stored row (and the counterparty's canonical name). */
import type { ResolutionStatus } from '../../../resolvers/vocabulary.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import type { Row, StateRow } from '../state/tables.ts';
import { explanationBodies } from '../../../db/queries/explanations.ts';
import { composeEvidence } from '../evidence.ts';
import { canonicalNameOf } from '../../../db/queries/counterparties.ts';
import { newestOpenItemOfMention } from '../../../db/queries/resolve-reads.ts';

export interface ResolveResult {
  mentionId: number;
  source: string;
  externalId: string;
  status: ResolutionStatus;
  counterpartyId: number | null;
  canonicalName: string | null;
  ownEntityId: number | null;
  score: number | null;
  /** Why: summary sentence, per-feature weights, identifier notes, top candidates, thresholds. */
  explanation: Record<string, unknown>;
  reviewItemId: number | null;
  /** True when this exact mention was already stored: nothing was done. */
  alreadyIngested: boolean;
  eventId: number | null;
}

/**
 * The result of a stored mention. A write passes what it knows (the review item it opened, the canonical name it
 * holds, the body of the mention's explanation): nothing is read then; a mention already stored reads them.
 */
export async function resultOf(
  db: Queryable,
  mention: StateRow<'mention'>,
  extra: { alreadyIngested: boolean; eventId: number | null; reviewItemId?: number | null; canonicalName?: string; explanation?: Row | null },
): Promise<ResolveResult> {
  const cpId = mention.counterparty_id ?? null;
  const cp =
    cpId === null
      ? undefined
      : extra.canonicalName !== undefined
        ? { canonical_name: extra.canonicalName }
        : { canonical_name: await canonicalNameOf(db, cpId) };
  let reviewItemId = extra.reviewItemId ?? null;
  if (extra.reviewItemId === undefined && mention.status === 'review') {
    reviewItemId = await newestOpenItemOfMention(db, mention.id);
  }
  const explanationId = mention.explanation_id ?? null;
  const body =
    extra.explanation !== undefined || explanationId === null ? extra.explanation : (await explanationBodies(db, [explanationId])).get(explanationId);
  const evidence = composeEvidence(body, mention.evidence);
  delete evidence.recordedName;
  delete evidence.recordedAliases;
  return {
    mentionId: mention.id,
    source: mention.source,
    externalId: mention.external_id,
    status: mention.status,
    counterpartyId: cpId,
    canonicalName: cp?.canonical_name ?? null,
    ownEntityId: mention.own_entity_id ?? null,
    score: mention.score ?? null,
    explanation: evidence,
    reviewItemId,
    alreadyIngested: extra.alreadyIngested,
    eventId: extra.eventId,
  };
}
