/**
 * The party filter: words that are not a party by themselves. Pronouns and role or collective words may be
 * bound to a party by the contract's definitions (needs_binding); signature-block labels, empty, numeric-only
 * and too-short strings never name a party (not_a_party). Word lists are common practice in contract drafting.
 */
import type { PartyStatus } from '../vocabulary.ts';
import { isDocumentReference } from './is-document-reference.ts';
import { isPlacePhrase } from './is-place-phrase.ts';

/** Personal pronouns and possessives a contract uses for its parties. */
export const PRONOUNS: ReadonlySet<string> = new Set([
  'we',
  'us',
  'our',
  'ours',
  'ourselves',
  'you',
  'your',
  'yours',
  'yourself',
  'yourselves',
  'i',
  'me',
  'my',
  'mine',
  'they',
  'them',
  'their',
  'theirs',
  'it',
  'its',
  'he',
  'him',
  'his',
  'she',
  'her',
  'hers',
]);

/** Generic roles and collective words ("the Company", "Licensee", "the Parties", "its Affiliates"). */
export const ROLE_WORDS: ReadonlySet<string> = new Set([
  'company',
  'companies',
  'party',
  'parties',
  'counterparty',
  'counterparties',
  'affiliate',
  'affiliates',
  'subsidiary',
  'subsidiaries',
  'group',
  'licensee',
  'licensees',
  'licensor',
  'licensors',
  'supplier',
  'suppliers',
  'customer',
  'customers',
  'client',
  'clients',
  'buyer',
  'buyers',
  'seller',
  'sellers',
  'vendor',
  'vendors',
  'purchaser',
  'purchasers',
  'contractor',
  'contractors',
  'subcontractor',
  'subcontractors',
  'consultant',
  'consultants',
  'provider',
  'providers',
  'recipient',
  'recipients',
  'discloser',
  'lessor',
  'lessee',
  'landlord',
  'tenant',
  'borrower',
  'borrowers',
  'lender',
  'lenders',
  'guarantor',
  'guarantors',
  'employer',
  'employee',
  'distributor',
  'distributors',
  'agent',
  'agents',
  'principal',
  'reseller',
  'resellers',
  'manufacturer',
  'partner',
  'partners',
  'member',
  'members',
  'shareholder',
  'shareholders',
  'investor',
  'investors',
  'assignee',
  'assignor',
  'owner',
  'owners',
  'user',
  'users',
  'licensees',
  'franchisor',
  'franchisee',
  'publisher',
  'author',
  'contractee',
  'issuer',
  'holder',
  'holders',
  'beneficiary',
  'beneficiaries',
  'trustee',
  'trustees',
  'sponsor',
  'institution',
  'undersigned',
  'signatory',
  'signatories',
  'representative',
  'representatives',
  'successors',
  'assigns',
  'service',
  'services',
  'disclosing',
  'receiving',
  'third',
  'other',
  'indemnitee',
  'indemnitor',
  'entity',
  'entities',
  'organisation',
  'organization',
  'business',
  'firm',
  'counsel',
  'operator',
  'producer',
  'carrier',
  'shipper',
  // Data-protection roles (GDPR Art. 4 and 28 and the standard contractual clauses name them; issue 16).
  'controller',
  'controllers',
  'processor',
  'processors',
  'subprocessor',
  'subprocessors',
  'exporter',
  'exporters',
  'importer',
  'importers',
  'subject',
  'subjects',
  // Other roles contracts define for a party (issue 16; common practice).
  'sublicensee',
  'sublicensees',
  'sublicensor',
  'subtenant',
  'sublessee',
  'sublessor',
  'insurer',
  'insured',
  'reinsurer',
  'broker',
  'servicer',
  'originator',
  'arranger',
  'underwriter',
  'underwriters',
  'obligor',
  'obligors',
  'debtor',
  'debtors',
  'creditor',
  'creditors',
  'pledgor',
  'pledgee',
  'chargor',
  'chargee',
  'mortgagor',
  'mortgagee',
  'grantor',
  'grantee',
  'transferor',
  'transferee',
  'custodian',
  'depositary',
  'registrar',
  'administrator',
  'manager',
  'developer',
  'integrator',
  'subscriber',
  'subscribers',
  'merchant',
  'collaborator',
  'collaborators',
  'concessionaire',
  'contracting',
  'authority',
  'host',
  'hirer',
  'charterer',
  'owner',
  'consignor',
  'consignee',
  'forwarder',
  'sender',
  'payer',
  'payee',
  'vendee',
  'offeror',
  'offeree',
  'promoter',
  'artist',
  'performer',
  'talent',
  'client',
  'engager',
  'freelancer',
  'intermediary',
  'introducer',
  'referrer',
  'lessors',
  'lessees',
  'landlords',
  'tenants',
  'employers',
  'employees',
]);

/**
 * Words that qualify a role without naming anyone ("Sub-processor", "Data Exporter", "Paying Agent", "Joint
 * Controller"): they neither make a phrase a role nor stop it being one. Common practice. Words that also make up
 * firm names ("Exclusive Partners", "Prime Partners", "Lead Partners" are names in the LEI data) are not here.
 */
const ROLE_MODIFIERS: ReadonlySet<string> = new Set([
  'sub',
  'data',
  'joint',
  'independent',
  'paying',
  'escrow',
  'security',
  'collateral',
  'facility',
  'administrative',
  'managing',
  'authorised',
  'authorized',
  'original',
  'existing',
  'approved',
  'permitted',
  'designated',
  'appointed',
  'principal',
  'accountable',
  'hiring',
  'selling',
  'buying',
  'purchasing',
  'supplying',
  'sending',
  'importing',
  'exporting',
  'transferring',
  'processing',
  'controlling',
  'outgoing',
  'incoming',
  'continuing',
  'retiring',
]);

