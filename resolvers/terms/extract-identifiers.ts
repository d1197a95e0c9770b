/**
 * Registration and tax identifiers named in a party's descriptive phrase ("company number 04417782",
 * "HRB 20931", "RCS Nantes 533 214 907", "ACN 004 085 616", "organisation number 559912-3381", VAT, EIN, LEI).
 * Only extraction: the value is kept as written with its spacing normalised; validation (check digits)
 * belongs to resolvers/identifiers.
 */
import type { IdentifierScheme } from '../vocabulary.ts';
import type { ContractIdentifier } from './types.ts';
import { isWordChar } from './text-scan.ts';

interface Cue {
  words: string;
  /** The scheme, or a function of the jurisdiction when the cue is generic ("registration number"). */
  scheme: IdentifierScheme | ((jurisdiction: string | undefined) => IdentifierScheme);
  label?: string;
}

const byJurisdiction = (j: string | undefined): IdentifierScheme => {
  const country = j?.slice(0, 2);
  if (country === 'GB') return 'gb_company';
  if (country === 'SE') return 'se_org';
  if (country === 'NL') return 'nl_kvk';
  if (country === 'AU') return 'au_acn';
  return 'other';
};

// Longer cues first so "vat registration number" wins over "registration number".
const CUES: Cue[] = [
  { words: 'companies house number', scheme: 'gb_company' },
  { words: 'company registration number', scheme: byJurisdiction },
  { words: 'company number', scheme: 'gb_company' },
  { words: 'company no', scheme: 'gb_company' },
  { words: 'registered number', scheme: byJurisdiction },
  { words: 'registered no', scheme: byJurisdiction },
  { words: 'vat registration number', scheme: 'vat' },
  { words: 'vat number', scheme: 'vat' },
  { words: 'vat no', scheme: 'vat' },
  { words: 'vat id', scheme: 'vat' },
  { words: 'vat', scheme: 'vat' },
  { words: 'ust-idnr', scheme: 'vat' },
  { words: 'ust-id', scheme: 'vat' },
  { words: 'numéro de tva', scheme: 'vat' },
  { words: 'tva intracommunautaire', scheme: 'vat' },
  { words: 'partita iva', scheme: 'vat' },
  { words: 'registration number', scheme: byJurisdiction },
  { words: 'hrb', scheme: 'de_register' },
  { words: 'hra', scheme: 'de_register' },
  { words: 'rcs', scheme: 'fr_siren' },
  { words: 'siren', scheme: 'fr_siren' },
  { words: 'australian company number', scheme: 'au_acn' },
  { words: 'acn', scheme: 'au_acn' },
  { words: 'australian business number', scheme: 'au_abn' },
  { words: 'abn', scheme: 'au_abn' },
  { words: 'organisation number', scheme: 'se_org' },
  { words: 'organization number', scheme: 'se_org' },
  { words: 'corporate identity number', scheme: 'se_org' },
  { words: 'org. nr', scheme: 'se_org' },
  { words: 'org.nr', scheme: 'se_org' },
  { words: 'org nr', scheme: 'se_org' },
  { words: 'organisationsnummer', scheme: 'se_org' },
  { words: 'employer identification number', scheme: 'us_ein' },
  { words: 'federal tax id', scheme: 'us_ein' },
  { words: 'ein', scheme: 'us_ein' },
  { words: 'legal entity identifier', scheme: 'lei' },
  { words: 'lei', scheme: 'lei' },
  { words: 'kvk', scheme: 'nl_kvk' },
  { words: 'chamber of commerce', scheme: 'nl_kvk' },
  { words: 'under number', scheme: byJurisdiction },
  { words: 'with number', scheme: byJurisdiction },
  { words: 'corporate number', scheme: 'other', label: 'jp_corporate_number' },
];

/** Shapes after spacing is removed (common practice for each register's printed form). */
const SHAPES: Partial<Record<IdentifierScheme, RegExp>> = {
  gb_company: /^(?:[A-Z]{2}\d{6}|\d{6,8})$/,
  de_register: /^\d{1,6}(?: ?[A-Z])?$/,
  fr_siren: /^\d{9}$/,
  au_acn: /^\d{9}$/,
  au_abn: /^\d{11}$/,
  se_org: /^\d{6}-?\d{4}$/,
  vat: /^[A-Z]{2}[\dA-Z]{2,13}$|^\d{8,12}$/,
  us_ein: /^\d{2}-?\d{7}$/,
  lei: /^[\dA-Z]{18}\d{2}$/,
  nl_kvk: /^\d{8}$/,
  other: /^[\dA-Z][\dA-Z-]{3,24}$/,
};

/** How far after a cue the value may start ("RCS de Nantes sous le numéro 533 214 907"). */
const VALUE_WINDOW = 45;

