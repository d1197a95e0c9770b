/**
 * The result of reading one contract's parties: what resolvers/terms hands to the register and the CLI.
 * The JSON shape of `cpreg contract parse --json` is exactly `ParsedContract` minus `reason`'s absence.
 */
import type { AliasKind, EntityKind, IdentifierScheme, RelationType, ResolutionStatus } from '../vocabulary.ts';
import type { LegalFormMatch, NameAnalysis } from '../analyse/index.ts';
import type { AgreementReference } from './find-earlier-agreements.ts';

export interface ContractIdentifier {
  scheme: IdentifierScheme;
  /** Canonical value from resolvers/identifiers; the value as written (spacing removed) when that rejects it. */
  value: string;
  /** Why resolvers/identifiers rejected the value (bad check digit, wrong length): kept so a reviewer sees it. */
  problem?: string;
  /** Only for scheme `other`: what the identifier is. */
  label?: string;
}

export interface ContractParty {
  /**
   * The party's name as it stands in the text: a verbatim substring of the input, except that a line break inside
   * the name (with the spaces around it) reads as one space (parse-parties.ts oneLine).
   */
  name: string;
  /** Its role in this contract (the defined term that names a role: "Licensor", "Paying Agent"), or null. */
  role: string | null;
  /** Every defined term bound to this party in this contract, as written without quotes or article. */
  terms: string[];
  /** True when the party is one of the organisation's own legal entities (options.ownEntities). */
  ownEntity: boolean;
  /** ISO 3166-1 alpha-2 or ISO 3166-2 ("US-DE"), from the descriptive phrase. */
  jurisdiction?: string;
  legalForm?: LegalFormMatch;
  identifiers: ContractIdentifier[];
  aliases: { kind: AliasKind; name: string }[];
  related: { relation: RelationType; name: string }[];
  kind: EntityKind;
  /** The address as written, when the descriptive phrase gives one. */
  address?: string;
}

/** Another name a contract declares for a party: a trade name (d/b/a, t/a), an a/k/a, or a former name (f/k/a). */
export interface DeclaredName {
  kind: AliasKind;
  /** As the contract writes it. */
  name: string;
}

/** A person who signs, witnesses or notarises the contract: seen in the text, never a party for that. */
export interface ContractSigner {
  /** The name as written, without a form of address ("Oswin Tarrant"). */
  name: string;
  /** The capacity stated beside the name ("Managing Director"): a job title, never a name. */
  title?: string;
  /** The party the person signs for, as the block writes it, when the block says. */
  signsFor?: string;
  capacity: 'signatory' | 'witness' | 'notary';
}

/** An entity the contract names and expressly says is not a party ("X, which is not a party hereto"). */
export interface MentionedEntity {
  name: string;
  /** Terms the contract defines for it ("Guarantor"): they bind no party of this contract. */
  terms: string[];
}

export interface CollectiveTerm {
  term: string;
  /** Names of the parties the term covers (each one is also in `parties`). */
  parties: string[];
}

/** Why a parse found no party: the text is fine to show to a person. */
export type EmptyReason = 'empty_text' | 'binary_data' | 'too_large' | 'no_parties_found';

export interface ParsedContract {
  parties: ContractParty[];
  collectiveTerms: CollectiveTerm[];
  /** Terms and names seen that are not parties: `this "Agreement"`, signers' names (never their job titles). */
  notParties: string[];
  /** Signatories, witnesses and notaries, with the capacity they sign in (absent on contracts parsed before). */
  signers?: ContractSigner[];
  /** Entities named but expressly not parties: recorded as mentioned, never as parties of this contract. */
  mentioned?: MentionedEntity[];
  /** Earlier agreements whose defined terms this contract uses (an amendment, a side letter): absent when none. */
  earlierAgreements?: AgreementReference[];
  /** Present when something was left out (more than MAX_PARTIES parties). */
  warnings?: string[];
  /** Present only when `parties` is empty: why. */
  reason?: { code: EmptyReason; message: string };
}

export interface ParseOptions {
  /** Names of the legal entities of the organisation that runs cpreg. */
  ownEntities?: string[];
}

export interface PartyRef {
  /** Position of the party in `ParsedContract.parties`. */
  index: number;
  name: string;
  role: string | null;
  ownEntity: boolean;
}

/** `bound`: a term of this contract names one party. The others are the shared resolution statuses. */
export type InContractStatus = 'bound' | 'match' | Extract<ResolutionStatus, 'unbound_term' | 'collective_term' | 'not_a_party'>;

export interface InContractResolution {
  status: InContractStatus;
  mention: string;
  /** The party the mention stands for (`bound`), or the party whose exact name it is (`match`). */
  party?: PartyRef;
  /** `collective_term`: the parties the term covers. */
  parties?: PartyRef[];
  /** The defined term that decided the outcome, as the contract writes it. */
  term?: string;
  /** `match` through another name the contract declares for the party ("formerly X", "d/b/a X"): which one. */
  alias?: DeclaredName;
  analysis: NameAnalysis;
  /** One sentence saying why: every decision must be explainable. */
  explanation: string;
}
