/**
 * Issue 16 item 10: with a country hint, an abbreviation that is a legal form only in other jurisdictions and is
 * written as a shortened word ("Fab." for Fabrication; Swedish "fab." is a form, ELF OJ9I) is read as a word of
 * the name, not as its legal form; analyseName still offers the reading without it as an alternative.
 * Initialisms and contractions ("GmbH", "KG", "Ltd.", "Bhd.") and abbreviations used in many countries ("Inc.",
 * "Corp.") stay forms wherever the hint points: a German GmbH in a US contract is still a GmbH (common practice).
 */
import type { LegalFormEntry } from './legal-form-index.ts';

/** A capital, small letters with a vowel, a full stop: how a word is cut short ("Fab.", "Gen.", "Soc."). */
const SHORTENED_WORD = /^\p{Lu}(?=\p{Ll}*[aeiouy])\p{Ll}{2,}\.$/u;

/** An abbreviation that is a form in more countries than this is known as one everywhere ("Inc.", "Corp."). */
const MAX_FORM_COUNTRIES = 2;

export function isForeignWordForm(written: string, entry: LegalFormEntry, country: string): boolean {
  if (!entry.abbreviation || !SHORTENED_WORD.test(written.trim())) return false;
  const countries = new Set(entry.jurisdictions.map((j) => j.slice(0, 2)));
  return countries.size <= MAX_FORM_COUNTRIES && !countries.has(country.slice(0, 2));
}
