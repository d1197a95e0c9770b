/**
 * What an erasure (services/forget) reads before it rewrites: the mentions and names of the counterparties being
 * erased, their state rows as stored, the history events that touch them, and the mentions that name the person
 * without being linked to them. Rows of the state tables are answered as stored (`SELECT *`); the service turns
 * them into its row images.
 */
import { sql } from 'kysely';
import { id, type Queryable } from './util.ts';
import { containsAnyText } from './contains-any-text.ts';

export async function mentionIdsOfCounterparties(db: Queryable, counterpartyIds: readonly number[]): Promise<number[]> {
  const rows = await db
    .selectFrom('mention')
    .select('id')
    .where('counterparty_id', 'in', [...counterpartyIds])
    .execute();
  return rows.map((r) => id(r.id));
}

/** Every name the counterparties hold, canonical and recorded, each once. */
export async function namesOfCounterparties(db: Queryable, counterpartyIds: readonly number[]): Promise<string[]> {
  const ids = [...counterpartyIds];
  const canonical = await db.selectFrom('counterparty').select('canonical_name').where('id', 'in', ids).execute();
  const recorded = await db.selectFrom('counterparty_name').select('name').where('counterparty_id', 'in', ids).execute();
  return [...new Set([...canonical.map((r) => r.canonical_name), ...recorded.map((r) => r.name)])];
}

/** The stored rows of the counterparties (table `counterparty`) or of what they own (names, identifiers), in id order. */
export async function ownedStateRows(
  db: Queryable,
  table: 'counterparty' | 'counterparty_name' | 'counterparty_identifier',
  counterpartyIds: readonly number[],
): Promise<Record<string, unknown>[]> {
  const column = table === 'counterparty' ? 'id' : 'counterparty_id';
  const result = await sql<
    Record<string, unknown>
  >`SELECT * FROM ${sql.table(table)} WHERE ${sql.ref(column)} IN (${sql.join([...counterpartyIds])}) ORDER BY id`.execute(db);
  return result.rows;
}

/** The stored mention rows with these ids, in id order. */
export async function mentionRowsById(db: Queryable, mentionIds: readonly number[]): Promise<Record<string, unknown>[]> {
  if (mentionIds.length === 0) return [];
  const result = await sql<Record<string, unknown>>`SELECT * FROM mention WHERE id IN (${sql.join([...mentionIds])}) ORDER BY id`.execute(db);
  return result.rows;
}

/** One page (ids above `afterId`, `limit` at most) of the history events naming the counterparties or mentions; payload parsed. */
export async function historyPageTouching(
  db: Queryable,
  counterpartyIds: readonly number[],
  mentionIds: readonly number[],
  afterId: number,
  limit: number,
): Promise<{ id: number; payload: unknown }[]> {
  const page = await db
    .selectFrom('history_event')
    .select(['id', 'payload'])
    .where('id', '>', afterId)
    .where((eb) =>
      eb.or([
        sql<boolean>`counterparty_ids && ${sql.val([...counterpartyIds])}::bigint[]`,
        ...(mentionIds.length > 0 ? [sql<boolean>`mention_ids && ${sql.val([...mentionIds])}::bigint[]`] : []),
      ]),
    )
    .orderBy('id')
    .limit(limit)
    .execute();
  return page.map((e) => ({ id: id(e.id), payload: typeof e.payload === 'string' ? JSON.parse(e.payload) : e.payload }));
}

/** Mentions of open review items that point at the counterparties, unless linked to someone else. */
export async function openReviewMentionsOf(db: Queryable, counterpartyIds: readonly number[]): Promise<number[]> {
  const ids = [...counterpartyIds];
  const rows = await db
    .selectFrom('review_item')
    .innerJoin('mention', 'mention.id', 'review_item.mention_id')
    .select('mention.id')
    .where('review_item.status', '=', 'open')
    .where((eb) => eb.or([eb('review_item.right_counterparty_id', 'in', ids), eb('review_item.left_counterparty_id', 'in', ids)]))
    .where((eb) => eb.or([eb('mention.counterparty_id', 'is', null), eb('mention.counterparty_id', 'in', ids)]))
    .execute();
  return rows.map((r) => id(r.id));
}

/** Mentions linked to nothing (no counterparty, no own entity) whose lower-cased text holds one of `fragments`. */
export async function unlinkedMentionsContaining(db: Queryable, fragments: readonly string[]): Promise<{ id: number; text: string }[]> {
  if (fragments.length === 0) return [];
  const rows = await db
    .selectFrom('mention')
    .select(['id', 'text'])
    .where('counterparty_id', 'is', null)
    .where('own_entity_id', 'is', null)
    .where(containsAnyText(sql`lower(text)`, fragments))
    .execute();
  return rows.map((r) => ({ id: id(r.id), text: r.text }));
}
