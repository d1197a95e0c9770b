/** resolvers/terms: the parties of one contract, their defined terms, and mentions resolved inside it. */
export type {
  CollectiveTerm,
  ContractIdentifier,
  ContractParty,
  EmptyReason,
  InContractResolution,
  InContractStatus,
  ParsedContract,
  ParseOptions,
  PartyRef,
} from './types.ts';
export { parseParties } from './parseParties.ts';
export { resolveInContract } from './resolveInContract.ts';
export { MAX_CONTRACT_BYTES, checkContractText } from './checkContractText.ts';
export { termKey } from './cleanTerm.ts';
