/** Relations between counterparties (never merges). */
import type { RelationType } from '../../resolvers/vocabulary.ts';
import type { CounterpartyRelation } from '../types.ts';
import type { Queryable } from './util.ts';
import { id, iso } from './util.ts';

export interface RelationView {
  id: number;
  fromCounterpartyId: number;
  toCounterpartyId: number;
  type: string;
  since: string | null;
  origin: string;
  status: string;
  evidence: Record<string, unknown>;
  createdBy: string;
  createdAt: string;
}

export async function relationsOf(db: Queryable, counterpartyIds: number[]): Promise<RelationView[]> {
  if (counterpartyIds.length === 0) return [];
  const rows = await db
    .selectFrom('counterparty_relation')
    .selectAll()
    .where((eb) => eb.or([eb('from_counterparty_id', 'in', counterpartyIds), eb('to_counterparty_id', 'in', counterpartyIds)]))
    .orderBy('id')
    .execute();
  return rows.map((r) => ({
    id: id(r.id),
    fromCounterpartyId: id(r.from_counterparty_id),
    toCounterpartyId: id(r.to_counterparty_id),
    type: r.type,
    since: r.since,
    origin: r.origin,
    status: r.status,
    evidence: r.evidence,
    createdBy: r.created_by,
    createdAt: iso(r.created_at) as string,
  }));
}

export async function findRelation(db: Queryable, from: number, to: number, type: string): Promise<number | undefined> {
  const row = await db
    .selectFrom('counterparty_relation')
    .select('id')
    .where('from_counterparty_id', '=', from)
    .where('to_counterparty_id', '=', to)
    .where('type', '=', type as never)
    .executeTakeFirst();
  return row ? id(row.id) : undefined;
}

/** The two counterparties a relation joins, or undefined when there is no such relation. */
export async function relationEnds(db: Queryable, relationId: number): Promise<{ from: number; to: number } | undefined> {
  const row = await db
    .selectFrom('counterparty_relation')
    .select(['from_counterparty_id', 'to_counterparty_id'])
    .where('id', '=', relationId)
    .executeTakeFirst();
  return row ? { from: id(row.from_counterparty_id), to: id(row.to_counterparty_id) } : undefined;
}

/** Every relation from or to a counterparty, whole rows in id order: what a merge moves to the survivor. */
export async function relationRowsTouching(
  db: Queryable,
  counterpartyId: number,
): Promise<{ id: number; from_counterparty_id: number; to_counterparty_id: number; type: RelationType }[]> {
  const rows: CounterpartyRelation[] = await db
    .selectFrom('counterparty_relation')
    .selectAll()
    .where((eb) => eb.or([eb('from_counterparty_id', '=', counterpartyId), eb('to_counterparty_id', '=', counterpartyId)]))
    .orderBy('id')
    .execute();
  // The ids parsed here, once (int8 columns come back as strings from node-postgres).
  return rows.map((r) => ({
    id: id(r.id),
    from_counterparty_id: id(r.from_counterparty_id),
    to_counterparty_id: id(r.to_counterparty_id),
    type: r.type as RelationType,
  }));
}

/** Another relation (not `exceptId`) with the same ends and type, if there is one. */
export async function findOtherRelation(db: Queryable, from: number, to: number, type: RelationType, exceptId: number): Promise<number | undefined> {
  const row = await db
    .selectFrom('counterparty_relation')
    .select('id')
    .where('from_counterparty_id', '=', from)
    .where('to_counterparty_id', '=', to)
    .where('type', '=', type)
    .where('id', '<>', exceptId)
    .executeTakeFirst();
  return row ? id(row.id) : undefined;
}