function isDigit(ch: string | undefined): boolean {
  return ch !== undefined && ch >= '0' && ch <= '9';
}
function isUpper(ch: string | undefined): boolean {
  return ch !== undefined && ch >= 'A' && ch <= 'Z';
}

/** Reads the value after a cue: from the first digit (with a two-letter prefix when one stands before it). */
function readValue(phrase: string, from: number, allowPrefix: boolean): string | null {
  const stop = Math.min(phrase.length, from + VALUE_WINDOW);
  let i = from;
  while (i < stop && !isDigit(phrase[i])) {
    if (phrase[i] === ';' || phrase[i] === '(' || phrase[i] === ')') return null;
    i++;
  }
  if (i >= stop) return null;
  let start = i;
  if (allowPrefix) {
    if (isUpper(phrase[i - 1]) && isUpper(phrase[i - 2]) && !isWordChar(phrase[i - 3])) start = i - 2;
    else if (phrase[i - 1] === ' ' && isUpper(phrase[i - 2]) && isUpper(phrase[i - 3]) && !isWordChar(phrase[i - 4])) start = i - 3;
  }
  let end = i;
  let out = phrase.slice(start, i).replace(' ', '');
  while (end < phrase.length && out.length < 30) {
    const ch = phrase[end] as string;
    if (isDigit(ch) || isUpper(ch)) out += ch;
    else if ((ch === '-' || ch === '.') && isDigit(phrase[end + 1])) out += ch === '-' ? '-' : '';
    else if ((ch === ' ' || ch === '\u00a0') && (isDigit(phrase[end + 1]) || (isUpper(phrase[end + 1]) && !isWordChar(phrase[end + 2])))) {
      // spacing inside a number ("533 214 907"); a single trailing letter is a register suffix ("HRB 1234 B")
    } else break;
    end++;
  }
  return out.length > 0 ? out : null;
}

const FIRST_LETTERS = new Set(CUES.map((c) => c.words[0]));

function cueAt(lower: string, i: number): Cue | undefined {
  if (!FIRST_LETTERS.has(lower[i]) || isWordChar(lower[i - 1])) return undefined;
  for (const cue of CUES) {
    if (lower.startsWith(cue.words, i) && !isWordChar(lower[i + cue.words.length])) return cue;
  }
  return undefined;
}

export function extractIdentifiers(phrase: string, jurisdiction: string | undefined): ContractIdentifier[] {
  const lower = phrase.toLowerCase();
  if (lower.length !== phrase.length) return []; // case folding changed lengths: indices would not line up
  const found: ContractIdentifier[] = [];
  for (let i = 0; i < lower.length; i++) {
    const cue = cueAt(lower, i);
    if (cue === undefined) continue;
    const scheme = typeof cue.scheme === 'function' ? cue.scheme(jurisdiction) : cue.scheme;
    const raw = readValue(phrase, i + cue.words.length, scheme === 'vat' || scheme === 'gb_company' || scheme === 'lei');
    i += cue.words.length - 1;
    if (raw === null) continue;
    const value = formatValue(scheme, cue, raw, phrase);
    if (value === null) continue;
    const id: ContractIdentifier = { scheme, value };
    if (scheme === 'other') id.label = cue.label ?? 'registration_number';
    if (!found.some((f) => f.scheme === id.scheme && f.value === id.value)) found.push(id);
  }
  return found;
}

function formatValue(scheme: IdentifierScheme, cue: Cue, raw: string, phrase: string): string | null {
  const compact = raw.replace(/\s/gu, '');
  if (scheme === 'de_register') {
    const m = /^(\d{1,6})([A-Z]?)$/.exec(compact);
    if (m === null) return null;
    const court = registerCourt(phrase);
    const number = `${cue.words.toUpperCase()} ${m[1]}${m[2] ? ` ${m[2]}` : ''}`;
    return court === undefined ? number : `${court} ${number}`;
  }
  const shape = SHAPES[scheme];
  return shape !== undefined && shape.test(compact) ? compact : null;
}

/** The register court of a German register number: "Amtsgericht München", "Local Court of Munich". */
function registerCourt(phrase: string): string | undefined {
  const lower = phrase.toLowerCase();
  for (const cue of ['amtsgericht ', 'amtsgerichts ', 'local court of ', 'district court of ', 'local court ', 'registergericht ']) {
    const at = lower.indexOf(cue);
    if (at < 0) continue;
    let end = at + cue.length;
    while (end < phrase.length && (isWordChar(phrase[end]) || phrase[end] === '-' || phrase[end] === '.')) end++;
    const place = phrase.slice(at + cue.length, end).replace(/\.$/u, '');
    if (place.length > 1) return `${cue.startsWith('amtsgericht') ? 'Amtsgericht' : 'Local Court'} ${place}`;
  }
  return undefined;
}
