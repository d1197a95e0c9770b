/** Counterparty names. */
import type { NameKind } from '../../resolvers/vocabulary.ts';
import type { Queryable } from './util.ts';
import { groupByCounterparty, id, idOrNull, iso } from './util.ts';

export interface NameView {
  id: number;
  name: string;
  normalised: string;
  kind: string;
  legalForm: string | null;
  seenCount: number;
  /** Where it was first seen. */
  source: string | null;
  mentionId: number | null;
  contractId: number | null;
  confirmedBy: string | null;
  createdAt: string;
}

export async function namesOf(db: Queryable, counterpartyIds: number[]): Promise<Map<number, NameView[]>> {
  if (counterpartyIds.length === 0) return new Map<number, NameView[]>();
  const rows = await db
    .selectFrom('counterparty_name')
    .selectAll()
    .where('counterparty_id', 'in', counterpartyIds)
    .orderBy('counterparty_id')
    .orderBy('id')
    .execute();
  return groupByCounterparty(rows, (r) => ({
    id: id(r.id),
    name: r.name,
    normalised: r.normalised,
    kind: r.kind,
    legalForm: r.legal_form,
    seenCount: r.seen_count,
    source: r.source,
    mentionId: idOrNull(r.mention_id),
    contractId: idOrNull(r.contract_id),
    confirmedBy: r.confirmed_by,
    createdAt: iso(r.created_at) as string,
  }));
}

/** The id of a counterparty's name row with this exact (name, kind), if it has one. */
export async function findNameId(db: Queryable, counterpartyId: number, name: string, kind: NameKind): Promise<number | undefined> {
  const row = await db
    .selectFrom('counterparty_name')
    .select('id')
    .where('counterparty_id', '=', counterpartyId)
    .where('name', '=', name)
    .where('kind', '=', kind)
    .executeTakeFirst();
  return row ? id(row.id) : undefined;
}

/** How many names a counterparty has. */
export async function countNames(db: Queryable, counterpartyId: number): Promise<number> {
  const row = await db
    .selectFrom('counterparty_name')
    .select((eb) => eb.fn.countAll().as('n'))
    .where('counterparty_id', '=', counterpartyId)
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

export interface NameOrigin {
  /** The contract the name was first seen in, when it came from one. */
  contractId: number | null;
  contractSource: string | null;
  contractExternalId: string | null;
  /** The source system that first sent the name. */
  source: string | null;
}

/** Where a counterparty's name of this (name, kind) was first seen: the contract that declared it, if any. */
export async function nameOrigin(db: Queryable, counterpartyId: number, name: string, kind: NameKind): Promise<NameOrigin | undefined> {
  const row = await db
    .selectFrom('counterparty_name as n')
    .leftJoin('contract as c', 'c.id', 'n.contract_id')
    .select(['n.contract_id', 'n.source', 'c.source as contract_source', 'c.external_id as contract_external_id'])
    .where('n.counterparty_id', '=', counterpartyId)
    .where('n.name', '=', name)
    .where('n.kind', '=', kind)
    .executeTakeFirst();
  if (!row) return undefined;
  return { contractId: idOrNull(row.contract_id), contractSource: row.contract_source, contractExternalId: row.contract_external_id, source: row.source };
}

/** A counterparty's name rows (id, name, kind) in id order: what a merge moves to the survivor. */
export async function nameRowsOf(db: Queryable, counterpartyId: number): Promise<{ id: number; name: string; kind: NameKind }[]> {
  const rows = await db.selectFrom('counterparty_name').select(['id', 'name', 'kind']).where('counterparty_id', '=', counterpartyId).orderBy('id').execute();
  return rows.map((r) => ({ id: id(r.id), name: r.name, kind: r.kind as NameKind }));
}

/** The id of any one name row of a counterparty (undefined when it has none). */
export async function anyNameId(db: Queryable, counterpartyId: number): Promise<number | undefined> {
  const row = await db.selectFrom('counterparty_name').select('id').where('counterparty_id', '=', counterpartyId).executeTakeFirst();
  return row ? id(row.id) : undefined;
}
