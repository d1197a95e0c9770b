/**
 * The contract a mention names, as its decision reads it (resolve/decide.ts ContractContext): its parsed terms, the
 * mention of each party, and the earlier agreement whose defined terms an amendment or side letter uses. A single
 * resolve reads its one contract in its transaction; a batch reads every contract its mentions name at once.
 */
import { contractByRef } from '../../../db/queries/contracts.ts';
import { contractsByRefs, partyMentionsOfContracts } from '../../../db/queries/chunk-reads.ts';
import { partyMentionsByPosition } from '../../../db/queries/resolve-reads.ts';
import type { Queryable } from '../../../db/queries/util.ts';
import type { ParsedContract } from '../../../resolvers/terms/index.ts';
import type { ChangeSet } from '../state/change-set.ts';
import { earlierContractOf } from '../earlier-contract.ts';
import type { ContractContext } from './decide.ts';

/** A contract's key as the walk keeps it. */
export function contractRefKey(ref: { source: string; externalId: string }): string {
  return JSON.stringify([ref.source, ref.externalId]);
}

/** The context of an active contract; null when it has not arrived or was withdrawn. */
export async function contractContextFor(cs: ChangeSet, ref: { source: string; externalId: string } | undefined): Promise<ContractContext | null> {
  if (!ref) return null;
  const contract = await contractByRef(cs.trx, ref.source, ref.externalId);
  if (!contract || contract.status !== 'active') return null;
  const context: ContractContext = {
    contractId: contract.id,
    parsed: contract.parsed as ParsedContract,
    partyMentions: await partyMentionsByPosition(cs.trx, contract.id),
  };
  return withEarlier(cs.trx, context);
}

/**
 * The contexts of the contracts under these keys (by contractRefKey; null: not arrived, or withdrawn): the contracts
 * in one statement, their parties' mentions in one; only an amendment's earlier agreement is looked up on its own.
 */
export async function contractContextsByRef(
  db: Queryable,
  refs: readonly { source: string; externalId: string }[],
): Promise<Map<string, ContractContext | null>> {
  const unique = new Map(refs.map((r) => [contractRefKey(r), r]));
  const out = new Map<string, ContractContext | null>([...unique.keys()].map((k) => [k, null]));
  const active = (await contractsByRefs(db, [...unique.values()])).filter((c) => c.status === 'active');
  const parties = await partyMentionsOfContracts(
    db,
    active.map((c) => c.id),
  );
  for (const c of active) {
    const context: ContractContext = { contractId: c.id, parsed: c.parsed as ParsedContract, partyMentions: parties.get(c.id)! };
    out.set(contractRefKey(c), await withEarlier(db, context));
  }
  return out;
}

/** An amendment or side letter: the earlier agreement whose defined terms it uses, when the register holds it. */
async function withEarlier(db: Queryable, context: ContractContext): Promise<ContractContext> {
  const earlier = context.parsed.earlierAgreements ? await earlierContractOf(db, context.contractId, context.parsed) : null;
  if (earlier) context.earlier = { ...earlier, partyMentions: await partyMentionsByPosition(db, earlier.contractId) };
  return context;
}
