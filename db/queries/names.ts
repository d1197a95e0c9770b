/** Counterparty names. */
import type { Queryable } from './util.ts';
import { id, idOrNull, iso } from './util.ts';

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
  const out = new Map<number, NameView[]>();
  if (counterpartyIds.length === 0) return out;
  const rows = await db
    .selectFrom('counterparty_name')
    .selectAll()
    .where('counterparty_id', 'in', counterpartyIds)
    .orderBy('counterparty_id')
    .orderBy('id')
    .execute();
  for (const r of rows) {
    const key = id(r.counterparty_id);
    const list = out.get(key) ?? [];
    list.push({
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
    });
    out.set(key, list);
  }
  return out;
}
