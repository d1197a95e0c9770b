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

export async function getMention(db: Queryable, mentionId: number): Promise<MentionView | undefined> {
  const row = await db.selectFrom('mention').selectAll().select(composedEvidence('mention').as('full_evidence')).where('id', '=', mentionId).executeTakeFirst();
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

/** Mentions that named a contract which had not arrived when they were resolved. */
export async function mentionsAwaitingContract(db: Queryable, source: string, externalId: string): Promise<number[]> {
  const rows = await db
    .selectFrom('mention')
    .select('id')
    .where('contract_source', '=', source)
    .where('contract_external_id', '=', externalId)
    .where('contract_id', 'is', null)
    .orderBy('id')
    .execute();
  return rows.map((r) => id(r.id));
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
 * Contracts that say they use an earlier agreement's defined terms (an amendment, a side letter: `parsed` holds
 * `earlierAgreements`) and hold mentions still `unbound_term` that no person confirmed: a contract that arrives may be
 * that earlier agreement. Each with its parsed result and those mentions, oldest contract first.
 */
export async function amendmentsWithUnboundMentions(
  db: Queryable,
  exceptContractId: number,
): Promise<{ contractId: number; parsed: unknown; mentionIds: number[] }[]> {
  // The predicate is contract_amendment_idx's (migration 20261205003000): the few amendments, then their mentions.
  const amendments = await db
    .selectFrom('contract as c')
    .select(['c.id', 'c.parsed'])
    .where(sql<boolean>`(c.parsed -> 'earlierAgreements') IS NOT NULL AND c.status = 'active'`)
    .where('c.id', '<>', exceptContractId)
    .where(({ exists, selectFrom }) =>
      exists(
        selectFrom('mention as m')
          .select('m.id')
          .whereRef('m.contract_id', '=', 'c.id')
          .where('m.status', '=', 'unbound_term')
          .where('m.confirmed_by', 'is', null),
      ),
    )
    .orderBy('c.id')
    .limit(MAX_WAITING_AMENDMENTS)
    .execute();
  if (amendments.length === 0) return [];
  const rows = await db
    .selectFrom('mention')
    .select(['id', 'contract_id'])
    .where(
      'contract_id',
      'in',
      amendments.map((a) => a.id),
    )
    .where('status', '=', 'unbound_term')
    .where('confirmed_by', 'is', null)
    .orderBy('id')
    .execute();
  return amendments.map((a) => ({
    contractId: id(a.id),
    parsed: a.parsed,
    mentionIds: rows.filter((r) => id(r.contract_id) === id(a.id)).map((r) => id(r.id)),
  }));
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

/** The whole stored row of one mention (undefined when there is none). */
export async function mentionRow(db: Queryable, mentionId: number): Promise<Selectable<MentionTable> | undefined> {
  return db.selectFrom('mention').selectAll().where('id', '=', mentionId).executeTakeFirst();
}

/** How a mention is resolved now (its status, counterparty or own entity), or undefined when there is no such mention. */
export async function mentionOutcome(
  db: Queryable,
  mentionId: number,
): Promise<{ status: string; counterparty_id: number | null; own_entity_id: number | null } | undefined> {
  const row = await db.selectFrom('mention').select(['status', 'counterparty_id', 'own_entity_id']).where('id', '=', mentionId).executeTakeFirst();
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
