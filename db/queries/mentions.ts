/** Mentions: by id, by counterparty, pending a contract, open for re-resolution (by (source, externalId): mentions-by-ref.ts). */
import { sql, type Selectable } from 'kysely';
import type { MentionTable } from '../types.ts';
import type { Queryable } from './util.ts';
import { composedEvidence } from './explanations.ts';
import { id, idOrNull, iso } from './util.ts';

export interface MentionView {
  id: number;
  source: string;
  externalId: string;
  text: string;
  contract: { source: string; externalId: string } | null;
  contractId: number | null;
  role: string | null;
  country: string | null;
  address: string | null;
  identifiers: { scheme: string; value: string; label?: string }[];
  status: string;
  counterpartyId: number | null;
  ownEntityId: number | null;
  score: number | null;
  evidence: Record<string, unknown>;
  confirmedBy: string | null;
  createdAt: string;
  updatedAt: string;
}

/** A mention row with the evidence a person reads (its explanation's body with its own keys over it). */
export type MentionRowWithEvidence = Selectable<MentionTable> & { full_evidence: Record<string, unknown> };

export function toMentionView(r: MentionRowWithEvidence): MentionView {
  return {
    id: id(r.id),
    source: r.source,
    externalId: r.external_id,
    text: r.text,
    contract: r.contract_source !== null && r.contract_external_id !== null ? { source: r.contract_source, externalId: r.contract_external_id } : null,
    contractId: idOrNull(r.contract_id),
    role: r.role,
    country: r.country,
    address: r.address,
    identifiers: r.identifiers,
    status: r.status,
    counterpartyId: idOrNull(r.counterparty_id),
    ownEntityId: idOrNull(r.own_entity_id),
    score: r.score,
    evidence: r.full_evidence,
    confirmedBy: r.confirmed_by,
    createdAt: iso(r.created_at) as string,
    updatedAt: iso(r.updated_at) as string,
  };
}

/**
 * A mention by id: its stored row with the evidence a person reads. The one lookup of a mention by id (the evidence
 * costs one read of its explanation by primary key); getMention and mentionOutcome are views of it.
 */
export async function mentionById(db: Queryable, mentionId: number): Promise<MentionRowWithEvidence | undefined> {
  return db.selectFrom('mention').selectAll().select(composedEvidence('mention').as('full_evidence')).where('id', '=', mentionId).executeTakeFirst();
}

export async function getMention(db: Queryable, mentionId: number): Promise<MentionView | undefined> {
  const row = await mentionById(db, mentionId);
  return row ? toMentionView(row) : undefined;
}

export async function mentionsOfCounterparty(db: Queryable, counterpartyId: number, page: { afterId?: number; limit?: number } = {}): Promise<MentionView[]> {
  const rows = await db
    .selectFrom('mention')
    .selectAll()
    .select(composedEvidence('mention').as('full_evidence'))
    .where('counterparty_id', '=', counterpartyId)
    .where('id', '>', page.afterId ?? 0)
    .orderBy('id')
    .limit(page.limit ?? 100)
    .execute();
  return rows.map(toMentionView);
}

/** Mentions no person confirmed, in id order after `afterId`: what reresolve may change. */
export async function unconfirmedMentionIds(db: Queryable, afterId: number, limit: number): Promise<number[]> {
  const rows = await db
    .selectFrom('mention')
    .select('id')
    .where('confirmed_by', 'is', null)
    .where('status', 'in', ['linked', 'review', 'new', 'unbound_term'])
    .where('id', '>', afterId)
    .orderBy('id')
    .limit(limit)
    .execute();
  return rows.map((r) => id(r.id));
}

export async function countByStatus(db: Queryable): Promise<Record<string, number>> {
  const rows = await db
    .selectFrom('mention')
    .select(['status', (eb) => eb.fn.countAll<string>().as('n')])
    .groupBy('status')
    .execute();
  return Object.fromEntries(rows.map((r) => [r.status, Number(r.n)]));
}

/** Most amendments whose waiting mentions one stored contract looks at; beyond it the rest wait for `cpreg reresolve`. */
export const MAX_WAITING_AMENDMENTS = 200;

/**
 * What a contract that arrives settles, in one statement:
 * - `awaiting`: the mentions that named it (by source and external id) before it was stored, in id order;
 * - `amendments`: contracts that say they use an earlier agreement's defined terms (an amendment, a side letter:
 *   `parsed` holds `earlierAgreements`) and hold mentions still `unbound_term` that no person confirmed (it may be
 *   that earlier agreement), other than `contractId`: each with its parsed result and those mentions, oldest first,
 *   at most MAX_WAITING_AMENDMENTS. The predicate is contract_amendment_idx's (migration 20261205003000): the few
 *   amendments, not a scan of every contract.
 */
