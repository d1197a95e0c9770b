/**
 * Blocking keys of one record: stable strings; two records become a candidate pair when they share a key
 * (subject to the block-size rules of candidatePairs / the register's lookup).
 *
 *   t:<token>          every token of the core name (a rare shared word is the strongest cheap signal)
 *   s:<stem>           the first 5 characters of each longer token: inflections and cognates across languages
 *                      ("technologies" / "technologie", "dystrophie" / "dystrophy", "academie" / "academy")
 *   q:<stem>|<stem>    every pair of stems among the 5 longest content words (length stands in for rarity
 *                      so that the key never depends on the IDF table): names sharing two common words
 *                      ("department … planning … environment") meet in a small block although each word's own
 *                      block is too large to pair exhaustively
 *   a:<letters>        acronym keys: a short single-token name as written ("nrc"), and the initials of a
 *                      multi-token name, with and without function words ("northfield rail components" → "nrc")
 *   p:<prefix>         the first 6 letters of the core without spaces: catches a typo in a leading word
 *   b:<2 characters>   character bigrams of names in scripts written without spaces (Han, Kana, Thai, …)
 *   i:<scheme>:<value> each strong identifier; w:<scheme>:<value> each shared (weak) identifier
 * and the t:, s: and p: keys of the name's other spellings (analysis.alternatives: aliases, a transliteration).
 *
 * Keys depend on the record alone, never on the rest of the register, so a stored key goes stale only when the
 * analysis it is taken from changes (ANALYSIS_VERSION, resolvers/analyse/analysis-version.ts: bump it with any change
 * here too; the register then rewrites stored keys with `cpreg migrate reanalyse`). The IDF
 * table only orders them (rarest first) so that a caller with a budget queries the most selective keys first;
 * oversized blocks are thinned at query time (candidatePairs uses a sorted neighbourhood inside them).
 */
import { ACRONYM_STOP_WORDS, initialsOf, type IdfTable } from '../compare/index.ts';
import { isStrongScheme } from '../vocabulary.ts';
import type { MatchRecord } from './match-record.ts';
import { isUnspacedChar } from './script.ts';

export const PREFIX_KEY_LENGTH = 6;
export const STEM_LENGTH = 5;
/** Content words (longest first) whose stems are paired into q: keys. */
export const PAIR_KEY_WORDS = 5;

export function blockingKeys(record: MatchRecord, idf?: IdfTable): string[] {
  const { tokens, core } = record.analysis;
  const keys = new Set<string>();
  const rarestFirst = idf ? [...new Set(tokens)].sort((x, y) => idf.idf(y) - idf.idf(x) || (x < y ? -1 : x > y ? 1 : 0)) : [...new Set(tokens)];
  for (const token of rarestFirst) keys.add(`t:${token}`);
  for (const token of rarestFirst) {
    const chars = [...token];
    if (chars.length > STEM_LENGTH) keys.add(`s:${chars.slice(0, STEM_LENGTH).join('')}`);
  }
  const content = [...new Set(tokens)]
    .filter((t) => !ACRONYM_STOP_WORDS.has(t) && [...t].length > 1)
    .sort((x, y) => [...y].length - [...x].length || (x < y ? -1 : x > y ? 1 : 0))
    .slice(0, PAIR_KEY_WORDS);
  const stems = [...new Set(content.map((t) => [...t].slice(0, STEM_LENGTH).join('')))].sort();
  for (let x = 0; x < stems.length; x++) {
    for (let y = x + 1; y < stems.length; y++) keys.add(`q:${stems[x]}|${stems[y]}`);
  }
  for (const key of acronymKeys(tokens)) keys.add(key);
  const compact = core.replaceAll(' ', '');
  if ([...compact].length >= PREFIX_KEY_LENGTH) keys.add(`p:${[...compact].slice(0, PREFIX_KEY_LENGTH).join('')}`);
  for (const bigram of unspacedBigrams(compact)) keys.add(`b:${bigram}`);
  // Other spellings (aliases, a Latin transliteration) meet their matches through their words and prefix.
  for (const other of record.analysis.alternatives) {
    for (const token of other.tokens) {
      keys.add(`t:${token}`);
      const chars = [...token];
      if (chars.length > STEM_LENGTH) keys.add(`s:${chars.slice(0, STEM_LENGTH).join('')}`);
    }
    const otherCompact = [...other.core.replaceAll(' ', '')];
    if (otherCompact.length >= PREFIX_KEY_LENGTH) keys.add(`p:${otherCompact.slice(0, PREFIX_KEY_LENGTH).join('')}`);
  }
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
  // Initials as the acronym comparator reads them (compare/initialsOf), with and without stop words.
  const all = initialsOf(tokens, true);
  const content = initialsOf(tokens, false);
  const keys = [`a:${all}`];
  if (content.length >= 2 && content !== all) keys.push(`a:${content}`);
  return keys;
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
