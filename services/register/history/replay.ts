/**
 * Replay: rebuilds the register's state tables in an empty (migrated) database from the history of another,
 * applying every event's ops in event order. Undo events carry their inverse ops, so they replay like any other.
 * Derived tables (blocking keys) are rebuilt on the way; identity sequences are moved past the replayed ids. The
 * explanations that row images refer to (db/queries/explanations.ts) are copied first, ids kept.
 */
import { sql, type Kysely } from 'kysely';
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
      let query = source.selectFrom('history_event').selectAll().where('id', '>', after).orderBy('id').limit(pageSize);
      if (options.untilEventId !== undefined) query = query.where('id', '<=', options.untilEventId);
      const page = await query.execute();
      if (page.length === 0) break;
      for (const event of page) {
        const payload = event.payload as unknown as EventPayload;
        for (const op of payload.ops) await applyForward(trx, op, derived);
        if (options.copyEvents) {
          await trx
            .insertInto('history_event')
            .values({
              id: event.id,
              type: event.type,
              actor: event.actor,
              at: event.at,
              reason: event.reason,
              payload: JSON.stringify(event.payload),
              counterparty_ids: event.counterparty_ids.map(Number),
              mention_ids: event.mention_ids.map(Number),
              undoes_event_id: event.undoes_event_id,
              request_id: event.request_id,
            })
            .execute();
        }
        events++;
        after = Number(event.id);
      }
    }
    for (const table of STATE_TABLES) await resetSequence(trx, table);
    if (options.copyEvents) await resetSequence(trx, 'history_event');
  });
  return { events };
}

export async function resetSequence(db: Kysely<Database>, table: string): Promise<void> {
  await sql`SELECT setval(pg_get_serial_sequence(${table}, 'id'), coalesce((SELECT max(id) FROM ${sql.table(table)}), 0) + 1, false)`.execute(db);
}
