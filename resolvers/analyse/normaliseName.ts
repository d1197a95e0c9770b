/**
 * Normalisation for comparison. The original text is never changed: analyses keep `input` verbatim and
 * legal-form spans are slices of it, so the original is always recoverable.
 *
 * Steps: NFKC-compatible folding, case folding, diacritics dropped (ü → u), the German digraph convention
 * folded too (ue → u after a consonant, so Mühlberg ~ Muehlberg ~ Muhlberg), quotes and dashes unified,
 * apostrophes joined (O'Brien → obrien), dotted initials joined (A.B.C. → abc), "&" / "+" / "und" / "et" → "and",
 * any other punctuation a word break. The result is idempotent.
 */
import { foldChar, isMarkCode, isWordCode } from './foldChar.ts';

const AND_WORDS: ReadonlySet<string> = new Set(['and', 'und', 'et']);

export function normaliseTokens(text: string): string[] {
  const tokens: string[] = [];
  let cur = '';
  let curIsInitial = false; // current token is one letter
  let prevInitials = false; // previous token was one letter (or joined initials) followed directly by "."
  let joinNext = false;

  const flush = (sep: 'dot' | 'other'): void => {
    if (cur === '') {
      prevInitials = false;
      return;
    }
    let token = cur;
    if (joinNext && curIsInitial && tokens.length > 0) {
      token = tokens.pop() + token;
    }
    tokens.push(token);
    prevInitials = sep === 'dot' && (curIsInitial || joinNext);
    joinNext = false;
    cur = '';
    curIsInitial = false;
  };

  const appendFolded = (folded: string): void => {
    for (let k = 0; k < folded.length; k++) {
      const unit = folded.charCodeAt(k);
      if (isWordCode(unit) || (unit >= 0xd800 && unit <= 0xdfff)) {
        if (cur === '') {
          joinNext = prevInitials;
          curIsInitial = true;
        } else {
          curIsInitial = false;
        }
        cur += folded[k];
      } else {
        flush('other');
      }
    }
  };

  const n = text.length;
  for (let i = 0; i < n; ) {
    const code = text.codePointAt(i) ?? 0;
    const width = code > 0xffff ? 2 : 1;
    const ch = width === 1 ? text[i] : text.slice(i, i + 2);
    i += width;
    if (isWordCode(code)) {
      appendFolded(foldChar(ch as string));
      continue;
    }
    if (isMarkCode(code)) continue;
    const f = code < 0x80 ? (ch as string) : foldChar(ch as string);
    if (f === "'") continue;
    if (f === '&' || f === '+') {
      flush('other');
      tokens.push('and');
      prevInitials = false;
    } else if (f === '.') {
      flush('dot');
    } else if (f.length > 0 && isWordCode(f.charCodeAt(0))) {
      appendFolded(f); // e.g. "½" → "1⁄2": letters and digits of a compatibility decomposition
    } else {
      flush('other');
    }
  }
  flush('other');
  for (let t = 0; t < tokens.length; t++) {
    const token = tokens[t] as string;
    tokens[t] = AND_WORDS.has(token) ? 'and' : foldGermanDigraphs(token);
  }
  return tokens;
}

export function normaliseName(text: string): string {
  return normaliseTokens(text).join(' ');
}

/** The comparison form of a name; the same function as normaliseName, under the name comparators expect. */
export const foldForComparison = normaliseName;

/**
 * ae/oe/ue → a/o/u after a Latin consonant other than q ("muehlberg" → "muhlberg", "queen" untouched).
 * Decided on the output so far, which makes the fold idempotent.
 */
export function foldGermanDigraphs(token: string): string {
  if (token.indexOf('e') < 1) return token;
  let out = '';
  for (let i = 0; i < token.length; i++) {
    const c = token[i] as string;
    if (c === 'e' && out.length >= 2) {
      const v = out[out.length - 1] as string;
      const before = out[out.length - 2] as string;
      if ((v === 'a' || v === 'o' || v === 'u') && isLatinConsonant(before) && before !== 'q') continue;
    }
    out += c;
  }
  return out;
}

function isLatinConsonant(c: string): boolean {
  return c >= 'a' && c <= 'z' && 'aeiouy'.indexOf(c) < 0;
}
