/**
 * Turns the ops of a ChangeSet into one append-only history event. The payload holds the ops (row images:
 * enough to replay from empty and to undo exactly) beside the event's own details (what a person reads).
 */
import type { HistoryEventType } from '../../../resolvers/vocabulary.ts';
import type { ChangeSet } from '../state/change-set.ts';
import { touchedBy, type Op } from '../state/ops.ts';
import type { ActorInput } from '../context.ts';

export interface EventInput {
  type: HistoryEventType;
  actor: string;
  at: Date;
  reason?: string | null;
  /** What happened, in words and ids (read by people, the change feed and exports). */
  details?: Record<string, unknown>;
  undoesEventId?: number;
  requestId?: string;
}

export interface EventPayload {
  details: Record<string, unknown>;
  ops: Op[];
}

/**
 * The row of an event whose rows are written beside it rather than through a ChangeSet (the bulk loader's COPY,
 * services/register/bulk-load.ts): the columns commitEvent writes, its id drawn by the caller.
 */
export function eventRow(id: number, input: EventInput, ops: Op[]): Record<string, unknown> {
  const { counterpartyIds, mentionIds } = touchedBy(ops);
  const payload: EventPayload = { details: input.details ?? {}, ops };
  return {
    id,
    type: input.type,
    actor: input.actor,
    at: input.at.toISOString(),
    reason: input.reason ?? null,
    payload,
    counterparty_ids: counterpartyIds,
    mention_ids: mentionIds,
    undoes_event_id: input.undoesEventId ?? null,
    request_id: input.requestId ?? null,
  };
}

/**
 * Records the ChangeSet's ops (or `ops`) as one event, written with the buffer at the next flush: the id answered
 * is temporary until then (ChangeSet.realId), unless one was reserved. A writer that answers the id uses
 * `commitWritten`.
 */
export async function commitEvent(cs: ChangeSet, input: EventInput, ops: Op[] = cs.ops): Promise<number> {
  const { counterpartyIds, mentionIds } = touchedBy(ops);
  const id = cs.bufferEvent(
    {
      type: input.type,
      actor: input.actor,
      at: input.at.toISOString(),
      reason: input.reason ?? null,
      payload: { details: input.details ?? {} },
      counterparty_ids: counterpartyIds,
      mention_ids: mentionIds,
      undoes_event_id: input.undoesEventId ?? null,
      request_id: input.requestId ?? null,
    },
    [...ops],
  );
  // Ops already recorded are not recorded twice if the caller commits another event in the same transaction.
  if (ops === cs.ops) cs.ops.length = 0;
  return id;
}

/** commitEvent, then the buffer written: answers the event's real id (a writer whose answer names it). */
export async function commitWritten(cs: ChangeSet, input: EventInput, ops: Op[] = cs.ops): Promise<number> {
  const id = await commitEvent(cs, input, ops);
  await cs.flush();
  return cs.realId(id);
}

/**
 * The event of a change a caller asked for, with the caller's actor and request id: the ChangeSet's ops, `details`
 * for people to read, and the caller's reason unless the change gives its own.
 */
export function commitRequested(
  cs: ChangeSet,
  type: HistoryEventType,
  who: ActorInput,
  at: Date,
  details: Record<string, unknown>,
  reason: string | null | undefined = who.reason,
): Promise<number> {
  return commitWritten(cs, { type, actor: who.actor, at, reason, requestId: who.requestId, details });
}
