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
  const row = await db.selectFrom('counterparty_name').select('id').where('counterparty_id', '=', counterpartyId).where('name', '=', name).where('kind', '=', kind).executeTakeFirst();
  return row ? id(row.id) : undefined;
}
