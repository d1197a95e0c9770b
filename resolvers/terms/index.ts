/**
 * resolvers/terms: the parties of one contract, their defined terms, and mentions resolved inside it. Pure.
 *
 * parseParties(text, { ownEntities? }) reads, in this order:
 *   1. definitions (findDefinitions): parentheses holding quoted terms, "hereinafter"/"ci-après"/"im Folgenden"/
 *      "en adelante"/"di seguito" phrases, outside-parenthesis collective terms ("are each a "Party""), and
 *      Australian unquoted terms at the end of a line; for each, the name before it (locateName: after the last
 *      "between"/numbering/"BETWEEN:"/blank line, cut before the descriptive phrase, extended over ", Inc." and
 *      alias phrases), accepted only when it reads as a name and a parties clause, legal form, person or
 *      descriptive phrase supports it (isPlausibleName, collector.ts hasSupport);
 *   2. numbered items of a parties clause that define no term (findPartyItems);
 *   3. "Party A (Seller): X Co., Ltd." label lines, names with a legal form only (findLabelledParties);
 *   4. signature blocks: the entity line above "By:" or "/s/", "for and on behalf of X" (findSignatureBlocks);
 *      the people who sign, witness or notarise (findSignatureBlocks, findSigners) are `signers`, with their title:
 *      their names are non-party names, their titles never;
 *   5. express exclusions ("X, which is not a party hereto": findExclusions): X is `mentioned`, not a party;
 *   6. statements that the contract uses an earlier agreement's defined terms (findEarlierAgreements: "capitalised
 *      terms have the meaning given in the Agreement dated …"): `earlierAgreements`, for the register to look up.
 * The same entity seen twice (preamble and signature block) is merged on the name analysis (sameEntityName).
 * Descriptive phrases give jurisdiction, identifiers (normalised by resolvers/identifiers; a rejected value is kept
 * with its `problem`), address and, through resolvers/analyse, legal form, aliases, related entities and kind.
 *
 * resolveInContract(parsed, mention) consults only `parsed`, so a term never leaks between contracts:
 *   bound (one party holds the term) · unbound_term (two parties hold it, or the analysis says the mention needs a
 *   binding) · collective_term · not_a_party · match (goes on to register matching; `party` is set when the
 *   mention is the exact name of a party of this contract).
 *
 * Limits: 1 MB of UTF-8 (MAX_CONTRACT_BYTES); 500 parties, 50 terms per party, 100 collective terms (beyond
 * them `warnings` says how many were left out); 600 characters searched back from a definition for its name.
 */
export type {
  CollectiveTerm,
  DeclaredName,
  ContractIdentifier,
  ContractParty,
  ContractSigner,
  EmptyReason,
  InContractResolution,
  InContractStatus,
  MentionedEntity,
  ParsedContract,
  ParseOptions,
  PartyRef,
} from './types.ts';
export { parseParties } from './parse-parties.ts';
export { MAX_COLLECTIVE_TERMS, MAX_PARTIES, MAX_TERMS_PER_PARTY } from './collector.ts';
export { resolveInContract } from './resolve-in-contract.ts';
export { MAX_CONTRACT_BYTES, checkContractText } from './check-contract-text.ts';
export { termKey } from './clean-term.ts';
export { classifyNotParties } from './classify-not-parties.ts';
export { findEarlierAgreements } from './find-earlier-agreements.ts';
export type { AgreementReference } from './find-earlier-agreements.ts';
export { datesIn, readDate } from './read-date.ts';
export { containsToken, matchEarlierAgreement } from './match-earlier-agreement.ts';
export type { EarlierCandidate, EarlierMatch } from './match-earlier-agreement.ts';
export { sameEntityName } from './same-entity-name.ts';
export type { NotPartyGroups } from './classify-not-parties.ts';
export { reconcileGivenParties } from './reconcile-given-parties.ts';
export type { GivenPartyFacts, ParsedPartyFacts, PartyDisagreement, PartyReconciliation } from './reconcile-given-parties.ts';
