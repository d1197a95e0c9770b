/**
 * What the register reads to follow a counterparty without locking it (services/register/records.ts): one step of
 * a merge chain. The names the canonical-value rules choose from are held by the ChangeSet (ChangeSet.namesOf).
 */
import type { Queryable } from './util.ts';
import { idOrNull } from './util.ts';

/** A counterparty's status and where it was merged into (one step of a merge chain). */
export async function mergeStep(db: Queryable, counterpartyId: number): Promise<{ status: string; mergedInto: number | null } | undefined> {
  const row = await db.selectFrom('counterparty').select(['status', 'merged_into']).where('id', '=', counterpartyId).executeTakeFirst();
  return row ? { status: row.status, mergedInto: idOrNull(row.merged_into) } : undefined;
}
