/** Counterparty identifiers: lookups by (scheme, value) use the index, so they stay fast at any size. */
import type { IdentifierScheme } from '../../resolvers/vocabulary.ts';
import type { Queryable } from './util.ts';
import { groupByCounterparty, id, idOrNull, iso } from './util.ts';

export interface IdentifierView {
  id: number;
  scheme: string;
  value: string;
  label: string | null;
  strong: boolean;
  source: string | null;
  mentionId: number | null;
  confirmedBy: string | null;
  createdAt: string;
}

export async function identifiersOf(db: Queryable, counterpartyIds: number[]): Promise<Map<number, IdentifierView[]>> {
  if (counterpartyIds.length === 0) return new Map<number, IdentifierView[]>();
  const rows = await db
    .selectFrom('counterparty_identifier')
    .selectAll()
    .where('counterparty_id', 'in', counterpartyIds)
    .orderBy('counterparty_id')
    .orderBy('id')
    .execute();
  return groupByCounterparty(rows, (r) => ({
    id: id(r.id),
    scheme: r.scheme,
    value: r.value,
    label: r.label,
    strong: r.strong,
    source: r.source,
    mentionId: idOrNull(r.mention_id),
    confirmedBy: r.confirmed_by,
    createdAt: iso(r.created_at) as string,
  }));
}

/** Counterparties holding any of these (scheme, value) pairs. */
export async function holdersOf(
  db: Queryable,
  identifiers: { scheme: string; value: string }[],
): Promise<{ counterpartyId: number; scheme: string; value: string; strong: boolean }[]> {
  if (identifiers.length === 0) return [];
  const rows = await db
    .selectFrom('counterparty_identifier')
    .select(['counterparty_id', 'scheme', 'value', 'strong'])
    .where((eb) => eb.or(identifiers.map((i) => eb.and([eb('scheme', '=', i.scheme as never), eb('value', '=', i.value)]))))
    .execute();
  return rows.map((r) => ({ counterpartyId: id(r.counterparty_id), scheme: r.scheme, value: r.value, strong: r.strong }));
}

/** A counterparty's identifier rows (id, scheme, value) in id order: what a merge moves to the survivor. */
export async function identifierRowsOf(db: Queryable, counterpartyId: number): Promise<{ id: number; scheme: IdentifierScheme; value: string }[]> {
  const rows = await db
    .selectFrom('counterparty_identifier')
    .select(['id', 'scheme', 'value'])
    .where('counterparty_id', '=', counterpartyId)
    .orderBy('id')
    .execute();
  return rows.map((r) => ({ id: id(r.id), scheme: r.scheme, value: r.value }));
}

/** The id of a counterparty's identifier row with this (scheme, value), if it has one. */
export async function findIdentifierId(db: Queryable, counterpartyId: number, scheme: IdentifierScheme, value: string): Promise<number | undefined> {
  const row = await db
    .selectFrom('counterparty_identifier')
    .select('id')
    .where('counterparty_id', '=', counterpartyId)
    .where('scheme', '=', scheme)
    .where('value', '=', value)
    .executeTakeFirst();
  return row ? id(row.id) : undefined;
}

/** A counterparty's identifiers as a mention would carry them (scheme, value, label when it has one). */
export async function identifiersAsInput(db: Queryable, counterpartyId: number): Promise<{ scheme: IdentifierScheme; value: string; label?: string }[]> {
  const rows = await db.selectFrom('counterparty_identifier').select(['scheme', 'value', 'label']).where('counterparty_id', '=', counterpartyId).execute();
  return rows.map((i) => ({ scheme: i.scheme, value: i.value, ...(i.label ? { label: i.label } : {}) }));
}

/** The LEIs these counterparties hold, one row per (counterparty, LEI). */
export async function leisOf(db: Queryable, counterpartyIds: number[]): Promise<{ counterpartyId: number; value: string }[]> {
  const rows = await db
    .selectFrom('counterparty_identifier')
    .select(['counterparty_id', 'value'])
    .where('counterparty_id', 'in', counterpartyIds)
    .where('scheme', '=', 'lei')
    .execute();
  return rows.map((r) => ({ counterpartyId: id(r.counterparty_id), value: r.value }));
}
