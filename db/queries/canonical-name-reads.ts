/**
 * What the register reads to follow and name a counterparty outside a buffered ChangeSet (services/register/
 * records.ts): the names the canonical-value rules choose from, and one step of a merge chain.
 */
import type { Queryable } from './util.ts';
import { id, idOrNull } from './util.ts';

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

/** A counterparty's status and where it was merged into (one step of a merge chain). */
export async function mergeStep(db: Queryable, counterpartyId: number): Promise<{ status: string; mergedInto: number | null } | undefined> {
  const row = await db.selectFrom('counterparty').select(['status', 'merged_into']).where('id', '=', counterpartyId).executeTakeFirst();
  return row ? { status: row.status, mergedInto: idOrNull(row.merged_into) } : undefined;
}
