/** History reads for callers: a counterparty's events, the change feed, one event. */
import type { RegisterContext } from '../context.ts';
import { eventsAfter, eventsOfCounterparty, getEvent, type HistoryEventView } from '../../../db/queries/history.ts';

export function counterpartyHistory(
  ctx: RegisterContext,
  counterpartyId: number,
  page: { beforeId?: number; limit?: number } = {},
): Promise<HistoryEventView[]> {
  return eventsOfCounterparty(ctx.db, counterpartyId, page);
}

/** Every event after `cursor` (an event id; 0 from the start), oldest first; `nextCursor` continues. */
export async function changeFeed(ctx: RegisterContext, cursor: number, limit = 100): Promise<{ events: HistoryEventView[]; nextCursor: number }> {
  const events = await eventsAfter(ctx.db, cursor, Math.min(Math.max(limit, 1), 1000));
  return { events, nextCursor: events.length > 0 ? events[events.length - 1]!.id : cursor };
}

export function historyEvent(ctx: RegisterContext, eventId: number): Promise<HistoryEventView | undefined> {
  return getEvent(ctx.db, eventId);
}