/** Words that may open a role phrase without naming anyone ("the", "each", "either", "its"). */
const DETERMINERS: ReadonlySet<string> = new Set([
  'the',
  'a',
  'an',
  'each',
  'either',
  'both',
  'all',
  'any',
  'every',
  'such',
  'said',
  'other',
  'respective',
  'its',
  'their',
  'our',
  'your',
  'his',
  'her',
  'my',
  'this',
  'that',
  'these',
  'those',
  'and',
  'or',
  'of',
  'to',
  'relevant',
  'applicable',
  'affected',
  'non',
  'defaulting',
  'first',
  'second',
  'named',
  'above',
  'aforementioned',
]);

/** Signature-block labels (By:, Name:, Title:) and their neighbours. */
export const SIGNATURE_LABELS: ReadonlySet<string> = new Set([
  'by',
  'name',
  'title',
  'signature',
  'signed',
  'sign',
  'date',
  'dated',
  'its',
  'witness',
  'print name',
  'printed name',
  'position',
  'address',
  'email',
  'e mail',
  'attention',
  'attn',
  'per',
  'for and on behalf of',
  'on behalf of',
]);

/**
 * Why a name is not a party by itself. `place`: a country, subdivision or governing-law/venue phrase;
 * `document`: the contract or a part of it ("this Agreement", "Schedule 2", "the Effective Date").
 */
export type PartyReason = 'empty' | 'numeric' | 'too_short' | 'signature_label' | 'pronoun' | 'role_word' | 'place' | 'document';

export interface PartyVerdict {
  status: PartyStatus;
  reason: PartyReason | null;
}

/** Minimum letters and digits a party name has (one letter is an initial, not a name). Common practice. */
export const MIN_NAME_CHARS = 2;

/**
 * `text` is the primary name as written; `tokens` its normalised tokens (with legal form), `hasLegalForm`
 * whether a designator was found (a designator makes "Licensee Holdings Ltd" a party).
 */
export function partyVerdict(text: string, tokens: readonly string[], hasLegalForm: boolean): PartyVerdict {
  if (tokens.length === 0) return { status: 'not_a_party', reason: 'empty' };
  if (isSignatureLabel(text, tokens)) return { status: 'not_a_party', reason: 'signature_label' };
  let chars = 0;
  let letters = 0;
  for (const t of tokens) {
    chars += t.length;
    for (let i = 0; i < t.length; i++) {
      const c = t.charCodeAt(i);
      if (!(c >= 0x30 && c <= 0x39)) letters++;
    }
  }
  if (letters === 0) return { status: 'not_a_party', reason: 'numeric' };
  if (!hasLegalForm && tokens.every((t) => PRONOUNS.has(t) || t === 'and' || t === 'or')) {
    return { status: 'needs_binding', reason: 'pronoun' }; // before the length check: "I" is a pronoun
  }
  if (chars < MIN_NAME_CHARS) return { status: 'not_a_party', reason: 'too_short' };
  if (hasLegalForm) return { status: 'party', reason: null };
  // Before roles: "the Services" is the subject matter, "the State of New York" a place, never a role to bind.
  if (!isShortAcronym(text)) {
    if (isPlacePhrase(tokens)) return { status: 'not_a_party', reason: 'place' };
    if (isDocumentReference(tokens)) return { status: 'not_a_party', reason: 'document' };
  }
  if (isRolePhrase(tokens)) return { status: 'needs_binding', reason: 'role_word' };
  return { status: 'party', reason: null };
}

/**
 * "ALBA", "JURA", "DPA": one word of at most four capitals is more often an organisation's acronym than a place or
 * a document (ROR lists such acronyms as organisation names).
 */
const MAX_ACRONYM = 4;

function isShortAcronym(text: string): boolean {
  const word = text.trim();
  return word.length <= MAX_ACRONYM && /^\p{Lu}+$/u.test(word);
}

function isRolePhrase(tokens: readonly string[]): boolean {
  let i = 0;
  while (i < tokens.length && DETERMINERS.has(tokens[i] as string)) i++;
  if (i === tokens.length) return false;
  let roles = 0;
  for (; i < tokens.length; i++) {
    const t = tokens[i] as string;
    if (ROLE_WORDS.has(t) || PRONOUNS.has(t) || DETERMINERS.has(t) || ROLE_MODIFIERS.has(t)) {
      if (ROLE_WORDS.has(t)) roles++;
      continue;
    }
    // "Party A", "Lender 2": a role word followed by a one-character label.
    if (roles > 0 && i === tokens.length - 1 && t.length === 1) continue;
    return false;
  }
  return roles > 0;
}

function isSignatureLabel(text: string, tokens: readonly string[]): boolean {
  const colon = text.indexOf(':');
  if (colon > 0) {
    const label = text
      .slice(0, colon)
      .trim()
      .toLowerCase()
      .replace(/[^a-z]+/g, ' ')
      .trim();
    if (SIGNATURE_LABELS.has(label)) return true;
  }
  // A bare label with a line to sign on: "By: ______", "Name", "Title".
  if (tokens.length > 2) return false;
  const joined = tokens.length === 1 ? (tokens[0] as string) : tokens.join(' ');
  return SIGNATURE_LABELS.has(joined) && !PRONOUNS.has(joined);
}
