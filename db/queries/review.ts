/** Review items and cannot-links. */
import { sql } from 'kysely';
import { composedEvidence } from './explanations.ts';
import type { Queryable } from './util.ts';
import { id, idOrNull, iso } from './util.ts';

export interface ReviewItemView {
  id: number;
  kind: string;
  mentionId: number | null;
  leftCounterpartyId: number | null;
  rightCounterpartyId: number;
  score: number | null;
  evidence: Record<string, unknown>;
  status: string;
  decision: string | null;
  decidedBy: string | null;
  decidedAt: string | null;
  reason: string | null;
  createdAt: string;
}

export function toReviewView(r: Record<string, unknown>): ReviewItemView {
  return {
    id: id(r.id),
    kind: r.kind as string,
    mentionId: idOrNull(r.mention_id),
    leftCounterpartyId: idOrNull(r.left_counterparty_id),
    rightCounterpartyId: id(r.right_counterparty_id),
    score: r.score === null || r.score === undefined ? null : Number(r.score),
    evidence: (r.full_evidence as Record<string, unknown>) ?? {},
    status: r.status as string,
    decision: (r.decision as string | null) ?? null,
    decidedBy: (r.decided_by as string | null) ?? null,
    decidedAt: iso(r.decided_at),
    reason: (r.reason as string | null) ?? null,
    createdAt: iso(r.created_at) as string,
  };
}

/** Which review items a list shows. Every field narrows; none given: the open items. */
export interface ReviewFilter {
  /** Default 'open'. */
  status?: 'open' | 'decided' | 'obsolete';
  kind?: 'mention_link' | 'duplicate' | 'affiliate';
  mentionId?: number;
  /** Items with this counterparty on either side. */
  counterpartyId?: number;
  /** ISO 8601 instants: items raised before / at or after them. */
  createdBefore?: string;
  createdAfter?: string;
}

/** Review items matching `filter`, in id order after `afterId`. */
export async function listReviewItemsWhere(
  db: Queryable,
  filter: ReviewFilter = {},
  page: { afterId?: number; limit?: number } = {},
): Promise<ReviewItemView[]> {
  let query = db
    .selectFrom('review_item')
    .selectAll()
    .select(composedEvidence('review_item').as('full_evidence'))
    .where('status', '=', filter.status ?? 'open')
    .where('id', '>', page.afterId ?? 0);
  if (filter.kind !== undefined) query = query.where('kind', '=', filter.kind);
  if (filter.mentionId !== undefined) query = query.where('mention_id', '=', filter.mentionId);
  if (filter.counterpartyId !== undefined) {
    const cp = filter.counterpartyId;
    query = query.where((eb) => eb.or([eb('right_counterparty_id', '=', cp), eb('left_counterparty_id', '=', cp)]));
  }
  if (filter.createdBefore !== undefined) query = query.where('created_at', '<', new Date(filter.createdBefore));
  if (filter.createdAfter !== undefined) query = query.where('created_at', '>=', new Date(filter.createdAfter));
  const rows = await query
    .orderBy('id')
    .limit(page.limit ?? 100)
    .execute();
  return rows.map(toReviewView);
}

export async function listOpenReviewItems(db: Queryable, page: { afterId?: number; limit?: number } = {}): Promise<ReviewItemView[]> {
  return listReviewItemsWhere(db, {}, page);
}

export async function getReviewItem(db: Queryable, reviewItemId: number): Promise<ReviewItemView | undefined> {
  const row = await db
    .selectFrom('review_item')
    .selectAll()
    .select(composedEvidence('review_item').as('full_evidence'))
    .where('id', '=', reviewItemId)
    .executeTakeFirst();
  return row ? toReviewView(row) : undefined;
}

/** The open review item about one mention, if any. */
export async function openItemOfMention(db: Queryable, mentionId: number): Promise<number | undefined> {
  const row = await db.selectFrom('review_item').select('id').where('status', '=', 'open').where('mention_id', '=', mentionId).orderBy('id').executeTakeFirst();
  return row ? id(row.id) : undefined;
}

