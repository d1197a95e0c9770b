/**
 * The shared vocabulary of cpreg: every stage, service and route speaks these words.
 *
 * Glossary (kept in step with DEVELOPERS.md):
 * - mention: one occurrence of a party name as a source system sent it (a row, an API call, a contract party).
 * - counterparty: the canonical record of one real-world company or person that we contract with.
 * - own entity: a legal entity of the organisation that runs cpreg; never a counterparty.
 * - defined term: a word a contract defines for one of its parties ("the Licensee"); it binds only in that contract.
 * - collective term: a defined term for a set of parties ("the Parties"); it binds no single party.
 * - strong identifier: an identifier that names exactly one legal entity (LEI, VAT, registration numbers).
 * - cannot-link: a recorded fact that two records are different entities; every later decision honours it.
 *
 * Conventions: JSON keys are camelCase; enumerated values are snake_case.
 */

/** Identifier schemes. One list; a new scheme is added here. */
export const IDENTIFIER_SCHEMES = [
  'lei',
  'vat',
  'us_ein',
  'gb_company',
  'de_register',
  'fr_siren',
  'nl_kvk',
  'se_org',
  'au_acn',
  'au_abn',
  'phone',
  'email_domain',
  'web_domain',
  'iban',
  'other',
] as const;
export type IdentifierScheme = (typeof IDENTIFIER_SCHEMES)[number];

/** Strong schemes name one legal entity: unique among active counterparties. */
export const STRONG_SCHEMES: ReadonlySet<IdentifierScheme> = new Set<IdentifierScheme>([
  'lei',
  'vat',
  'us_ein',
  'gb_company',
  'de_register',
  'fr_siren',
  'nl_kvk',
  'se_org',
  'au_acn',
  'au_abn',
]);

/** Shared schemes may be held by several counterparties (affiliates share phones, domains, bank accounts). */
export function isStrongScheme(scheme: IdentifierScheme): boolean {
  return STRONG_SCHEMES.has(scheme);
}

export interface Identifier {
  scheme: IdentifierScheme;
  value: string;
  /** Only for scheme `other`: what the identifier is. */
  label?: string;
}

/** A mention as it arrives (REST, CSV/NDJSON batch, or a contract's parties clause). */
export interface MentionInput {
  source: string;
  externalId: string;
  text: string;
  contract?: { source: string; externalId: string };
  role?: string;
  /** ISO 3166-1 alpha-2 or ISO 3166-2 (e.g. "US-DE"). */
  country?: string;
  address?: string;
  identifiers?: Identifier[];
}

/** The longest name a mention, alias or counterparty may carry (characters): the API schemas, the register and the CLI check it. */
export const MAX_NAME_LENGTH = 1000;

/** The longest source, external id or role (characters): the API schemas and the register check it. */
export const MAX_ID_LENGTH = 300;

/**
 * The longest contract title (characters): the API schemas and the register check it. A contract search text (`q`)
 * is held to it too: a title is the longest thing it can match.
 */
export const MAX_TITLE_LENGTH = 1000;

/**
 * One string for a mention's identity (source, externalId), as a map key. U+0000 separates the parts: the
 * register refuses it in stored text, so no two identities share a key.
 */
export function mentionKey(source: string, externalId: string): string {
  return `${source}\u0000${externalId}`;
}

/** What the analysis of one name says about it being a party. */
export const PARTY_STATUSES = ['party', 'needs_binding', 'not_a_party'] as const;
export type PartyStatus = (typeof PARTY_STATUSES)[number];

/** How the resolution of one mention ended. */
export const RESOLUTION_STATUSES = [
  'linked',
  'review',
  'new',
  'own_entity',
  'not_a_party',
  'unbound_term',
  'collective_term',
  'set_aside',
  'withdrawn',
  'rejected',
] as const;
export type ResolutionStatus = (typeof RESOLUTION_STATUSES)[number];

export const COUNTERPARTY_STATUSES = ['active', 'merged'] as const;
export type CounterpartyStatus = (typeof COUNTERPARTY_STATUSES)[number];

export const HISTORY_EVENT_TYPES = [
  'created',
  'linked',
  'unlinked',
  'set_aside',
  'withdrawn',
  'mention_changed',
  'merged',
  'split',
  'renamed',
  'name_added',
  'name_removed',
  'identifier_added',
  'identifier_removed',
  'jurisdiction_changed',
  'relation_added',
  'relation_removed',
  'review_decided',
  'undone',
  'forgotten',
] as const;
export type HistoryEventType = (typeof HISTORY_EVENT_TYPES)[number];

export const RECONCILIATION_FINDINGS = [
  'matched_with_contracts',
  'vendor_without_contract',
  'counterparty_without_vendor',
  'same_entity',
  'same_or_affiliated',
] as const;
export type ReconciliationFinding = (typeof RECONCILIATION_FINDINGS)[number];

export const NAME_KINDS = ['legal', 'trade', 'former', 'also_known_as', 'observed'] as const;
export type NameKind = (typeof NAME_KINDS)[number];

/** The kinds of other name one of our own entities may be declared with (a name seen in passing is no declaration). */
export const OWN_ENTITY_NAME_KINDS = ['trade', 'former', 'also_known_as', 'legal'] as const satisfies readonly NameKind[];
export type OwnEntityNameKind = (typeof OWN_ENTITY_NAME_KINDS)[number];

/** Aliases a single name string can introduce ("X d/b/a Y"). */
export type AliasKind = 'trade' | 'former' | 'also_known_as';

/** Relations between counterparties. They are never merges. */
export const RELATION_TYPES = ['parent_of', 'successor_of', 'affiliate_of'] as const;
export type RelationType = (typeof RELATION_TYPES)[number];

export type EntityKind = 'organisation' | 'person' | 'unknown';

export const API_SCOPES = ['read', 'write', 'admin'] as const;
export type ApiScope = (typeof API_SCOPES)[number];
