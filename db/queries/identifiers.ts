/** Counterparty identifiers: lookups by (scheme, value) use the index, so they stay fast at any size. */
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
