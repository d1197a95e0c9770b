/** Counterparties followed through their merges to the active survivor: locked (in a ChangeSet) or only read. */
import type { ChangeSet, Db } from './state/change-set.ts';
import type { StateRow } from './state/tables.ts';
import { notFound } from './errors.ts';
import { MAX_MERGE_CHAIN, mergeChainEnds } from '../../db/queries/counterparties.ts';

/** Follows merged_into to the active survivor (without locking); `merged` says the id given is not the survivor. */
export async function survivorOf(db: Db, counterpartyId: number): Promise<{ id: number; merged: boolean } | undefined> {
  const ends = await mergeChainEnds(db, [counterpartyId]);
  if (!ends.has(counterpartyId)) return undefined;
  const end = ends.get(counterpartyId);
  if (!end) throw new Error(`counterparty ${counterpartyId}: merge chain longer than ${MAX_MERGE_CHAIN} links (a cycle?)`);
  return { id: end.id, merged: end.links > 0 };
}

/**
 * Locks counterparties and returns them, following merges: callers that were handed a merged id act on the
 * survivor. Locks are taken in id order; a survivor found later is locked afterwards (deadlocks are retried).
 */
export async function lockActive(cs: ChangeSet, ids: number[]): Promise<Map<number, StateRow<'counterparty'>>> {
  const out = new Map<number, StateRow<'counterparty'>>();
  let pending = [...new Set(ids)];
  for (let round = 0; pending.length > 0 && round < 100; round++) {
    const rows = await cs.lock('counterparty', pending);
    const found = new Set(rows.map((r) => r.id));
    for (const id of pending) if (!found.has(id)) throw notFound('counterparty', id);
    const next: number[] = [];
    for (const row of rows) {
      if (row.status === 'active') out.set(row.id, row);
      // A counterparty that is not active was merged: it names its survivor.
      else next.push(row.merged_into!);
    }
    // Map each requested id to its survivor: the caller reads `survivorFor` below.
    for (const row of rows) if (row.status !== 'active') cs.aliases.set(row.id, row.merged_into!);
    pending = next.filter((id) => !out.has(id));
  }
  return out;
}

export function survivorFor(cs: ChangeSet, id: number): number {
  let current = id;
  for (let i = 0; i < 1000 && cs.aliases.has(current); i++) current = cs.aliases.get(current)!;
  return current;
}
