/** Small character-level helpers shared by the scanners (ASCII case folding keeps indices aligned). */

export function isWordChar(ch: string | undefined): boolean {
  if (ch === undefined) return false;
  const c = ch.charCodeAt(0);
  // ASCII fast path; the Unicode test only for other characters.
  if (c < 128) return (c >= 48 && c <= 57) || (c >= 65 && c <= 90) || (c >= 97 && c <= 122);
  return /[\p{L}\p{N}]/u.test(ch);
}

export function isSpace(ch: string | undefined): boolean {
  return ch === ' ' || ch === '\t' || ch === '\n' || ch === '\r' || ch === '\u00a0' || ch === '\f' || ch === '\v';
}

/** True when `word` (lower case) stands at `i` as a whole word, ignoring ASCII case. */
export function wordAt(text: string, i: number, word: string): boolean {
  if (i < 0 || i + word.length > text.length) return false;
  if (isWordChar(text[i - 1]) && isWordChar(word[0])) return false;
  for (let k = 0; k < word.length; k++) {
    if ((text[i + k] as string).toLowerCase() !== word[k]) return false;
  }
  return !(isWordChar(text[i + word.length]) && isWordChar(word[word.length - 1]));
}

/** The first of `words` standing at `i`, or undefined. */
export function anyWordAt(text: string, i: number, words: readonly string[]): string | undefined {
  for (const w of words) if (wordAt(text, i, w)) return w;
  return undefined;
}

/** Index after any spaces from `i`. */
export function skipSpaces(text: string, i: number, end = text.length): number {
  let j = i;
  while (j < end && isSpace(text[j])) j++;
  return j;
}

/** Trims spaces and the given punctuation from both ends of [start, end): returns the narrowed bounds. */
export function trimBounds(text: string, start: number, end: number, punct = ''): [number, number] {
  let s = start;
  let e = end;
  while (s < e && (isSpace(text[s]) || punct.includes(text[s] as string))) s++;
  while (e > s && (isSpace(text[e - 1]) || punct.includes(text[e - 1] as string))) e--;
  return [s, e];
}

/** Lower-cased words of a short string (letters and digits only). */
export function wordsOf(s: string): string[] {
  return s
    .toLowerCase()
    .split(/[^\p{L}\p{N}/]+/u)
    .filter((w) => w.length > 0);
}