/** Open review items about one pair of counterparties (either order) or one mention and a counterparty. */
export async function openItemFor(db: Queryable, pair: { mentionId?: number; left?: number; right: number }): Promise<number | undefined> {
  const result =
    pair.mentionId !== undefined
      ? await sql<{ id: string | number }>`SELECT id FROM review_item WHERE status = 'open' AND mention_id = ${pair.mentionId} LIMIT 1`.execute(db)
      : await sql<{ id: string | number }>`SELECT id FROM review_item WHERE status = 'open' AND mention_id IS NULL
        AND ((left_counterparty_id = ${pair.left!} AND right_counterparty_id = ${pair.right})
          OR (left_counterparty_id = ${pair.right} AND right_counterparty_id = ${pair.left!})) LIMIT 1`.execute(db);
  return result.rows[0] ? id(result.rows[0].id) : undefined;
}

/**
 * Cannot-links touching the given counterparties, as raw pairs (ids as recorded; the caller maps merged ids to
 * their survivors). `mentionId` adds the mention-level cannot-links of that mention.
 */
export async function cannotLinksOf(
  db: Queryable,
  counterpartyIds: number[],
  mentionId?: number,
): Promise<{ counterpartyId: number; otherCounterpartyId: number | null; mentionId: number | null }[]> {
  if (counterpartyIds.length === 0 && mentionId === undefined) return [];
  const rows = await db
    .selectFrom('cannot_link')
    .select(['counterparty_id', 'other_counterparty_id', 'mention_id'])
    .where((eb) => {
      const ors = [];
      if (counterpartyIds.length > 0) {
        ors.push(eb('counterparty_id', 'in', counterpartyIds));
        ors.push(eb('other_counterparty_id', 'in', counterpartyIds));
      }
      if (mentionId !== undefined) ors.push(eb('mention_id', '=', mentionId));
      return eb.or(ors);
    })
    .execute();
  return rows.map((r) => ({
    counterpartyId: id(r.counterparty_id),
    otherCounterpartyId: idOrNull(r.other_counterparty_id),
    mentionId: idOrNull(r.mention_id),
  }));
}

export async function labelledPairs(
  db: Queryable,
  limit = 10_000,
): Promise<{ leftText: string; rightText: string; label: string; features: Record<string, unknown> }[]> {
  const rows = await db.selectFrom('labelled_pair').selectAll().orderBy('id').limit(limit).execute();
  return rows.map((r) => ({ leftText: r.left_text, rightText: r.right_text, label: r.label, features: r.features }));
}

export async function countOpenReviewItems(db: Queryable): Promise<number> {
  const row = await db
    .selectFrom('review_item')
    .select((eb) => eb.fn.countAll<string>().as('n'))
    .where('status', '=', 'open')
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

/** The open review items between two counterparties (either order; not about a mention). */
export async function openItemsBetween(db: Queryable, a: number, b: number): Promise<number[]> {
  const rows = await db
    .selectFrom('review_item')
    .select('id')
    .where('status', '=', 'open')
    .where('mention_id', 'is', null)
    .where((eb) =>
      eb.or([
        eb.and([eb('left_counterparty_id', '=', a), eb('right_counterparty_id', '=', b)]),
        eb.and([eb('left_counterparty_id', '=', b), eb('right_counterparty_id', '=', a)]),
      ]),
    )
    .execute();
  return rows.map((r) => id(r.id));
}

/** Every open review item about one mention. */
export async function openItemsOfMention(db: Queryable, mentionId: number): Promise<number[]> {
  const rows = await db.selectFrom('review_item').select('id').where('mention_id', '=', mentionId).where('status', '=', 'open').execute();
  return rows.map((r) => id(r.id));
}

/** True when a pair of counterparties (either order) already has an item, open or decided: a sweep files it once. */
export async function pairHasItem(db: Queryable, left: number, right: number): Promise<boolean> {
  const existing = await sql<{ id: string | number }>`
      SELECT id FROM review_item WHERE mention_id IS NULL AND status IN ('open', 'decided')
        AND ((left_counterparty_id = ${left} AND right_counterparty_id = ${right})
          OR (left_counterparty_id = ${right} AND right_counterparty_id = ${left})) LIMIT 1`.execute(db);
  return existing.rows.length > 0;
}
