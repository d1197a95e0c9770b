import type { Identifier } from '../vocabulary.ts';

export type NormaliseResult = { ok: true; identifier: Identifier } | { ok: false; reason: string };

export interface NormaliseOptions {
  /** ISO 3166-1 alpha-2 (or ISO 3166-2, whose country part is used): for phone numbers without a
   * country code and VAT numbers without a prefix. */
  defaultCountry?: string;
}

/** What one scheme's normaliser returns: the canonical value, or what is wrong (the caller adds the scheme). */
export type SchemeResult = { ok: true; value: string } | { ok: false; problem: string };

export const ok = (value: string): SchemeResult => ({ ok: true, value });
export const problem = (text: string): SchemeResult => ({ ok: false, problem: text });

/** Keeps letters and digits only, upper-cased: registration numbers are written with spaces, dots, dashes, slashes. */
export function compactAlphanumeric(value: string): string {
  let out = '';
  for (const ch of value.toUpperCase()) {
    const c = ch.charCodeAt(0);
    if ((c >= 48 && c <= 57) || (c >= 65 && c <= 90)) out += ch;
  }
  return out;
}

/** True when the string has digits only (and at least one). */
export function isDigits(value: string): boolean {
  if (value.length === 0) return false;
  for (let i = 0; i < value.length; i++) {
    const c = value.charCodeAt(i);
    if (c < 48 || c > 57) return false;
  }
  return true;
}

/** Keeps only separators that registration numbers are commonly written with; anything else is an error. */
export function digitsIgnoringSeparators(value: string): string | null {
  let out = '';
  for (const ch of value) {
    if (ch >= '0' && ch <= '9') out += ch;
    else if (!' .-/\u00a0'.includes(ch)) return null;
  }
  return out;
}
