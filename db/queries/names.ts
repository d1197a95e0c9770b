/** Counterparty names. */
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
