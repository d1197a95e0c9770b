/** History reads (one event, the events of a counterparty, the change feed in id order) and appending an event. */
import { sql, type Insertable } from 'kysely';
import type { HistoryEventTable } from '../types.ts';
import type { Queryable } from './util.ts';
import { id, idOrNull, iso } from './util.ts';

export interface HistoryEventView {
  id: number;
  type: string;
  actor: string;
  at: string;
  reason: string | null;
  details: Record<string, unknown>;
  counterpartyIds: number[];
  mentionIds: number[];
  undoesEventId: number | null;
  requestId: string | null;
}

function toView(r: Record<string, unknown>): HistoryEventView {
  const payload = (typeof r.payload === 'string' ? JSON.parse(r.payload) : r.payload) as { details?: Record<string, unknown> };
  return {
    id: id(r.id),
    type: r.type as string,
    actor: r.actor as string,
    at: iso(r.at) as string,
    reason: (r.reason as string | null) ?? null,
    details: payload?.details ?? {},
    counterpartyIds: ((r.counterparty_ids as unknown[]) ?? []).map(id),
    mentionIds: ((r.mention_ids as unknown[]) ?? []).map(id),
    undoesEventId: idOrNull(r.undoes_event_id),
    requestId: (r.request_id as string | null) ?? null,
  };
}

export async function getEvent(db: Queryable, eventId: number): Promise<HistoryEventView | undefined> {
  const row = await db.selectFrom('history_event').selectAll().where('id', '=', eventId).executeTakeFirst();
  return row ? toView(row) : undefined;
}

/** Events that touched a counterparty, newest first. */
export async function eventsOfCounterparty(
  db: Queryable,
  counterpartyId: number,
  page: { beforeId?: number; limit?: number } = {},
): Promise<HistoryEventView[]> {
  const result = await sql<Record<string, unknown>>`
    SELECT * FROM history_event
    WHERE counterparty_ids @> ARRAY[${counterpartyId}]::bigint[]
      AND id < ${page.beforeId ?? Number.MAX_SAFE_INTEGER}
    ORDER BY id DESC LIMIT ${page.limit ?? 100}`.execute(db);
  return result.rows.map(toView);
}

/** The change feed: events after a cursor (an event id), oldest first. */
export async function eventsAfter(db: Queryable, afterId: number, limit: number): Promise<HistoryEventView[]> {
  const rows = await db.selectFrom('history_event').selectAll().where('id', '>', afterId).orderBy('id').limit(limit).execute();
  return rows.map(toView);
}

export async function lastEventId(db: Queryable): Promise<number> {
  const row = await db
    .selectFrom('history_event')
    .select((eb) => eb.fn.max('id').as('max'))
    .executeTakeFirst();
  return row?.max === null || row?.max === undefined ? 0 : id(row.max);
}

/** Appends one event; answers its id. */
export async function insertHistoryEvent(db: Queryable, event: Insertable<HistoryEventTable>): Promise<number> {
  const row = await db.insertInto('history_event').values(event).returning('id').executeTakeFirstOrThrow();
  return id(row.id);
}
