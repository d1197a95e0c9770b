/**
 * Blocking keys of one record: stable strings; two records become a candidate pair when they share a key
 * (subject to the block-size rules of candidatePairs / the register's lookup).
 *
 *   t:<token>          every token of the core name (a rare shared word is the strongest cheap signal)
 *   a:<letters>        acronym keys: a short single-token name as written ("nrc"), and the initials of a
 *                      multi-token name, with and without function words ("northfield rail components" → "nrc")
 *   p:<prefix>         the first 6 letters of the core without spaces: catches a typo in a leading word
 *   b:<2 characters>   character bigrams of names in scripts written without spaces (Han, Kana, Thai, …)
 *   i:<scheme>:<value> each strong identifier; w:<scheme>:<value> each shared (weak) identifier
 *
 * Keys depend on the record alone, never on the rest of the register, so a stored key never goes stale. The IDF
 * table only orders them (rarest first) so that a caller with a budget queries the most selective keys first;
 * oversized blocks are thinned at query time (candidatePairs uses a sorted neighbourhood inside them).
 */
import type { IdfTable } from '../compare/idfTable.ts';
import { isStrongScheme } from '../vocabulary.ts';
import type { MatchRecord } from './matchRecord.ts';
import { isUnspacedChar } from './script.ts';

export const PREFIX_KEY_LENGTH = 6;

/**
 * Words left out of the second initials key. Common practice: acronyms usually skip articles, prepositions and
 * conjunctions ("Thailand Science Research and Innovation" → TSRI). English, French, German, Spanish, Portuguese,
 * Italian and Dutch forms, kept short on purpose (a wrong entry only costs one extra key).
 */
const FUNCTION_WORDS = new Set([
  'of', 'the', 'and', 'for', 'in', 'on', 'at', 'to', 'a', 'an',
  'de', 'des', 'du', 'la', 'le', 'les', 'et', 'pour', 'en', 'di', 'del', 'della', 'delle', 'dei', 'degli',
  'e', 'y', 'da', 'do', 'dos', 'das', 'der', 'die', 'das', 'und', 'fur', 'van', 'het', 'voor', 'en', 'el', 'los', 'las',
]);

export function blockingKeys(record: MatchRecord, idf?: IdfTable): string[] {
  const { tokens, core } = record.analysis;
  const keys = new Set<string>();
  const rarestFirst = idf ? [...new Set(tokens)].sort((x, y) => idf.idf(y) - idf.idf(x) || (x < y ? -1 : x > y ? 1 : 0)) : [...new Set(tokens)];
  for (const token of rarestFirst) keys.add(`t:${token}`);
  for (const key of acronymKeys(tokens)) keys.add(key);
  const compact = core.replaceAll(' ', '');
  if ([...compact].length >= PREFIX_KEY_LENGTH) keys.add(`p:${[...compact].slice(0, PREFIX_KEY_LENGTH).join('')}`);
  for (const bigram of unspacedBigrams(compact)) keys.add(`b:${bigram}`);
  for (const identifier of record.identifiers ?? []) {
    keys.add(`${isStrongScheme(identifier.scheme) ? 'i' : 'w'}:${identifier.scheme}:${identifier.value}`);
  }
  return [...keys];
}

/** Acronym keys: the name itself when it is one short token, else its initials (all words; content words). */
export function acronymKeys(tokens: readonly string[]): string[] {
  if (tokens.length === 1) {
    const only = tokens[0] as string;
    const length = [...only].length;
    return length >= 2 && length <= 10 ? [`a:${only}`] : [];
  }
  if (tokens.length < 2) return [];
  const all = tokens.map(firstChar).join('');
  const content = tokens.filter((t) => !FUNCTION_WORDS.has(t)).map(firstChar).join('');
  const keys = [`a:${all}`];
  if (content.length >= 2 && content !== all) keys.push(`a:${content}`);
  return keys;
}

function firstChar(token: string): string {
  return String.fromCodePoint(token.codePointAt(0) as number);
}

function unspacedBigrams(compact: string): string[] {
  const chars = [...compact];
  const out: string[] = [];
  for (let i = 0; i + 1 < chars.length; i++) {
    const a = chars[i] as string;
    const b = chars[i + 1] as string;
    if (isUnspacedChar(a) || isUnspacedChar(b)) out.push(a + b);
  }
  return out;
}
