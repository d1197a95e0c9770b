/**
 * Replay: rebuilds the register's state tables in an empty (migrated) database from the history of another,
 * applying every event's ops in event order. Undo events carry their inverse ops, so they replay like any other.
 * Derived tables (blocking keys) are rebuilt on the way; identity sequences are moved past the replayed ids. The
 * explanations that row images refer to (db/queries/explanations.ts) are copied first, ids kept.
 */
import type { Kysely } from 'kysely';
import { copyHistoryEvent, historyPage } from '../../../db/queries/history-undo-replay.ts';
import { resetSequence } from '../../../db/queries/state-rows.ts';
import type { Database } from '../../../db/types.ts';
import type { DerivedContext } from '../state/derived.ts';
import { applyForward } from '../state/apply.ts';
import { STATE_TABLES } from '../state/tables.ts';
import type { EventPayload } from './commit.ts';
import { copyExplanations, explanationPage } from '../../../db/queries/explanations.ts';

export interface ReplayOptions {
  /** Also copy the history events themselves (the target becomes a full copy). Default false. */
  copyEvents?: boolean;
  /** Events read per page. */
  pageSize?: number;
  /** Replay only events up to this id (inclusive). */
  untilEventId?: number;
}

export async function replayHistory(
  source: Kysely<Database>,
  target: Kysely<Database>,
  derived: DerivedContext,
  options: ReplayOptions = {},
): Promise<{ events: number }> {
  const pageSize = options.pageSize ?? 500;
  let after = 0;
  let events = 0;
  await target.transaction().execute(async (trx) => {
    // Explanations belong to the history (never changed): the row images of mentions and review items refer to them.
    for (let last = 0; ;) {
      const explanations = await explanationPage(source, last, pageSize);
      if (explanations.length === 0) break;
      await copyExplanations(trx, explanations);
      last = explanations[explanations.length - 1]!.id;
    }
    await resetSequence(trx, 'explanation');
    for (;;) {
      const page = await historyPage(source, after, pageSize, options.untilEventId);
      if (page.length === 0) break;
      for (const event of page) {
        const payload = event.payload as unknown as EventPayload;
        for (const op of payload.ops) await applyForward(trx, op, derived);
        if (options.copyEvents) await copyHistoryEvent(trx, event);
        events++;
        after = Number(event.id);
      }
    }
    for (const table of STATE_TABLES) await resetSequence(trx, table);
    if (options.copyEvents) await resetSequence(trx, 'history_event');
  });
  return { events };
}
