/**
 * VAT identification numbers with their country prefix. EU member states use ISO 3166-1 alpha-2 except
 * Greece, whose prefix is EL (a "GR" prefix is read as EL); XI is Northern Ireland, GB the UK, CH Switzerland
 * (UID "CHE-123.456.789 MWST", suffix dropped).
 *
 * Formats after the prefix, from memory of the European Commission's VIES help page ("9" a digit, "A" a letter,
 * "X" a letter or digit). A number that fits none is rejected with the formats expected.
 */
import { isLuhnValid } from './luhn.ts';
import { compactAlphanumeric, ok, problem, type SchemeResult } from './types.ts';

const VAT_FORMATS: Readonly<Record<string, readonly string[]>> = {
  AT: ['U99999999'],
  BE: ['0999999999', '1999999999'],
  BG: ['999999999', '9999999999'],
  CY: ['99999999A'],
  CZ: ['99999999', '999999999', '9999999999'],
  DE: ['999999999'],
  DK: ['99999999'],
  EE: ['999999999'],
  EL: ['999999999'],
  ES: ['X9999999X'],
  FI: ['99999999'],
  FR: ['XX999999999'],
  HR: ['99999999999'],
  HU: ['99999999'],
  IE: ['9999999A', '9999999AA', '9A99999A'],
  IT: ['99999999999'],
  LT: ['999999999', '999999999999'],
  LU: ['99999999'],
  LV: ['99999999999'],
  MT: ['99999999'],
  NL: ['999999999B99'],
  PL: ['9999999999'],
  PT: ['999999999'],
  RO: ['99', '999', '9999', '99999', '999999', '9999999', '99999999', '999999999', '9999999999'],
  SE: ['9999999999' + '01'],
  SI: ['99999999'],
  SK: ['9999999999'],
  XI: ['999999999', '999999999999', 'GD999', 'HA999'],
  GB: ['999999999', '999999999999', 'GD999', 'HA999'],
  CH: ['E999999999'],
};

export const VAT_PREFIXES: readonly string[] = Object.keys(VAT_FORMATS);

function fits(body: string, format: string): boolean {
  if (body.length !== format.length) return false;
  for (let i = 0; i < body.length; i++) {
    const c = body.charCodeAt(i);
    const digit = c >= 48 && c <= 57;
    const letter = c >= 65 && c <= 90;
    const f = format[i]!;
    if (f === '9' ? !digit : f === 'A' ? !letter : f === 'X' ? !(digit || letter) : body[i] !== f) return false;
  }
  return true;
}

/** Country prefix of a VAT number: "GR" → "EL". */
export function vatPrefixForCountry(country: string): string {
  const upper = country.slice(0, 2).toUpperCase();
  return upper === 'GR' ? 'EL' : upper;
}

/**
 * The French VAT key: (12 + 3 × (SIREN mod 97)) mod 97 (from memory); numeric keys only. Letter keys exist
 * for some entities and are accepted unchecked.
 */
export function frenchVatKey(siren: string): string {
  const key = (12 + 3 * (Number(siren) % 97)) % 97;
  return key < 10 ? `0${key}` : String(key);
}

export function normaliseVat(value: string, defaultCountry?: string): SchemeResult {
  let compact = compactAlphanumeric(value.replace(/^\s*(?:vat|tva|ust-?idnr\.?|btw|iva|mwst)\s*(?:no\.?|nr\.?)?\s*:?/i, ''));
  if (compact.length === 0) return problem('is empty');
  let prefix = compact.slice(0, 2);
  if (prefix === 'GR') prefix = 'EL';
  if (VAT_FORMATS[prefix] !== undefined && /^[A-Z]{2}$/.test(compact.slice(0, 2))) {
    compact = compact.slice(2);
  } else if (defaultCountry) {
    prefix = vatPrefixForCountry(defaultCountry);
    if (VAT_FORMATS[prefix] === undefined) return problem(`has no known prefix and default country ${defaultCountry} has no VAT format here`);
  } else if (/^[A-Z]{2}/.test(compact)) {
    return problem(`prefix ${compact.slice(0, 2)} is not a VAT prefix known here (${VAT_PREFIXES.join(', ')})`);
  } else {
    return problem(`needs a country prefix (one of ${VAT_PREFIXES.join(', ')}) or a default country`);
  }
  if (prefix === 'CH') {
    for (const suffix of ['MWST', 'TVA', 'IVA']) if (compact.endsWith(suffix)) compact = compact.slice(0, -suffix.length);
  }
  const formats = VAT_FORMATS[prefix]!;
  if (!formats.some((f) => fits(compact, f))) {
    return problem(`${prefix} numbers have the form ${formats.map((f) => prefix + f).join(' or ')} (9 digit, A letter, X either); got ${prefix}${compact}`);
  }
  if (prefix === 'FR' && /^\d{11}$/.test(compact)) {
    const siren = compact.slice(2);
    if (isLuhnValid(siren) && frenchVatKey(siren) !== compact.slice(0, 2)) {
      return problem(`French key ${compact.slice(0, 2)} does not match SIREN ${siren} (expected ${frenchVatKey(siren)})`);
    }
  }
  return ok(prefix + compact);
}

/** The SIREN inside a canonical French VAT number, when it is one. */
export function sirenFromFrenchVat(vat: string): string | null {
  if (!vat.startsWith('FR') || vat.length !== 13) return null;
  const siren = vat.slice(4);
  return /^\d{9}$/.test(siren) && isLuhnValid(siren) ? siren : null;
}
