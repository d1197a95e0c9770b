/** What ordering the review queue needs of each open item: its sides, score, mention and contracts touched. */
import { composedEvidence } from './explanations.ts';
import { sql } from 'kysely';
import type { ReviewFilter } from './review.ts';
import type { Queryable } from './util.ts';
import { id, idOrNull } from './util.ts';

export interface OpenReviewFacts {
  id: number;
  kind: string;
  score: number | null;
  leftCounterpartyId: number | null;
  rightCounterpartyId: number;
  mention: { text: string; country: string | null; contractId: number | null } | null;
  /** Distinct contracts of the mentions linked to the counterparty or counterparties on the other side. */
  candidateContracts: number;
}

interface FactsRow {
  id: unknown;
  kind: string;
  score: unknown;
  left_counterparty_id: unknown;
  right_counterparty_id: unknown;
  text: string | null;
  country: string | null;
  contract_id: unknown;
  candidate_contracts: unknown;
}

/**
 * Every open review item (narrowed by `only`: a kind, the candidate, a mention, a counterparty on either side, an
 * age) with the facts the queue's order needs, in one statement.
 */
export async function openReviewFacts(db: Queryable, only: Omit<ReviewFilter, 'status'> & { rightCounterpartyId?: number } = {}): Promise<OpenReviewFacts[]> {
  const conditions = [
    ...(only.kind !== undefined ? [sql`r.kind = ${only.kind}`] : []),
    ...(only.rightCounterpartyId !== undefined ? [sql`r.right_counterparty_id = ${only.rightCounterpartyId}`] : []),
    ...(only.mentionId !== undefined ? [sql`r.mention_id = ${only.mentionId}`] : []),
    ...(only.counterpartyId !== undefined ? [sql`(r.right_counterparty_id = ${only.counterpartyId} OR r.left_counterparty_id = ${only.counterpartyId})`] : []),
    ...(only.createdBefore !== undefined ? [sql`r.created_at < ${new Date(only.createdBefore)}`] : []),
    ...(only.createdAfter !== undefined ? [sql`r.created_at >= ${new Date(only.createdAfter)}`] : []),
  ];
  const filter = conditions.length > 0 ? sql`AND ${sql.join(conditions, sql` AND `)}` : sql``;
  const result = await sql<FactsRow>`
    WITH open_item AS (
      SELECT r.id, r.kind, r.score, r.mention_id, r.left_counterparty_id, r.right_counterparty_id
      FROM review_item r WHERE r.status = 'open' ${filter}
    ), side_contracts AS (
      SELECT m.counterparty_id, count(DISTINCT m.contract_id) AS n
      FROM mention m
      WHERE m.contract_id IS NOT NULL AND m.counterparty_id IN (
        SELECT right_counterparty_id FROM open_item
        UNION SELECT left_counterparty_id FROM open_item WHERE left_counterparty_id IS NOT NULL)
      GROUP BY m.counterparty_id
    )
    SELECT o.id, o.kind, o.score, o.left_counterparty_id, o.right_counterparty_id,
      m.text, m.country, m.contract_id,
      coalesce(rc.n, 0) + coalesce(lc.n, 0) AS candidate_contracts
    FROM open_item o
    LEFT JOIN mention m ON m.id = o.mention_id
    LEFT JOIN side_contracts rc ON rc.counterparty_id = o.right_counterparty_id
    LEFT JOIN side_contracts lc ON lc.counterparty_id = o.left_counterparty_id
    ORDER BY o.id`.execute(db);
  return result.rows.map((r) => ({
    id: id(r.id),
    kind: r.kind,
    score: r.score === null || r.score === undefined ? null : Number(r.score),
    leftCounterpartyId: idOrNull(r.left_counterparty_id),
    rightCounterpartyId: id(r.right_counterparty_id),
    mention: r.text === null ? null : { text: r.text, country: r.country, contractId: idOrNull(r.contract_id) },
    candidateContracts: Number(r.candidate_contracts),
  }));
}

/** Open or decided review items by id, in the order given (ids that do not exist are left out). */
export async function reviewItemsByIds(db: Queryable, ids: readonly number[]): Promise<Record<string, unknown>[]> {
  if (ids.length === 0) return [];
  const rows = await db
    .selectFrom('review_item')
    .selectAll()
    .select(composedEvidence('review_item').as('full_evidence'))
    .where('id', 'in', [...ids])
    .execute();
  const byId = new Map(rows.map((r) => [id(r.id), r as Record<string, unknown>]));
  return ids.flatMap((i) => (byId.has(i) ? [byId.get(i)!] : []));
}
