/**
 * Whether normalised name tokens name the document or one of its parts rather than a party: "this Agreement",
 * "the Effective Date", "Schedule 2", "Annex B-1", "the Master Services Agreement", "Amendment No. 3".
 * Word lists: document-terms.ts (common practice in contract drafting).
 */
import { DOCUMENT_NOUNS, DOCUMENT_OF_HEADS, DOCUMENT_PART_HEADS, DOCUMENT_TERMS } from './document-terms.ts';
import { normaliseTokens } from './normalise-name.ts';

let normalisedTerms: ReadonlySet<string> | null = null;

/** DOCUMENT_TERMS as analyseName's tokens spell them ("date d'effet" → "date deffet"), built once. */
function documentTerms(): ReadonlySet<string> {
  normalisedTerms ??= new Set([...DOCUMENT_TERMS].map((t) => normaliseTokens(t).join(' ')));
  return normalisedTerms;
}

/** Words that open a reference to a document without naming one ("this", "the present", "such"). */
const REFERENCE_OPENERS: ReadonlySet<string> = new Set([
  'the',
  'this',
  'these',
  'that',
  'those',
  'such',
  'said',
  'each',
  'any',
  'all',
  'present',
  'relevant',
  'applicable',
  'its',
  'their',
  'our',
  'your',
  'le',
  'la',
  'les',
  'der',
  'die',
  'das',
  'el',
  'il',
]);

/** Titles that end in these nouns are documents even without "the": "Master Services Agreement". */
const TITLE_NOUNS: ReadonlySet<string> = new Set(['agreement', 'agreements', 'contract', 'deed', 'amendment', 'addendum', 'indenture']);

/** Words a document's title runs to before its noun ("Master Software Licence and Services Agreement"). */
const MAX_TITLE_WORDS = 5;

/** Words before the number of a cited part ("Statement of Work 3"). */
const MAX_PART_WORDS = 3;

const ROMAN = /^x{0,2}(?:ix|iv|v?i{0,3})$/u;

/** "2", "4 2" (from "4.2"), "b", "ii", "no": what numbers a part of a document. */
function isLabel(token: string): boolean {
  if (/^\d+$/u.test(token) || token.length === 1) return true;
  if (token === 'no' || token === 'nr' || token === 'number' || token === 'bis') return true;
  return token.length <= 4 && ROMAN.test(token);
}

export function isDocumentReference(tokens: readonly string[]): boolean {
  let i = 0;
  while (i < tokens.length && REFERENCE_OPENERS.has(tokens[i] as string)) i++;
  const opened = i > 0;
  let rest = tokens.slice(i);
  if (rest.length === 0) return false;
  if (documentTerms().has(rest.join(' '))) return true;
  let labelled = false;
  while (rest.length > 1 && isLabel(rest[rest.length - 1] as string)) {
    rest = rest.slice(0, -1);
    labelled = true;
  }
  const last = rest[rest.length - 1] as string;
  // "Schedule 2", "Statement of Work 3"; a long name ending in "Part II" is a fund's or a firm's ("… Fund Part II").
  if (labelled && rest.length <= MAX_PART_WORDS && (DOCUMENT_PART_HEADS.has(last) || documentTerms().has(rest.join(' ')))) return true;
  // A title is short: "The Centre for Health Policy" is an organisation, "the Privacy Policy" a document.
  if (rest.length > MAX_TITLE_WORDS) return false;
  if (TITLE_NOUNS.has(last)) return true;
  // "this Deed of Variation", "the Letter of Intent": the noun comes first (short titles only, as above).
  if (rest.length >= 3 && rest[1] === 'of' && DOCUMENT_OF_HEADS.has(rest[0] as string)) return true;
  return opened && DOCUMENT_NOUNS.has(last);
}
