/**
 * The history as undo and replay read it (services/register/history/undo.ts, replay.ts): whole events with their ops,
 * the dependants that block an undo, and copying events into another database.
 */
import { sql, type Selectable } from 'kysely';
import type { HistoryEventTable } from '../types.ts';
import type { Queryable } from './util.ts';

export type HistoryEventRow = Selectable<HistoryEventTable>;

/** Events after `afterId` (up to `untilId` when given), in id order. */
export async function historyPage(db: Queryable, afterId: number, limit: number, untilId?: number): Promise<HistoryEventRow[]> {
  let query = db.selectFrom('history_event').selectAll().where('id', '>', afterId).orderBy('id').limit(limit);
  if (untilId !== undefined) query = query.where('id', '<=', untilId);
  return query.execute();
}

/** Appends an event of another database with its id (a full copy by replay). */
export async function copyHistoryEvent(db: Queryable, event: HistoryEventRow): Promise<void> {
  await db
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

/** One event, locked (an undo holds it so that no second undo of it runs at once). */
export async function eventForUpdate(db: Queryable, eventId: number): Promise<HistoryEventRow | undefined> {
  return db.selectFrom('history_event').selectAll().where('id', '=', eventId).forUpdate().executeTakeFirst();
}

/** The event that undid this one, if any. */
export async function undoOfEvent(db: Queryable, eventId: number): Promise<number | undefined> {
  const row = await db.selectFrom('history_event').select('id').where('undoes_event_id', '=', eventId).executeTakeFirst();
  return row ? Number(row.id) : undefined;
}

/** Later events, not undo events and not undone, that touched any of these counterparties or mentions; newest first. */
export async function laterStandingEvents(
  db: Queryable,
  event: { id: number; counterparty_ids: number[]; mention_ids: number[] },
): Promise<{ id: number; type: string; actor: string; at: string }[]> {
  const result = await sql<{ id: string | number; type: string; actor: string; at: Date }>`
    SELECT h.id, h.type, h.actor, h.at FROM history_event h
    WHERE h.id > ${event.id}
      AND h.type <> 'undone'
      AND (h.counterparty_ids && ${sql.val(event.counterparty_ids)}::bigint[]
           OR h.mention_ids && ${sql.val(event.mention_ids)}::bigint[])
      AND NOT EXISTS (SELECT 1 FROM history_event u WHERE u.undoes_event_id = h.id)
    ORDER BY h.id DESC
    LIMIT 100`.execute(db);
  return result.rows.map((r) => ({ id: Number(r.id), type: r.type, actor: r.actor, at: new Date(r.at).toISOString() }));
}
