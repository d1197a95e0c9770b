/**
 * A postal address folded for equality only: a shared address is "same or affiliated" evidence (group
 * companies share head offices, and so do the tenants of one office building), never more.
 *
 * Folding: NFKD without marks, lower case, punctuation to spaces, a few street-type words shortened
 * (common practice), whitespace collapsed. No parsing: two spellings that fold differently simply do not match.
 */
const SHORT_FORMS = new Map<string, string>([
  ['street', 'st'],
  ['road', 'rd'],
  ['avenue', 'ave'],
  ['av', 'ave'],
  ['boulevard', 'blvd'],
  ['drive', 'dr'],
  ['lane', 'ln'],
  ['suite', 'ste'],
  ['floor', 'fl'],
  ['strasse', 'str'],
  ['straße', 'str'],
  ['platz', 'pl'],
]);

export function normaliseAddress(address: string): string {
  const folded = address.replaceAll('ß', 'ss').normalize('NFKD').replace(/\p{M}/gu, '').toLowerCase();
  const words: string[] = [];
  for (const raw of folded.split(/[^\p{L}\p{N}]+/u)) {
    if (raw.length === 0) continue;
    // "hauptstrasse" → "hauptstr": German street names are often written as one word.
    const word = raw.endsWith('strasse') && raw.length > 7 ? `${raw.slice(0, -7)}str` : raw;
    words.push(SHORT_FORMS.get(word) ?? word);
  }
  return words.join(' ');
}
