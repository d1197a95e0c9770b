/**
 * Registration and tax numbers whose rule is a length and, where one is published, a check digit.
 * Each normaliser returns the canonical digits (or the scheme's canonical layout) or what is wrong.
 */
import { isLuhnValid } from './luhn.ts';
import { labelledDigits } from './labels.ts';
import { compactAlphanumeric, isDigits, ok, problem, type SchemeResult } from './types.ts';

// ── AU ACN ────────────────────────────────────────────────────────────────────────────────────────
/**
 * ACN check digit, as ASIC publishes it: weights 8..1 on the first eight digits, remainder of the sum
 * by 10, complement to 10 (10 becomes 0).
 */
export function acnCheckDigit(firstEight: string): number {
  let sum = 0;
  for (let i = 0; i < 8; i++) sum += (firstEight.charCodeAt(i) - 48) * (8 - i);
  return (10 - (sum % 10)) % 10;
}

export function normaliseAuAcn(value: string): SchemeResult {
  const digits = labelledDigits(value, ['acn', 'arbn', 'arsn']);
  if (digits === null) return problem('may contain only digits, spaces and the label "ACN"');
  if (digits.length !== 9) return problem(`must have 9 digits, found ${digits.length}`);
  const expected = acnCheckDigit(digits.slice(0, 8));
  if (expected !== digits.charCodeAt(8) - 48) return problem(`check digit is ${digits[8]}, ASIC's algorithm gives ${expected}`);
  return ok(digits);
}

// ── AU ABN ────────────────────────────────────────────────────────────────────────────────────────
const ABN_WEIGHTS = [10, 1, 3, 5, 7, 9, 11, 13, 15, 17, 19];

/** ATO's algorithm: subtract 1 from the first digit, weigh, sum; a valid ABN's sum is a multiple of 89. */
export function abnWeightedSum(digits: string): number {
  let sum = 0;
  for (let i = 0; i < 11; i++) {
    const d = digits.charCodeAt(i) - 48 - (i === 0 ? 1 : 0);
    sum += d * ABN_WEIGHTS[i]!;
  }
  return sum;
}

export function isValidAbn(digits: string): boolean {
  return digits.length === 11 && isDigits(digits) && digits[0] !== '0' && abnWeightedSum(digits) % 89 === 0;
}

export function normaliseAuAbn(value: string): SchemeResult {
  const digits = labelledDigits(value, ['abn']);
  if (digits === null) return problem('may contain only digits, spaces and the label "ABN"');
  if (digits.length !== 11) return problem(`must have 11 digits, found ${digits.length}`);
  if (!isValidAbn(digits)) return problem('fails the ATO mod-89 check (the weighted sum is not a multiple of 89)');
  return ok(digits);
}

// ── FR SIREN / SIRET / RCS ─────────────────────────────────────────────────────────────────────────
/**
 * SIREN: 9 digits with a Luhn check (INSEE). Accepted as written in an RCS mention ("RCS Lyon B 123 456 782",
 * "123 456 782 R.C.S. Lyon") or as a SIRET (14 digits = SIREN + NIC, Luhn over all 14), whose SIREN is kept:
 * the SIRET names an establishment, the SIREN the legal entity.
 */
export function normaliseFrSiren(value: string): SchemeResult {
  let digits = '';
  let letters = '';
  for (const ch of value) {
    if (ch >= '0' && ch <= '9') digits += ch;
    else if (/\p{L}/u.test(ch)) letters += ch;
    else if (!' .-/,:\u00a0'.includes(ch)) return problem(`unexpected character "${ch}"`);
  }
  const upper = letters.toUpperCase();
  if (upper.length > 0 && !upper.includes('RCS') && !upper.startsWith('SIREN') && !upper.startsWith('SIRET')) {
    return problem('letters are allowed only in an RCS mention ("RCS <city> B 123 456 782") or the labels SIREN/SIRET');
  }
  if (digits.length === 14) {
    // La Poste's SIRETs follow another rule (from memory); they are rare among counterparties, so the SIREN part decides.
    const siren = digits.slice(0, 9);
    if (!isLuhnValid(siren)) return problem(`the SIREN part ${siren} of the SIRET fails the Luhn check`);
    return ok(siren);
  }
  if (digits.length !== 9) return problem(`a SIREN has 9 digits (a SIRET 14), found ${digits.length}`);
  if (!isLuhnValid(digits)) return problem('fails the Luhn check (INSEE)');
  return ok(digits);
}

