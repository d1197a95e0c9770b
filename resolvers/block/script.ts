/** Script of a name: the blocking categories and keys treat Latin-script and other names differently. */
export type NameScript = 'latin' | 'non_latin' | 'mixed' | 'none';

/** Letters only decide: digits, spaces and punctuation belong to no script here. */
export function nameScript(text: string): NameScript {
  let latin = 0;
  let other = 0;
  for (const ch of text) {
    const c = ch.codePointAt(0) as number;
    if (c < 0x80) {
      if ((c >= 65 && c <= 90) || (c >= 97 && c <= 122)) latin++;
      continue;
    }
    if (!isLetter(ch)) continue;
    if (isLatinLetter(c)) latin++;
    else other++;
  }
  if (latin === 0 && other === 0) return 'none';
  if (other === 0) return 'latin';
  if (latin === 0) return 'non_latin';
  return 'mixed';
}

const LETTER = /^\p{L}$/u;
const LATIN = /^\p{Script=Latin}$/u;

function isLetter(ch: string): boolean {
  return LETTER.test(ch);
}

function isLatinLetter(c: number): boolean {
  return LATIN.test(String.fromCodePoint(c));
}

/**
 * True for scripts written without spaces between words (Han, Hiragana, Katakana, Thai, …): their "tokens" are
 * whole phrases, so blocking adds character-bigram keys for them.
 */
const UNSPACED = /[\p{Script=Han}\p{Script=Hiragana}\p{Script=Katakana}\p{Script=Thai}\p{Script=Lao}\p{Script=Khmer}\p{Script=Myanmar}]/u;

export function isUnspacedChar(ch: string): boolean {
  return UNSPACED.test(ch);
}
