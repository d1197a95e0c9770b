/**
 * Normalisation for comparison. The original text is never changed: analyses keep `input` verbatim and
 * legal-form spans are slices of it, so the original is always recoverable.
 *
 * Steps: NFKC-compatible folding, case folding, diacritics dropped (ü → u), the German digraph convention
 * folded too where a word can be German (ue → u after a consonant, not at a word's end: foldGermanDigraphs, so
 * Mühlberg ~ Muehlberg ~ Muhlberg while "Samuel Blue" stays), quotes and dashes unified,
 * apostrophes joined (O'Brien → obrien), dotted initials joined (A.B.C. → abc), "&" / "+" / "und" / "et" → "and",
 * any other punctuation a word break. The result is idempotent.
 *
 * Written as one loop without closures: it runs several times per analysis and is the hottest code in it.
 */
import { foldChar, isDiacriticCode, isMarkCode, isWordCode } from './fold-char.ts';

const SEP_OTHER = 0;
const SEP_DOT = 1;

/** Tokenizer state, reset per call (normaliseTokens is synchronous and not re-entrant). */
class Tokens {
  out: string[] = [];
  cur = '';
  /** The current token is one character so far. */
  curIsInitial = false;
  /** The previous token was an initial (or joined initials) directly followed by ".". */
  prevInitials = false;
  /** The current token started right after such an initial: join it if it is one letter too. */
  joinNext = false;

  flush(sep: number): void {
    if (this.cur === '') {
      this.prevInitials = false;
      return;
    }
    let token = this.cur;
    if (this.joinNext && this.curIsInitial && this.out.length > 0) token = (this.out.pop() as string) + token;
    this.out.push(token);
    this.prevInitials = sep === SEP_DOT && (this.curIsInitial || this.joinNext);
    this.joinNext = false;
    this.cur = '';
    this.curIsInitial = false;
  }

  /** Appends folded text: its letters and digits extend the token, anything else breaks it. */
  append(folded: string): void {
    for (let k = 0; k < folded.length; k++) {
      const unit = folded.charCodeAt(k);
      const mark = unit >= 0x300 && !isWordCode(unit) && isMarkCode(unit);
      if (mark && this.cur === '') continue; // a mark never starts a word (same rule as for marks in the input)
      if (mark || isWordCode(unit) || (unit >= 0xd800 && unit <= 0xdfff)) {
        if (this.cur === '') {
          this.joinNext = this.prevInitials;
          this.curIsInitial = true;
        } else {
          this.curIsInitial = false;
        }
        this.cur += folded[k];
      } else {
        this.flush(SEP_OTHER);
      }
    }
  }
}

export function normaliseTokens(text: string): string[] {
  const t = new Tokens();
  const n = text.length;
  for (let i = 0; i < n;) {
    const code = text.charCodeAt(i);
    if (code < 0x80) {
      i++;
      if ((code >= 0x61 && code <= 0x7a) || (code >= 0x30 && code <= 0x39)) {
        if (t.cur === '') {
          t.joinNext = t.prevInitials;
          t.curIsInitial = true;
        } else t.curIsInitial = false;
        t.cur += text[i - 1];
      } else if (code >= 0x41 && code <= 0x5a) {
        if (t.cur === '') {
          t.joinNext = t.prevInitials;
          t.curIsInitial = true;
        } else t.curIsInitial = false;
        t.cur += String.fromCharCode(code + 32);
      } else if (code === 0x27 || code === 0x60) {
        // apostrophes join: O'Brien → obrien
      } else if (code === 0x26 || code === 0x2b) {
        t.flush(SEP_OTHER);
        t.out.push('and');
        t.prevInitials = false;
      } else if (code === 0x2e) {
        t.flush(SEP_DOT);
      } else {
        t.flush(SEP_OTHER);
      }
      continue;
    }
    const cp = text.codePointAt(i) ?? code;
    const width = cp > 0xffff ? 2 : 1;
    const ch = width === 1 ? (text[i] as string) : text.slice(i, i + 2);
    i += width;
    if (isWordCode(cp)) {
      t.append(foldChar(ch));
      continue;
    }
    if (isMarkCode(cp)) {
      // A diacritic is folded away; a mark that spells (kana voicing, Indic vowel signs) stays in its word.
      if (!isDiacriticCode(cp) && t.cur !== '') t.cur += ch;
      continue;
    }
    const f = foldChar(ch);
    if (f === "'") continue;
    if (f === '&' || f === '+') {
      t.flush(SEP_OTHER);
      t.out.push('and');
      t.prevInitials = false;
    } else if (f === '.') {
      t.flush(SEP_DOT);
    } else if (f.length > 0 && isWordCode(f.charCodeAt(0))) {
      t.append(f); // e.g. "½" → "1⁄2": letters and digits of a compatibility decomposition
    } else {
      t.flush(SEP_OTHER);
    }
  }
  t.flush(SEP_OTHER);
  const tokens = t.out;
  for (let k = 0; k < tokens.length; k++) {
    const token = tokens[k] as string;
    tokens[k] = token === 'und' || token === 'et' ? 'and' : foldGermanDigraphs(token);
    if (hasNonAscii(tokens[k] as string)) tokens[k] = (tokens[k] as string).normalize('NFC'); // "カ" + U+3099 → "ガ"
  }
  return tokens;
}

