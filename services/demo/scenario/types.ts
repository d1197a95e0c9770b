/** The demo scenario's shapes: invented data plus the ground truth the demo and tests measure against. */
import type { Identifier, MentionInput, NameKind } from '../../../resolvers/vocabulary.ts';

export interface Address {
  street: string;
  city: string;
  postalCode: string;
  /** ISO 3166-1 alpha-2 (the country part of the jurisdiction). */
  country: string;
}

export interface Person {
  name: string;
  title: string;
}

/** One legal entity of our own invented group. */
export interface OwnEntity {
  id: string;
  legalName: string;
  /** ISO 3166-1 alpha-2, or ISO 3166-2 for US states. */
  jurisdiction: string;
  legalForm: string;
  identifiers: Identifier[];
  address: Address;
  /** Own entity id of the parent in the group; absent for the top company. */
  parentId?: string;
  signers: Person[];
}

export interface ScenarioCounterparty {
  id: string;
  kind: 'organisation' | 'person';
  legalName: string;
  jurisdiction: string;
  legalForm?: string;
  /** Every name it goes by: the legal name first; trade (d/b/a) and former (f/k/a) names when it has them. */
  names: Array<{ name: string; kind: NameKind }>;
  identifiers: Identifier[];
  address: Address;
  phone: string;
  emailDomain: string;
  iban?: string;
  /** Counterparty id of the parent company, when this one is a subsidiary in the scenario. */
  parentId?: string;
  /** Counterparty id of an entity whose name differs only in legal form or jurisdiction: a DIFFERENT entity. */
  lookalikeOf?: string;
  signers: Person[];
}

export type PartyRef = { kind: 'counterparty'; id: string } | { kind: 'own_entity'; id: string };

export const DRAFTING_STYLES = ['by_and_between', 'uk_numbered', 'between_and', 'defined_pronouns', 'hereinafter', 'numbered_list'] as const;
export type DraftingStyle = (typeof DRAFTING_STYLES)[number];

export interface ContractParty {
  ref: PartyRef;
  /** The party's name exactly as the parties clause writes it (occurs verbatim in the text). */
  nameInText: string;
  /** The role the contract gives it (its main defined term): "Supplier", "Licensee", "Guarantor"… */
  role: string;
  /** Every term the contract binds to this party ("Supplier", "NRC", "we", "us", "our"…). */
  terms: string[];
  /** The signer named in the signature block (not a party). */
  signer?: Person;
}

export interface ScenarioContract {
  source: string;
  externalId: string;
  title: string;
  date: string;
  style: DraftingStyle;
  text: string;
  parties: ContractParty[];
  /** Collective terms the text defines ("Parties"). */
  collectiveTerms: string[];
}

/** What a mention really is. */
export type MentionTruth =
  | { kind: 'counterparty'; counterpartyId: string }
  | { kind: 'own_entity'; ownEntityId: string }
  | { kind: 'not_a_party'; reason: 'signer' | 'place' | 'defined_non_party_term' }
  | { kind: 'unbound_term' }
  | { kind: 'collective_term' };

/** How the mention text was written (for per-style accuracy in the demo summary). */
export const MENTION_STYLES = [
  'exact',
  'legal_form_variant',
  'case',
  'missing_punctuation',
  'typo',
  'partial',
  'informal',
  'abbreviation',
  'trade_name',
  'former_name',
  'defined_term',
  'pronoun',
  'signer',
  'collective_term',
  'unbound_term',
  'place',
  'non_party_term',
] as const;
export type MentionStyle = (typeof MENTION_STYLES)[number];

export interface ScenarioMention {
  /** What a user or extraction system would send (REST, batch file, contract parties). */
  input: MentionInput;
  truth: MentionTruth;
  style: MentionStyle;
}

/** One row of the vendor master as structured data (the CSV holds the same values). */
export interface VendorRow {
  vendorId: string;
  name: string;
  taxId: string;
  registrationNumber: string;
  phone: string;
  email: string;
  iban: string;
  street: string;
  city: string;
  postalCode: string;
  country: string;
}

export type VendorEntityRef = { kind: 'counterparty'; id: string } | { kind: 'vendor_only'; id: string; name: string };

export interface VendorDuplicate {
  vendorIds: [string, string];
  /** The finding a correct reconciliation reports for the pair, given the evidence in the rows. */
  expectedFinding: 'same_entity' | 'same_or_affiliated';
  /** Whether the two rows really are one legal entity. */
  sameEntity: boolean;
  /** What the two rows share (for people reading the truth file). */
  shared: string[];
}

export interface VendorMasterTruth {
  rows: Array<{ vendorId: string; entity: VendorEntityRef }>;
  duplicates: VendorDuplicate[];
  /** Vendor rows of companies that never signed a contract. */
  vendorsWithoutContract: string[];
  /** Counterparties with contracts and no vendor row. */
  counterpartiesWithoutVendor: string[];
  /** Pairs of rows whose names differ only in legal form or jurisdiction: different entities, NOT duplicates. */
  distinctLookalikes: Array<[string, string]>;
}

export interface VendorMaster {
  /** Column names of the CSV, in order. */
  columns: string[];
  csv: string;
  rows: VendorRow[];
  truth: VendorMasterTruth;
}

export interface Scenario {
  seed: number;
  group: { name: string };
  ownEntities: OwnEntity[];
  counterparties: ScenarioCounterparty[];
  contracts: ScenarioContract[];
  mentions: ScenarioMention[];
  vendorMaster: VendorMaster;
}
