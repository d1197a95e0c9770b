/**
 * The write stage's reads ahead (walk.ts stage 6): what a chunk's mentions need, one statement per kind, in the
 * chunk's transaction after its counterparty locks, instead of one read per mention as each is written.
 */
import { isStrongScheme } from '../../resolvers/vocabulary.ts';
import { activeContractIdsByRefs } from '../../db/queries/chunk-reads.ts';
import type { Group } from './batch-cluster.ts';
import type { StoredRef } from './batch-write.ts';
import { survivorFor } from './lock-active.ts';
import type { Outcome } from './resolve/decide.ts';
import type { ChangeSet } from './state/change-set.ts';
import { identifierKey } from './state/prefetched.ts';

/**
 * What the chunk's mentions read, one statement per kind, after its counterparty locks: its stored mentions locked
 * (counterparties before mentions, the lock order), their open review items locked, the holders of the identifiers
 * it may add, and the ids of the contracts a batch's mentions name. The identifier rows it will add then draw
 * their ids in one statement. What cannot be known here is read when written: the holders after a change to an
 * identifier row in the same ChangeSet (state/prefetched.ts), the open items of a mention written twice.
 */
export async function prefetchChunk(cs: ChangeSet, chunk: Group[], plans: Outcome[][], found: Map<string, StoredRef>): Promise<Map<string, number>> {
  const storedIds = [...found.values()].map((f) => f.id);
  await cs.lock('mention', storedIds);
  await cs.prefetchOpenItems(storedIds);
  const adding = chunk.flatMap((group, g) => group.members.flatMap((m, i) => (addsRows(plans[g]![i]!) ? m.prepared.identifiers : [])));
  await cs.prefetchHolders(adding);
  const rows = identifierRowsAhead(cs, chunk, plans);
  if (rows > 0) await cs.reserveIds({ counterparty_identifier: rows });
  const refs = chunk.flatMap((group) => group.members.flatMap((m) => (m.known || !m.prepared.input.contract ? [] : [m.prepared.input.contract])));
  return refs.length === 0 ? new Map() : activeContractIdsByRefs(cs.trx, refs);
}

/** Whether an outcome adds names and identifiers to a counterparty (resolve/apply.ts). */
function addsRows(outcome: Outcome): boolean {
  return outcome.status === 'linked' || outcome.status === 'new';
}

/**
 * The identifier rows the chunk adds, as add-identifier-row.ts will decide them from the holders read ahead:
 * none for one its counterparty holds, none for a strong one another holds. A mention whose earlier decision turns
 * its link into a question adds fewer: its ids are left over, a harmless gap (as a rollback leaves).
 */
function identifierRowsAhead(cs: ChangeSet, chunk: Group[], plans: Outcome[][]): number {
  const held = new Map<string, Set<string>>();
  let rows = 0;
  chunk.forEach((group, g) =>
    group.members.forEach((m, i) => {
      const outcome = plans[g]![i]!;
      if (!addsRows(outcome)) return;
      // A new counterparty and the mentions clustered with it share the group's.
      const target = outcome.status === 'linked' && outcome.counterpartyId !== undefined ? String(survivorFor(cs, outcome.counterpartyId)) : `group ${g}`;
      for (const identifier of m.prepared.identifiers) {
        const key = identifierKey(identifier);
        if (!held.has(key)) held.set(key, new Set((cs.prefetched.holdersOf(identifier) ?? []).map(String)));
        const holders = held.get(key)!;
        if (holders.has(target) || (isStrongScheme(identifier.scheme) && holders.size > 0)) continue;
        holders.add(target);
        rows++;
      }
    }),
  );
  return rows;
}