export function normaliseName(text: string): string {
  return normaliseTokens(text).join(' ');
}

/** The comparison form of a name; the same function as normaliseName, under the name comparators expect. */
export const foldForComparison = normaliseName;

/**
 * ae/oe/ue → a/o/u, the German transcription of ä/ö/ü (DIN 5007-2 sorts ä=ae, ö=oe, ü=ue; from memory), so that
 * "Mühlberg", "Muehlberg" and "Muhlberg" meet. Only where the digraph can be an umlaut:
 *  - after a Latin consonant other than q ("muehlberg" → "muhlberg"; "queen", "quest" keep their "ue"; "bauer",
 *    "steuer" keep theirs: a vowel before it makes a diphthong, not an umlaut);
 *  - not at the end of the word, nor before a final "l" or "s": German words almost never end in ä/ö/ü or in
 *    -äl/-öl/-ül/-äs/-ös/-üs, while English, French and Spanish words and given names often end so ("blue",
 *    "avenue", "Joe", "Samuel", "Manuel", "Michael", "Noel", "values") (issue 15: "Samuel Blue" folded to
 *    "samul blu"). From memory; the rare German word so written ("Heizoel") is no longer folded.
 * The rule reads the word alone, never the rest of the name or a country: names are normalised without a country in
 * many places (a stored name's normalised text and blocking keys, the comparators), and one word must fold the same
 * way in all of them. Decided on the output so far, which makes the fold idempotent.
 */
export function foldGermanDigraphs(token: string): string {
  let at = token.indexOf('e', 2);
  if (at < 0) return token;
  let out = '';
  let from = 0;
  const last = token.length - 1;
  for (; at >= 0; at = token.indexOf('e', at + 1)) {
    if (at === last || (at === last - 1 && (token.charCodeAt(last) === 0x6c || token.charCodeAt(last) === 0x73))) continue; // word-final (see above)
    // Compare with the output so far: a removed "e" never changes the context of a later one.
    const sofar = out + token.slice(from, at);
    const v = sofar.charCodeAt(sofar.length - 1);
    const before = sofar.charCodeAt(sofar.length - 2);
    if ((v === 0x61 || v === 0x6f || v === 0x75) && isLatinConsonant(before)) {
      out = sofar;
      from = at + 1;
    }
  }
  return from === 0 ? token : out + token.slice(from);
}

function isLatinConsonant(c: number): boolean {
  // a-z without the vowels a e i o u y, and without q ("queen", "quest" keep their "ue")
  return c >= 0x61 && c <= 0x7a && c !== 0x61 && c !== 0x65 && c !== 0x69 && c !== 0x6f && c !== 0x75 && c !== 0x79 && c !== 0x71;
}

function hasNonAscii(token: string): boolean {
  for (let i = 0; i < token.length; i++) if (token.charCodeAt(i) >= 0x80) return true;
  return false;
}
