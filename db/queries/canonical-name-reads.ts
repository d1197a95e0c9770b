/**
 * What the register reads to name a counterparty outside a buffered ChangeSet (services/register/records.ts): the
 * names the canonical-value rules choose from. (Merge chains are followed by mergeChainEnds, counterparties.ts.)
 */
import type { Queryable } from './util.ts';
import { id } from './util.ts';

/** The names of a counterparty with what the canonical-value rules weigh. */
export async function nameChoicesOf(
  db: Queryable,
  counterpartyId: number,
): Promise<{ id: number; name: string; kind: string; legal_form: string | null; seen_count: number; confirmed_by: string | null }[]> {
  const rows = await db
    .selectFrom('counterparty_name')
    .select(['id', 'name', 'kind', 'legal_form', 'seen_count', 'confirmed_by'])
    .where('counterparty_id', '=', counterpartyId)
    .execute();
  return rows.map((r) => ({ ...r, id: id(r.id) }));
}