export async function mentionsWaitingForContract(
  db: Queryable,
  source: string,
  externalId: string,
  contractId: number,
): Promise<{ awaiting: number[]; amendments: { contractId: number; parsed: unknown; mentionIds: number[] }[] }> {
  const result = await sql<{ awaiting: unknown; amendments: unknown }>`
    SELECT
      (SELECT coalesce(json_agg(m.id ORDER BY m.id), '[]'::json) FROM mention m
        WHERE m.contract_source = ${source} AND m.contract_external_id = ${externalId} AND m.contract_id IS NULL) AS awaiting,
      (SELECT coalesce(json_agg(json_build_object('id', a.id, 'parsed', a.parsed, 'mentions', a.mentions) ORDER BY a.id), '[]'::json)
        FROM (SELECT c.id, c.parsed,
                (SELECT json_agg(u.id ORDER BY u.id) FROM mention u
                  WHERE u.contract_id = c.id AND u.status = 'unbound_term' AND u.confirmed_by IS NULL) AS mentions
              FROM contract c
              WHERE (c.parsed -> 'earlierAgreements') IS NOT NULL AND c.status = 'active' AND c.id <> ${contractId}
                AND EXISTS (SELECT 1 FROM mention w WHERE w.contract_id = c.id AND w.status = 'unbound_term' AND w.confirmed_by IS NULL)
              ORDER BY c.id
              LIMIT ${MAX_WAITING_AMENDMENTS}) AS a) AS amendments`.execute(db);
  const row = result.rows[0]!;
  const json = (value: unknown): unknown => (typeof value === 'string' ? JSON.parse(value) : value);
  const amendments = json(row.amendments) as { id: unknown; parsed: unknown; mentions: unknown[] | null }[];
  return {
    awaiting: (json(row.awaiting) as unknown[]).map(id),
    amendments: amendments.map((a) => ({ contractId: id(a.id), parsed: a.parsed, mentionIds: (a.mentions ?? []).map(id) })),
  };
}

/** Where each mention of one source stands, for measuring the register against ground truth (cpreg evaluate
 * --through-register): its status, its counterparty, and the candidate of its open review item if any. */
export async function outcomesOfSource(
  db: Queryable,
  source: string,
): Promise<{ externalId: string; status: string; counterpartyId: number | null; reviewCandidateId: number | null }[]> {
  const rows = await db
    .selectFrom('mention as m')
    .leftJoin('review_item as r', (join) => join.onRef('r.mention_id', '=', 'm.id').on('r.status', '=', 'open'))
    .select(['m.external_id', 'm.status', 'm.counterparty_id', 'r.right_counterparty_id'])
    .where('m.source', '=', source)
    .execute();
  return rows.map((r) => ({
    externalId: r.external_id,
    status: r.status,
    counterpartyId: r.counterparty_id === null ? null : Number(r.counterparty_id),
    reviewCandidateId: r.right_counterparty_id === null ? null : Number(r.right_counterparty_id),
  }));
}

/**
 * The scores and statuses of the `limit` most recently updated scored mentions (newest first), for the score
 * statistics route. Scores of magnitude 1e5 or more are left out, as that route always has (outside the range of
 * the match weights its buckets show).
 */
export async function recentMentionScores(db: Queryable, limit: number): Promise<{ score: number; status: Selectable<MentionTable>['status'] }[]> {
  const rows = await db
    .selectFrom('mention')
    .select(['score', 'status'])
    .where('score', 'is not', null)
    .where(sql<boolean>`abs(score) < 1e5`)
    .orderBy('updated_at', 'desc')
    .orderBy('id', 'desc')
    .limit(limit)
    .execute();
  return rows.map((r) => ({ score: Number(r.score), status: r.status }));
}

/** How a mention is resolved now (its status, counterparty or own entity), or undefined when there is no such mention. */
export async function mentionOutcome(
  db: Queryable,
  mentionId: number,
): Promise<{ status: string; counterparty_id: number | null; own_entity_id: number | null } | undefined> {
  const row = await mentionById(db, mentionId);
  return row ? { status: row.status, counterparty_id: idOrNull(row.counterparty_id), own_entity_id: idOrNull(row.own_entity_id) } : undefined;
}

/** The counterparties these mentions are linked to (one entry per linked mention). */
export async function counterpartiesOfMentions(db: Queryable, mentionIds: readonly number[]): Promise<number[]> {
  if (mentionIds.length === 0) return [];
  const rows = await db
    .selectFrom('mention')
    .select('counterparty_id')
    .where('id', 'in', [...mentionIds])
    .where('counterparty_id', 'is not', null)
    .execute();
  return rows.map((r) => id(r.counterparty_id));
}

/** The ids of the mentions linked to a counterparty, in id order. */
export async function mentionIdsOfCounterparty(db: Queryable, counterpartyId: number): Promise<number[]> {
  const rows = await db.selectFrom('mention').select('id').where('counterparty_id', '=', counterpartyId).orderBy('id').execute();
  return rows.map((r) => id(r.id));
}
