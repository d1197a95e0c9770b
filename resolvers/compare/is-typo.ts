/**
 * Whether two words of two names are one word with a typo in it (see isTypo), and the length and similarity
 * thresholds the name comparison applies to typos. Separate from the alignment of the words, which asks this for
 * every pair of words left unpaired.
 */
import { isNumberToken } from './distinguishing-words.ts';
import { jaroWinkler, jaroWinklerUpperBound } from './jaro-winkler.ts';
import { withinOneEdit } from './within-one-edit.ts';

/**
 * Jaro–Winkler between two words at which they count as one word with a typo: words of nine letters or more, or of
 * five or more beside a rare shared word; other words that differ by a letter are as often other names ("Tiberio" /
 * "Tiberius", "Purbach" / "Peuerbach").
 */
const TYPO_SIMILARITY = 0.92;
export const TYPO_MIN_LENGTH = 9;
export const TYPO_MIN_LENGTH_BESIDE_RARE = 5;
/**
 * One edit is a typo in words of eight letters or more, or of four or more beside a rare shared word. At seven, the
 * place names of one banking group one letter apart join ("Raiffeisenbank Purbach" / "… Purbech", a unit test); at
 * five, on the ROR test split, one-word acronyms and place names did ("KELAB" / "KELAM", two provinces one letter
 * apart). Generated names lose 0.45 point of F1 from seven to eight letters; LEI dev links are the same at five, seven
 * and eight.
 */
export const ONE_EDIT_MIN_LENGTH = 8;
export const ONE_EDIT_MIN_LENGTH_BESIDE_RARE = 4;

/**
 * `x` and `y` are one word with a typo: a look-alike letter, one edit in a word of `oneEditMin` letters or more, or
 * Jaro–Winkler of TYPO_SIMILARITY or more in words of `minLength` letters or more (the caller chooses the lengths by
 * whether a rare word stands beside).
 */
export function isTypo(x: string, y: string, minLength: number, oneEditMin: number): boolean {
  // A letter misread as one it looks like ("CATERlNG" / "CATERING") is a typo in a shorter word too.
  if (x.length === y.length && x.length >= TYPO_MIN_LENGTH_BESIDE_RARE && x !== y && lookAlike(x) === lookAlike(y))
    return !isNumberToken(x) && !isNumberToken(y);
  // Scripts written without spaces (Han, Kana, Thai…) make a whole name one token: a changed character there is
  // another name ("…鄞州农村商业银行" / "…慈溪农村商业银行"), not a typo.
  if (!isSpacedScript(x) || !isSpacedScript(y)) return false;
  if (!typoNumbersAgree(x, y)) return false;
  // One edit ("Halselan" / "Halseln", "Power" / "ower"): two edits are as often another name ("Tiberio" /
  // "Tiberius", "Purbach" / "Peuerbach"). Not in a word with digits, where one digit is another number ("UX4150" /
  // "UX4100").
  if (x.length >= oneEditMin && y.length >= oneEditMin && !/\d/.test(x + y) && withinOneEdit(x, y)) return true;
  if (x.length < minLength || y.length < minLength) return false;
  // One typo (a letter added, dropped, changed or swapped) changes the length by one at most.
  if (Math.abs(x.length - y.length) > 1) return false;
  if (jaroWinklerUpperBound(x.length, y.length) < TYPO_SIMILARITY || sharedLetterBound(x, y) < TYPO_SIMILARITY) return false;
  return jaroWinkler(x, y) >= TYPO_SIMILARITY;
}

/**
 * Numbers carry identity: two numbers are never one with a typo ("II" / "III", "2" / "3"), and a word whose digits
 * differ is no typo ("3Eclipse" / "Eclipse", "Fund2" / "Fund3"), unless a digit stands in a letter's place that it
 * looks like ("Ostjasic0" / "Ostjasico", a misread scan). A number word against a plain word ("First" / "Firt") may
 * be a typo of it.
 */
function typoNumbersAgree(x: string, y: string): boolean {
  const numberX = isNumberToken(x);
  const numberY = isNumberToken(y);
  if (numberX && numberY) return false;
  if ((numberX || numberY) && (/\d/.test(x) || /\d/.test(y))) return false;
  return digitsOf(x) === digitsOf(y) || (x.length === y.length && digitsOf(lookAlike(x)) === digitsOf(lookAlike(y)));
}

function digitsOf(token: string): string {
  return token.replace(/\D+/g, '');
}

/** Characters read as the letters they resemble (0 o, 1 i l, 5 s): common practice for misread scans. */
function lookAlike(token: string): string {
  return token.replace(/0/g, 'o').replace(/[1i]/g, 'l').replace(/5/g, 's');
}

/** Latin, Greek, Cyrillic, Armenian, Hebrew, Arabic and the Indic scripts before Thai (U+0E00) separate words. */
function isSpacedScript(token: string): boolean {
  return token.charCodeAt(0) < 0x0e00;
}

const buckets = new Int16Array(64);

/**
 * An upper bound of Jaro–Winkler from the letters the two words share in any order (counted in 64 buckets, which
 * can only over-count): Jaro ≤ (i/|x| + i/|y| + 1) / 3 for i shared letters, and JW ≤ J + 0.4 (1 − J). Most pairs
 * of different words fail it, so the exact JW is computed for few of them.
 */
function sharedLetterBound(x: string, y: string): number {
  for (let i = 0; i < x.length; i++) buckets[x.charCodeAt(i) & 63]!++;
  let shared = 0;
  for (let i = 0; i < y.length; i++) {
    const k = y.charCodeAt(i) & 63;
    if (buckets[k]! > 0) {
      buckets[k]!--;
      shared++;
    }
  }
  for (let i = 0; i < x.length; i++) buckets[x.charCodeAt(i) & 63] = 0;
  const jaro = (shared / x.length + shared / y.length + 1) / 3;
  return jaro + 0.4 * (1 - jaro);
}