// ── SE organisationsnummer ─────────────────────────────────────────────────────────────────────────
/** 10 digits (NNNNNN-NNNN), Luhn over all ten; a 12-digit form with the "16" century prefix is accepted. */
export function normaliseSeOrg(value: string): SchemeResult {
  let digits = labelledDigits(value, ['organisationsnummer', 'org.nr.', 'org.nr', 'orgnr', 'org nr']);
  if (digits === null) return problem('may contain only digits, a dash and the label "Org.nr"');
  if (digits.length === 12 && digits.startsWith('16')) digits = digits.slice(2);
  if (digits.length !== 10) return problem(`must have 10 digits, found ${digits.length}`);
  if (!isLuhnValid(digits)) return problem('fails the Luhn check');
  return ok(digits);
}

// ── NL KvK ───────────────────────────────────────────────────────────────────────────────────────────
export function normaliseNlKvk(value: string): SchemeResult {
  const digits = labelledDigits(value, ['kvk-nummer', 'kvk nummer', 'kvk', 'kamer van koophandel']);
  if (digits === null) return problem('may contain only digits, spaces and the label "KvK"');
  if (digits.length !== 8) return problem(`must have 8 digits, found ${digits.length}`);
  return ok(digits);
}

// ── US EIN ───────────────────────────────────────────────────────────────────────────────────────────
/** Nine digits, written NN-NNNNNNN. The prefix 00 is never issued (common practice). */
export function normaliseUsEin(value: string): SchemeResult {
  const digits = labelledDigits(value, ['ein', 'fein', 'tin']);
  if (digits === null) return problem('may contain only digits, a dash and the label "EIN"');
  if (digits.length !== 9) return problem(`must have 9 digits (NN-NNNNNNN), found ${digits.length}`);
  if (digits.startsWith('00')) return problem('prefix 00 is never issued');
  return ok(`${digits.slice(0, 2)}-${digits.slice(2)}`);
}

// ── GB company number ────────────────────────────────────────────────────────────────────────────────
/**
 * Companies House numbers have 8 characters: digits zero-padded on the left ("123456" → "00123456"), or a
 * two-letter prefix (SC Scotland, NI Northern Ireland, OC LLP, …) and 6 zero-padded digits.
 */
export function normaliseGbCompany(value: string): SchemeResult {
  let text = value.trim();
  const lower = text.toLowerCase();
  for (const label of ['company number', 'company no.', 'company no', 'registered number', 'reg. no.', 'crn']) {
    if (lower.startsWith(label)) {
      text = text.slice(label.length);
      break;
    }
  }
  const compact = compactAlphanumeric(text);
  if (compact.length === 0) return problem('is empty');
  const prefix = compact.slice(0, 2);
  const isLetterPrefix = /^[A-Z]{2}$/.test(prefix);
  const digits = isLetterPrefix ? compact.slice(2) : compact;
  if (!isDigits(digits)) return problem('must be digits, or two letters followed by digits');
  const width = isLetterPrefix ? 6 : 8;
  if (digits.length > width) return problem(`has ${digits.length} digits${isLetterPrefix ? ' after its prefix' : ''}, at most ${width}`);
  const padded = digits.padStart(width, '0');
  if (/^0+$/.test(padded)) return problem('cannot be all zeros');
  return ok(isLetterPrefix ? prefix + padded : padded);
}
