/**
 * Acronym comparator: "NRC" ~ "Northfield Rail Components", "N.R.C. Holdings" ~ "Northfield Rail Components
 * Holdings", "BoE" ~ "Bank of England" (stop-words may be skipped or kept), "A&B" ~ "Ardmore and Bexley".
 *
 * Works on tokens (NameAnalysis.tokens, or acronymTokens() of a raw string). Tokens the two sides share at
 * the end ("holdings") are set aside first, so that "NRC Holdings" is compared as "NRC" against the rest.
 */

/** Words an acronym commonly skips (common practice); "&" appears when the input was not folded to "and". */
export const ACRONYM_STOP_WORDS: ReadonlySet<string> = new Set([
  'of',
  'and',
  'the',
  '&',
  'for',
  'a',
  'an',
  'at',
  'in',
  'on',
  'to',
  'by',
  'de',
  'du',
  'des',
  'la',
  'le',
  'les',
  'et',
  'd',
  'l',
  'und',
  'der',
  'die',
  'das',
  'fur',
  'für',
  'von',
  'van',
  'den',
  'het',
  'en',
  'y',
  'del',
  'el',
  'los',
  'las',
  'di',
  'e',
  'da',
  'do',
  'dos',
]);

export type AcronymLevel =
  /** Initials of every word that is not a stop-word. */
  | 'initials'
  /** Initials of every word, stop-words included ("BOE" for "Bank of England"). */
  | 'initials_with_stop_words'
  | 'none';

export interface AcronymComparison {
  level: AcronymLevel;
  /** The acronym side, as letters ("nrc"), when a match was found. */
  acronym?: string;
  /** The words it expands to. */
  expansion?: string[];
}

/** True for "n.r.c." / "n.r.c": single letters joined by dots. */
function isDotted(chunk: string): boolean {
  const parts = chunk.split('.').filter((p) => p.length > 0);
  return parts.length >= 2 && parts.every((p) => [...p].length === 1 && /\p{L}/u.test(p));
}

/** Lower-case letter/digit runs; "&" kept as a token. Dotted acronyms ("N.R.C.") become one token ("nrc"). */
export function acronymTokens(name: string): string[] {
  const tokens: string[] = [];
  for (const chunk of name.normalize('NFKC').toLowerCase().split(/\s+/)) {
    let end = chunk.length;
    while (end > 0 && ',;:'.includes(chunk[end - 1]!)) end--;
    if (isDotted(chunk.slice(0, end))) {
      tokens.push(chunk.replace(/\P{L}/gu, ''));
      continue;
    }
    let current = '';
    for (const ch of chunk) {
      if (/[\p{L}\p{N}]/u.test(ch)) {
        current += ch;
        continue;
      }
      if (current) tokens.push(current);
      current = '';
      if (ch === '&') tokens.push('&');
    }
    if (current) tokens.push(current);
  }
  return tokens;
}

/** Initials of the tokens, with or without stop-words. */
export function initialsOf(tokens: readonly string[], keepStopWords: boolean): string {
  let out = '';
  for (const token of tokens) {
    if (!keepStopWords && ACRONYM_STOP_WORDS.has(token)) continue;
    if (token === '&') continue;
    // The first character, not the first UTF-16 unit: half of a character outside the BMP is no initial.
    const first = token.codePointAt(0);
    if (first !== undefined) out += String.fromCodePoint(first);
  }
  return out;
}

/** The candidate acronym of one side: one token, or a run of single letters ("n r c"). */
function candidateAcronym(tokens: readonly string[]): string | null {
  if (tokens.length === 1) {
    const t = tokens[0]!;
    return t.length >= 2 && t.length <= 10 ? t : null;
  }
  if (tokens.length >= 2 && tokens.every((t) => t.length === 1 && t !== '&')) return tokens.join('');
  // "A&B" tokenises as a, &, b.
  if (tokens.length >= 3 && tokens.every((t) => t.length === 1)) return tokens.filter((t) => t !== '&').join('');
  return null;
}

function match(short: readonly string[], long: readonly string[]): AcronymComparison | null {
  const acronym = candidateAcronym(short);
  const words = long.filter((t) => t !== '&' && !ACRONYM_STOP_WORDS.has(t));
  if (acronym === null || words.length < 2 || long.length < 2) return null;
  if (initialsOf(long, false) === acronym) return { level: 'initials', acronym, expansion: [...long] };
  if (initialsOf(long, true) === acronym) return { level: 'initials_with_stop_words', acronym, expansion: [...long] };
  return null;
}

/** Sets aside the tokens both sides end with (at least one token stays on each side). */
function withoutCommonEnding(a: readonly string[], b: readonly string[]): [string[], string[]] {
  let n = 0;
  while (n < a.length - 1 && n < b.length - 1 && a[a.length - 1 - n] === b[b.length - 1 - n]) n++;
  return [a.slice(0, a.length - n), b.slice(0, b.length - n)];
}

/** Whether one side is an acronym of the other (either direction), on lower-case tokens. */
export function compareAcronym(a: readonly string[], b: readonly string[]): AcronymComparison {
  const [x, y] = withoutCommonEnding(a, b);
  return match(x, y) ?? match(y, x) ?? { level: 'none' };
}
