/**
 * Undo of one history event.
 *
 * Dependency rule: a later event depends on an earlier one when it touched a counterparty or mention that the
 * earlier one touched (created or changed). Undo is refused while such a later event stands (is not itself
 * undone); the refusal names them, newest first, so that a person can undo those first. Undo events themselves
 * never block: an undo and the event it undid cancel out.
 *
 * The undo applies the inverse of each recorded op in reverse order, after checking that each row is still as the
 * event left it, so the state tables come back exactly as they were before the event. The history grows by one
 * `undone` event whose ops are those inverses (a replay applies them like any other event).
 */
import { eventForUpdate, laterStandingEvents, undoOfEvent } from '../../../db/queries/history-undo-replay.ts';
import type { ActorInput, RegisterContext } from '../context.ts';
import { RegisterError } from '../errors.ts';
import { write, pgErrorCode } from '../transaction.ts';
import { applyInverse, StateDriftError } from '../state/apply.ts';
import type { Op } from '../state/change-set.ts';
import { commitWritten, type EventPayload } from './commit.ts';
import type { Transaction } from 'kysely';
import type { Database } from '../../../db/types.ts';

export interface BlockingEvent {
  id: number;
  type: string;
  actor: string;
  at: string;
}

export interface UndoResult {
  eventId: number;
  undoneEventId: number;
  counterpartyIds: number[];
  mentionIds: number[];
}

/** Later standing events that touched what `eventId` touched. */
export async function blockingEvents(
  db: Transaction<Database> | RegisterContext['db'],
  event: { id: number; counterparty_ids: number[]; mention_ids: number[] },
): Promise<BlockingEvent[]> {
  if (event.counterparty_ids.length === 0 && event.mention_ids.length === 0) return [];
  return laterStandingEvents(db, event);
}

export async function undoEvent(ctx: RegisterContext, eventId: number, who: ActorInput): Promise<UndoResult> {
  return write(ctx, async (cs) => {
    const trx = cs.trx;
    const event = await eventForUpdate(trx, eventId);
    if (!event) throw new RegisterError('NOT_FOUND', `history event ${eventId} does not exist`, { eventId });
    if (event.type === 'undone') {
      throw new RegisterError('NOT_UNDOABLE', `event ${eventId} is itself an undo; make the change again instead`, {
        eventId,
      });
    }
    if (event.type === 'forgotten') {
      throw new RegisterError('NOT_UNDOABLE', `event ${eventId} erased personal data and cannot be undone`, { eventId });
    }
    const already = await undoOfEvent(trx, eventId);
    if (already !== undefined) {
      throw new RegisterError('ALREADY_UNDONE', `event ${eventId} was already undone by event ${already}`, {
        eventId,
        undoneBy: already,
      });
    }
    const cps = (event.counterparty_ids ?? []).map(Number);
    const mentions = (event.mention_ids ?? []).map(Number);
    // Lock what the event touched before looking for dependants, so no new dependant can slip in meanwhile.
    await cs.lock('counterparty', cps);
    await cs.lock('mention', mentions);
    const blockers = await blockingEvents(trx, { id: eventId, counterparty_ids: cps, mention_ids: mentions });
    if (blockers.length > 0) {
      const list = blockers.map((b) => `${b.id} (${b.type})`).join(', ');
      throw new RegisterError('UNDO_BLOCKED', `event ${eventId} cannot be undone while later events that depend on it stand: ${list}; undo those first`, {
        eventId,
        blockingEvents: blockers,
      });
    }
    const payload = event.payload as unknown as EventPayload;
    const inverses: Op[] = [];
    try {
      for (const op of [...payload.ops].reverse()) inverses.push(await applyInverse(trx, op, ctx.derived));
    } catch (error) {
      if (error instanceof StateDriftError) {
        throw new RegisterError('UNDO_BLOCKED', `event ${eventId} cannot be undone: ${error.message}`, { eventId });
      }
      if (pgErrorCode(error) === '23503') {
        throw new RegisterError(
          'UNDO_BLOCKED',
          `event ${eventId} cannot be undone: what it created is still referenced by later changes`,
          { eventId },
          { cause: error },
        );
      }
      throw error;
    }
    const undoId = await commitWritten(
      cs,
      {
        type: 'undone',
        actor: who.actor,
        at: ctx.now(),
        reason: who.reason ?? null,
        requestId: who.requestId,
        undoesEventId: eventId,
        details: { undoes: eventId, undoneType: event.type },
      },
      inverses,
    );
    return { eventId: undoId, undoneEventId: eventId, counterpartyIds: cps, mentionIds: mentions };
  });
}
