/**
 * Character folding shared by normalisation and legal-form keys: compatibility decomposition (NFKD covers
 * NFKC's compatibility mappings such as full-width letters and ligatures), lower case, combining marks
 * dropped, and the few Latin letters that do not decompose (ß, æ, ø, ł …) spelt out.
 * Results are cached per character: names repeat the same few hundred characters.
 */
const SPELLED: Readonly<Record<string, string>> = {
  ß: 'ss',
  ẞ: 'ss',
  æ: 'ae',
  Æ: 'ae',
  œ: 'oe',
  Œ: 'oe',
  ø: 'o',
  Ø: 'o',
  ł: 'l',
  Ł: 'l',
  đ: 'd',
  Đ: 'd',
  ð: 'd',
  Ð: 'd',
  þ: 'th',
  Þ: 'th',
  ı: 'i',
  ħ: 'h',
  Ħ: 'h',
  ŀ: 'l',
  Ŀ: 'l',
  ς: 'σ', // Greek final sigma: "ΟΔΟΣ" lower-cased letter by letter must meet "Οδος"
};

/** Quotes, dashes and ampersand-like signs written many ways; unified before anything else. */
const UNIFIED: Readonly<Record<string, string>> = {
  '\u2018': "'",
  '\u2019': "'",
  '\u201a': "'",
  '\u201b': "'",
  '\u2032': "'",
  '\u00b4': "'",
  '`': "'",
  '\u02bc': "'",
  '\u201c': '"',
  '\u201d': '"',
  '\u201e': '"',
  '\u00ab': '"',
  '\u00bb': '"',
  '\u2039': '"',
  '\u203a': '"',
  '\u2010': '-',
  '\u2011': '-',
  '\u2012': '-',
  '\u2013': '-',
  '\u2014': '-',
  '\u2015': '-',
  '\u2212': '-',
  '\ufe63': '-',
  '\uff0d': '-',
  '\uff06': '&',
  '\ufe60': '&',
};

const cache = new Map<string, string>();

/** Folds one code point (a string of one or two UTF-16 units) for comparison. */
export function foldChar(ch: string): string {
  const code = ch.charCodeAt(0);
  if (code < 0x80) return code >= 0x41 && code <= 0x5a ? String.fromCharCode(code + 32) : ch;
  const hit = cache.get(ch);
  if (hit !== undefined) return hit;
  let out = UNIFIED[ch] ?? SPELLED[ch];
  if (out === undefined) {
    // Only diacritics go (the combining blocks of Latin, Greek and Cyrillic): marks that spell in other scripts
    // (kana voicing, Indic vowel signs) stay, and the result is recomposed (NFC) so Hangul and kana come back whole.
    out = withoutDiacritics(ch.normalize('NFKD')).toLowerCase();
    // A decomposition may itself produce letters that need spelling out or unifying (e.g. "Ǣ" → "æ").
    let spelled = '';
    for (const c of out) spelled += SPELLED[c] ?? UNIFIED[c] ?? c;
    out = spelled.normalize('NFC');
  }
  if (cache.size < 65_536) cache.set(ch, out);
  return out;
}

const LETTER_OR_DIGIT = /^[\p{L}\p{N}]$/u;
const wordCharCache = new Map<number, boolean>();

/** True for letters and digits in any script (the characters names are made of). */
export function isWordCode(code: number): boolean {
  if (code < 0x80) {
    return (code >= 0x61 && code <= 0x7a) || (code >= 0x41 && code <= 0x5a) || (code >= 0x30 && code <= 0x39);
  }
  const hit = wordCharCache.get(code);
  if (hit !== undefined) return hit;
  const result = LETTER_OR_DIGIT.test(String.fromCodePoint(code));
  if (wordCharCache.size < 65_536) wordCharCache.set(code, result);
  return result;
}

const MARK = /^\p{M}$/u;

/** Combining marks belong to the letter before them (a decomposed "é" is one letter). */
export function isMarkCode(code: number): boolean {
  if (code < 0x300) return false;
  return MARK.test(String.fromCodePoint(code));
}

/** Marks that are diacritics (dropped when folding), as opposed to marks that spell (kept). */
export function isDiacriticCode(code: number): boolean {
  return (
    (code >= 0x300 && code <= 0x36f) ||
    (code >= 0x1ab0 && code <= 0x1aff) ||
    (code >= 0x1dc0 && code <= 0x1dff) ||
    (code >= 0x20d0 && code <= 0x20ff) ||
    (code >= 0xfe20 && code <= 0xfe2f)
  );
}

function withoutDiacritics(text: string): string {
  let out = '';
  for (let i = 0; i < text.length; i++) {
    const code = text.charCodeAt(i);
    if (!isDiacriticCode(code)) out += text[i];
  }
  return out;
}
