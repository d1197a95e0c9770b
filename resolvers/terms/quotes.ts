/**
 * Quoted defined terms in every drafting style: straight, curly, low-high (German), guillemets, single quotes.
 * A hand-written reader, not a regex: contract text is untrusted and can be 1 MB.
 */

/** For each opening quote, the characters that may close it (drafters mix curly and straight quotes). */
const CLOSERS: ReadonlyMap<string, string> = new Map([
  ['"', '"”“'],
  ['“', '”"'],
  ['”', '”'],
  ['„', '“”"'],
  ['«', '»'],
  ['‘', "’'"],
  ['‚', '‘’'],
  ["'", "'’"],
]);

/** The longest defined term we accept; longer quoted text is a quotation, not a term. */
export const MAX_TERM_LENGTH = 80;

export interface QuotedTerm {
  /** Inner text, trimmed (guillemets usually carry spaces: « le Prestataire »). */
  text: string;
  /** Index of the opening quote. */
  start: number;
  /** Index just after the closing quote. */
  end: number;
}

export function isOpeningQuote(ch: string): boolean {
  return CLOSERS.has(ch);
}

function isLetterOrDigit(ch: string | undefined): boolean {
  return ch !== undefined && /[\p{L}\p{N}]/u.test(ch);
}

/** Reads a quoted term opening at `i`; null when there is none (an apostrophe, a stray quote, a long quotation). */
export function readQuoted(text: string, i: number, limit = text.length): QuotedTerm | null {
  const open = text[i];
  const closers = open === undefined ? undefined : CLOSERS.get(open);
  if (closers === undefined) return null;
  // A single straight quote inside a word is an apostrophe ("Licensee's"), not an opening quote.
  if ((open === "'" || open === '‘') && isLetterOrDigit(text[i - 1])) return null;
  const stop = Math.min(limit, i + 1 + MAX_TERM_LENGTH + 2);
  for (let j = i + 1; j < stop; j++) {
    const ch = text[j] as string;
    if (ch === '\n' || ch === '(' || ch === ')') return null;
    if (closers.includes(ch)) {
      if ((ch === "'" || ch === '’') && isLetterOrDigit(text[j + 1])) continue; // "Licensee's" inside
      const inner = text.slice(i + 1, j).trim();
      if (inner.length === 0 || inner.length > MAX_TERM_LENGTH) return null;
      return { text: inner, start: i, end: j + 1 };
    }
  }
  return null;
}
