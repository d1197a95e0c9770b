/**
 * The contract a mention names, as its decision reads it (resolve/decide.ts ContractContext): its parsed terms, the
 * mention of each party, and the earlier agreement whose defined terms an amendment or side letter uses.
 */
import { contractByRef } from '../../../db/queries/contracts.ts';
import { partyMentionsByPosition } from '../../../db/queries/resolve-reads.ts';
import type { ParsedContract } from '../../../resolvers/terms/index.ts';
import type { ChangeSet } from '../state/change-set.ts';
import { earlierContractOf } from '../earlier-contract.ts';
import type { ContractContext } from './decide.ts';

/** The context of an active contract; null when it has not arrived or was withdrawn. */
export async function contractContextFor(cs: ChangeSet, ref: { source: string; externalId: string } | undefined): Promise<ContractContext | null> {
  if (!ref) return null;
  const contract = await contractByRef(cs.trx, ref.source, ref.externalId);
  if (!contract || contract.status !== 'active') return null;
  const parsed = contract.parsed as unknown as ParsedContract;
  const context: ContractContext = { contractId: Number(contract.id), parsed, partyMentions: await partyMentionsByPosition(cs.trx, Number(contract.id)) };
  // An amendment or side letter: the earlier agreement whose defined terms it uses, when the register holds it.
  const earlier = parsed.earlierAgreements ? await earlierContractOf(cs.trx, context.contractId, parsed) : null;
  if (earlier) context.earlier = { ...earlier, partyMentions: await partyMentionsByPosition(cs.trx, earlier.contractId) };
  return context;
}
