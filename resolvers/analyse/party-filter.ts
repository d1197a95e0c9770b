/**
 * The party filter: words that are not a party by themselves. Pronouns and role or collective words may be
 * bound to a party by the contract's definitions (needs_binding); signature-block labels, empty, numeric-only
 * and too-short strings never name a party (not_a_party). Word lists are common practice in contract drafting.
 */
import type { PartyStatus } from '../vocabulary.ts';
import { isDocumentReference } from './is-document-reference.ts';
import { isPlacePhrase } from './is-place-phrase.ts';
import { ROLE_MODIFIERS, ROLE_WORDS } from './role-words.ts';

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
