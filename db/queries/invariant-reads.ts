/**
 * The reads behind the register's invariant checks (services/verify/invariants.ts): each answers the rows a check
 * judges, in a stable order. Read-only; verify runs them in one REPEATABLE READ transaction.
 */
import { sql } from 'kysely';
import type { CounterpartyName } from '../types.ts';
import { id, idOrNull, type Queryable } from './util.ts';

/** Linked or new mentions without an active counterparty (none, a missing one, or one not active). */
export async function mentionsOffActiveCounterparty(
  db: Queryable,
): Promise<{ id: number; status: string; counterparty_id: number | null; cp_status: string | null }[]> {
  const result = await sql<{ id: number; status: string; counterparty_id: number | null; cp_status: string | null }>`
    SELECT m.id, m.status, m.counterparty_id, c.status AS cp_status
    FROM mention m LEFT JOIN counterparty c ON c.id = m.counterparty_id
    WHERE m.status IN ('linked', 'new') AND (m.counterparty_id IS NULL OR c.id IS NULL OR c.status <> 'active')
    ORDER BY m.id`.execute(db);
  return result.rows.map((r) => ({ ...r, id: id(r.id), counterparty_id: idOrNull(r.counterparty_id) }));
}

/** Names, identifiers and mentions still owned by a merged counterparty. */
export async function rowsOwnedByMerged(db: Queryable): Promise<{ what: 'name' | 'identifier' | 'mention'; id: number; counterparty_id: number }[]> {
  const result = await sql<{ what: 'name' | 'identifier' | 'mention'; id: number; counterparty_id: number }>`
    SELECT 'name' AS what, n.id, n.counterparty_id FROM counterparty_name n JOIN counterparty c ON c.id = n.counterparty_id WHERE c.status = 'merged'
    UNION ALL
    SELECT 'identifier', i.id, i.counterparty_id FROM counterparty_identifier i JOIN counterparty c ON c.id = i.counterparty_id WHERE c.status = 'merged'
    UNION ALL
    SELECT 'mention', m.id, m.counterparty_id FROM mention m JOIN counterparty c ON c.id = m.counterparty_id WHERE c.status = 'merged'
    ORDER BY 3, 1, 2`.execute(db);
  return result.rows.map((r) => ({ what: r.what, id: id(r.id), counterparty_id: id(r.counterparty_id) }));
}

/** Every counterparty's status and redirect; `mergedOnly` narrows to merged ones. */
export async function counterpartyRedirects(
  db: Queryable,
  options: { mergedOnly?: boolean } = {},
): Promise<{ id: number; status: string; mergedInto: number | null }[]> {
  let query = db.selectFrom('counterparty').select(['id', 'status', 'merged_into']);
  if (options.mergedOnly) query = query.where('status', '=', 'merged');
  const rows = await query.execute();
  return rows.map((r) => ({ id: id(r.id), status: r.status, mergedInto: idOrNull(r.merged_into) }));
}

/** Strong identifiers (flagged strong, or of one of `strongSchemes`) held by more than one active counterparty. */
export async function sharedStrongIdentifiers(db: Queryable, strongSchemes: Iterable<string>): Promise<{ scheme: string; value: string; ids: number[] }[]> {
  const result = await sql<{ scheme: string; value: string; ids: number[] }>`
    SELECT i.scheme, i.value, array_agg(DISTINCT i.counterparty_id ORDER BY i.counterparty_id) AS ids
    FROM counterparty_identifier i JOIN counterparty c ON c.id = i.counterparty_id
    WHERE c.status = 'active' AND (i.strong OR i.scheme IN (${sql.join([...strongSchemes])}))
    GROUP BY i.scheme, i.value HAVING count(DISTINCT i.counterparty_id) > 1
    ORDER BY 1, 2`.execute(db);
  return result.rows.map((r) => ({ scheme: r.scheme, value: r.value, ids: r.ids.map(Number) }));
}

export interface DecidedReviewFacts {
  id: number;
  kind: string;
  decision: string | null;
  decided_by: string | null;
  decided_at: unknown;
  left_counterparty_id: number | null;
  right_counterparty_id: number;
  /** Labelled pairs, review_decided events and cannot-links recorded for the item. */
  pairs: number;
  events: number;
  cannot_links: number;
}

/** Decided review items with how many labelled pairs, review_decided events and cannot-links record each. */
export async function decidedReviewFacts(db: Queryable): Promise<DecidedReviewFacts[]> {
  const result = await sql<DecidedReviewFacts>`
    SELECT r.id, r.kind, r.decision, r.decided_by, r.decided_at, r.left_counterparty_id, r.right_counterparty_id,
      (SELECT count(*) FROM labelled_pair p WHERE p.review_item_id = r.id)::int AS pairs,
      (SELECT count(*) FROM history_event e WHERE e.type = 'review_decided' AND e.payload->'details'->>'reviewItemId' = r.id::text)::int AS events,
      (SELECT count(*) FROM cannot_link l WHERE l.review_item_id = r.id)::int AS cannot_links
    FROM review_item r WHERE r.status = 'decided' ORDER BY r.id`.execute(db);
  return result.rows.map((r) => ({
    ...r,
    id: id(r.id),
    left_counterparty_id: idOrNull(r.left_counterparty_id),
    right_counterparty_id: id(r.right_counterparty_id),
  }));
}

/** Finished ingest runs with their stored counts (parsed), in id order. */
export async function finishedIngestRunCounts(db: Queryable): Promise<{ id: number; counts: Record<string, number> }[]> {
  const runs = await db.selectFrom('ingest_run').select(['id', 'counts']).where('status', '=', 'finished').orderBy('id').execute();
  return runs.map((r) => ({ id: id(r.id), counts: (typeof r.counts === 'string' ? JSON.parse(r.counts) : r.counts) as Record<string, number> }));
}

/** A name of a counterparty (its columns as in db/types.ts) with the counterparty's current canonical name. */
export type CanonicalNameCandidateRow = Pick<CounterpartyName, 'id' | 'counterparty_id' | 'name' | 'kind' | 'legal_form' | 'seen_count' | 'confirmed_by'> & {
  canonical_name: string;
};

/**
 * The names of active counterparties whose canonical name the rules still choose: none locked by a person, none
 * pseudonymised by an erasure. In counterparty, then name id order.
 */
export async function canonicalNameCandidates(db: Queryable): Promise<CanonicalNameCandidateRow[]> {
  const result = await sql<CanonicalNameCandidateRow>`
    SELECT c.id AS counterparty_id, c.canonical_name, n.id, n.name, n.kind, n.legal_form, n.seen_count, n.confirmed_by
    FROM counterparty c JOIN counterparty_name n ON n.counterparty_id = c.id
    WHERE c.status = 'active' AND c.name_locked_by IS NULL
      -- An erasure rewrote the names with pseudonyms ("Forgotten Person X", "… X 2"): the rules are not applied to them.
      AND NOT EXISTS (SELECT 1 FROM history_event e WHERE e.type = 'forgotten' AND e.payload->'details'->>'counterpartyId' = c.id::text)
    ORDER BY c.id, n.id`.execute(db);
  return result.rows.map((r) => ({ ...r, counterparty_id: id(r.counterparty_id), id: id(r.id), seen_count: Number(r.seen_count) }));
}

/** The number of rows of one of the tables verify reports on. */
export async function countRows(db: Queryable, table: 'counterparty' | 'mention' | 'history_event'): Promise<number> {
  const row = await db
    .selectFrom(table)
    .select((eb) => eb.fn.countAll<number>().as('n'))
    .executeTakeFirstOrThrow();
  return Number(row.n);
}
