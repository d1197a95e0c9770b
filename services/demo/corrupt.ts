/**
 * Corruptions that turn a clean organisation name into the variants people, ERPs, OCR and extraction
 * models produce. The kinds follow the corruption families of record-linkage test-data generators
 * (Christen & Pudjijono 2009: typographical, keyboard, OCR and phonetic errors; Tran, Vatsalan &
 * Christen 2013: attribute-level abbreviation, token drops and swaps, missing values), plus the
 * legal-form, punctuation and case variants that organisation names add. Each returns null when it does
 * not apply to the name (the caller then tries another kind), never the name unchanged.
 */
import type { Random } from '../../resolvers/prng.ts';
import type { LegalFormFamily } from './name-parts.ts';

/** A name split into the words before its legal form and the form itself. */
export interface NameParts {
  base: string;
  form?: string;
  family?: LegalFormFamily;
  /** "Brackenridge Fabrication, Inc." rather than "Brackenridge Fabrication Inc." */
  comma?: boolean;
}

export function renderName(parts: NameParts): string {
  if (!parts.form) return parts.base;
  return `${parts.base}${parts.comma ? ', ' : ' '}${parts.form}`;
}

export const VARIANT_KINDS = [
  'legal_form',
  'punctuation',
  'case',
  'keyboard_typo',
  'ocr',
  'phonetic',
  'abbreviation',
  'token_drop',
  'token_swap',
  'whitespace',
  'diacritics',
] as const;
export type VariantKind = (typeof VARIANT_KINDS)[number];

type Corruption = (parts: NameParts, rnd: Random) => NameParts | null;

export const CORRUPTIONS: Readonly<Record<VariantKind, Corruption>> = {
  legal_form: legalFormVariant,
  punctuation: punctuationVariant,
  case: caseVariant,
  keyboard_typo: (p, r) => onBase(p, keyboardTypo(p.base, r)),
  ocr: (p, r) => onBase(p, ocrError(p.base, r)),
  phonetic: (p, r) => onBase(p, phoneticVariant(p.base, r)),
  abbreviation: abbreviationVariant,
  token_drop: tokenDrop,
  token_swap: tokenSwap,
  whitespace: (p, r) => onBase(p, whitespaceVariant(p.base, r)),
  diacritics: (p, r) => onBase(p, foldDiacritics(p.base, r)),
};

/** Applies one corruption; null when it does not apply or would change nothing. */
export function corrupt(kind: VariantKind, parts: NameParts, rnd: Random): NameParts | null {
  const out = CORRUPTIONS[kind](parts, rnd);
  if (!out || renderName(out) === renderName(parts) || out.base.trim() === '') return null;
  return out;
}

function onBase(parts: NameParts, base: string | null): NameParts | null {
  return base === null ? null : { ...parts, base };
}

/** Another spelling of the same legal form, or no form at all (one time in four). */
function legalFormVariant(parts: NameParts, rnd: Random): NameParts | null {
  if (!parts.form || !parts.family) return null;
  if (rnd.chance(0.25)) return { base: parts.base };
  const choices = [parts.family.canonical, ...parts.family.variants].filter((f) => f !== parts.form);
  if (choices.length === 0) return null;
  return { ...parts, form: rnd.pick(choices), comma: rnd.chance(0.3) };
}

function punctuationVariant(parts: NameParts, rnd: Random): NameParts | null {
  const strip = (s: string): string => s.replaceAll('.', '').replaceAll(',', '');
  const roll = rnd.int(3);
  if (roll === 0 && parts.base.includes('&')) return { ...parts, base: parts.base.replaceAll('&', 'and') };
  if (roll === 1 && parts.base.includes(' and ')) return { ...parts, base: parts.base.replaceAll(' and ', ' & ') };
  if (roll === 2 && parts.form && !parts.comma) return { ...parts, comma: true };
  const stripped = { ...parts, base: strip(parts.base), form: parts.form ? strip(parts.form) : undefined, comma: false };
  return stripped;
}

function caseVariant(parts: NameParts, rnd: Random): NameParts | null {
  const roll = rnd.int(3);
  const f = roll === 0 ? (s: string) => s.toUpperCase() : roll === 1 ? (s: string) => s.toLowerCase() : titleCase;
  return { ...parts, base: f(parts.base), form: parts.form ? f(parts.form) : undefined };
}

function titleCase(s: string): string {
  return s
    .split(' ')
    .map((w) => (w.length > 0 ? w[0]!.toUpperCase() + w.slice(1).toLowerCase() : w))
    .join(' ');
}

/** QWERTY neighbours of each letter (same row and the rows above and below). */
const KEY_NEIGHBOURS: Readonly<Record<string, string>> = {
  q: 'wa',
  w: 'qeas',
  e: 'wrsd',
  r: 'etdf',
  t: 'ryfg',
  y: 'tugh',
  u: 'yihj',
  i: 'uojk',
  o: 'ipkl',
  p: 'ol',
  a: 'qwsz',
  s: 'awedxz',
  d: 'serfcx',
  f: 'drtgvc',
  g: 'ftyhbv',
  h: 'gyujnb',
  j: 'huikmn',
  k: 'jiolm',
  l: 'kop',
  z: 'asx',
  x: 'zsdc',
  c: 'xdfv',
  v: 'cfgb',
  b: 'vghn',
  n: 'bhjm',
  m: 'njk',
};

function matchCase(template: string, c: string): string {
  return template === template.toUpperCase() && template !== template.toLowerCase() ? c.toUpperCase() : c;
}

/** One keystroke error: an adjacent key instead of the right one, an extra adjacent key, a missed key or
 * two keys swapped. The first letter is left alone: typists rarely get it wrong (common practice). */
export function keyboardTypo(s: string, rnd: Random): string | null {
  const positions: number[] = [];
  for (let i = 1; i < s.length; i++) if (KEY_NEIGHBOURS[s[i]!.toLowerCase()]) positions.push(i);
  if (positions.length === 0) return null;
  const i = rnd.pick(positions);
  const ch = s[i]!;
  const near = KEY_NEIGHBOURS[ch.toLowerCase()]!;
  switch (rnd.int(4)) {
    case 0:
      return s.slice(0, i) + matchCase(ch, rnd.pick([...near])) + s.slice(i + 1);
    case 1:
      return s.slice(0, i + 1) + matchCase(ch, rnd.pick([...near])) + s.slice(i + 1);
    case 2:
      return s.slice(0, i) + s.slice(i + 1);
    default: {
      const j = i + 1 < s.length ? i + 1 : i - 1;
      if (j < 1 || s[j] === ' ' || s[j] === ch) return s.slice(0, i) + s.slice(i + 1);
      const [a, b] = j > i ? [i, j] : [j, i];
      return s.slice(0, a) + s[b] + s[a] + s.slice(b + 1);
    }
  }
}

/** Character confusions of optical character recognition (pairs after Christen & Pudjijono 2009). */
const OCR_PAIRS: ReadonlyArray<readonly [string, string]> = [
  ['m', 'rn'],
  ['rn', 'm'],
  ['O', '0'],
  ['o', '0'],
  ['l', '1'],
  ['I', 'l'],
  ['i', 'l'],
  ['S', '5'],
  ['B', '8'],
  ['cl', 'd'],
  ['d', 'cl'],
  ['w', 'vv'],
  ['e', 'c'],
  ['h', 'b'],
  ['g', 'q'],
  ['Z', '2'],
  ['G', '6'],
  ['n', 'ri'],
];

export function ocrError(s: string, rnd: Random): string | null {
  return replaceOne(s, OCR_PAIRS, rnd);
}

/** Sound-alike spellings (English-language rules in the spirit of Christen & Pudjijono 2009). */
const PHONETIC_PAIRS: ReadonlyArray<readonly [string, string]> = [
  ['ph', 'f'],
  ['f', 'ph'],
  ['ck', 'k'],
  ['c', 'k'],
  ['k', 'c'],
  ['z', 's'],
  ['s', 'z'],
  ['ie', 'y'],
  ['y', 'ie'],
  ['ou', 'ow'],
  ['ei', 'ie'],
  ['ll', 'l'],
  ['tt', 't'],
  ['nn', 'n'],
  ['ss', 's'],
  ['l', 'll'],
  ['t', 'tt'],
  ['ey', 'y'],
  ['gh', 'g'],
  ['th', 't'],
  ['v', 'w'],
  ['qu', 'kw'],
  ['x', 'ks'],
  ['ia', 'ya'],
  ['ae', 'e'],
];

export function phoneticVariant(s: string, rnd: Random): string | null {
  return replaceOne(s, PHONETIC_PAIRS, rnd);
}

/** Replaces one occurrence (chosen at random among all matches of all pairs), or null if none match. */
function replaceOne(s: string, pairs: ReadonlyArray<readonly [string, string]>, rnd: Random): string | null {
  const hits: Array<{ at: number; from: string; to: string }> = [];
  for (const [from, to] of pairs) {
    for (let at = s.indexOf(from, 1); at >= 0; at = s.indexOf(from, at + 1)) hits.push({ at, from, to });
  }
  if (hits.length === 0) return null;
  const h = rnd.pick(hits);
  return s.slice(0, h.at) + h.to + s.slice(h.at + h.from.length);
}

/** Word abbreviations seen in company names (common practice). */
export const WORD_ABBREVIATIONS: Readonly<Record<string, readonly string[]>> = {
  International: ['Intl', "Int'l", 'Intl.'],
  Engineering: ['Eng.', 'Engg', 'Eng'],
  Technologies: ['Tech', 'Techs', 'Technol.'],
  Services: ['Svcs', 'Servs.', 'Svc'],
  Systems: ['Sys.', 'Sys'],
  Solutions: ['Sol.', 'Solns'],
  Industries: ['Inds', 'Ind.'],
  Logistics: ['Log.', 'Logist.'],
  Manufacturing: ['Mfg', 'Mfg.'],
  Pharmaceuticals: ['Pharma', 'Pharm.'],
  Electronics: ['Elec.', 'Electr.'],
  Components: ['Comp.', 'Cmpts'],
  Construction: ['Constr.', 'Const.'],
  Consulting: ['Cons.', 'Consult.'],
  Laboratories: ['Labs'],
  Holdings: ['Hldgs', 'Hldg'],
  Partners: ['Ptnrs'],
  Brothers: ['Bros.', 'Bros'],
  Company: ['Co.', 'Co'],
  North: ['N.'],
  Northern: ['Nthn'],
  Western: ['W.'],
  Eastern: ['E.'],
  Central: ['Ctrl', 'Cent.'],
  Medical: ['Med.'],
  Instruments: ['Instr.'],
  Materials: ['Matls'],
  Analytics: ['Analyt.'],
  and: ['&'],
};

function abbreviationVariant(parts: NameParts, rnd: Random): NameParts | null {
  const words = parts.base.split(' ');
  const abbreviable = words.map((w, i) => (WORD_ABBREVIATIONS[w] ? i : -1)).filter((i) => i >= 0);
  // An acronym of the name words ("Northfield Rail Components" → "NRC") one time in four, if long enough.
  const capitals = words.filter((w) => /^[A-Z]/.test(w));
  if ((abbreviable.length === 0 || rnd.chance(0.25)) && capitals.length >= 2) {
    const acronym = capitals.map((w) => w[0]).join('');
    return { ...parts, base: acronym };
  }
  if (abbreviable.length === 0) return null;
  const i = rnd.pick(abbreviable);
  words[i] = rnd.pick(WORD_ABBREVIATIONS[words[i]!]!);
  return { ...parts, base: words.join(' ') };
}

/** Drops one word other than the first (Tran et al. 2013: missing tokens), or the legal form. */
function tokenDrop(parts: NameParts, rnd: Random): NameParts | null {
  const words = parts.base.split(' ');
  if (words.length < 2) return parts.form ? { base: parts.base } : null;
  const i = 1 + rnd.int(words.length - 1);
  words.splice(i, 1);
  return { ...parts, base: words.join(' ') };
}

function tokenSwap(parts: NameParts, rnd: Random): NameParts | null {
  const words = parts.base.split(' ');
  if (words.length < 2) return null;
  const i = rnd.int(words.length - 1);
  if (words[i] === words[i + 1]) return null;
  [words[i], words[i + 1]] = [words[i + 1]!, words[i]!];
  return { ...parts, base: words.join(' ') };
}

/** A missing space ("Brackenridge Fabrication" → "BrackenridgeFabrication") or a doubled one. */
function whitespaceVariant(s: string, rnd: Random): string | null {
  const spaces: number[] = [];
  for (let i = 0; i < s.length; i++) if (s[i] === ' ') spaces.push(i);
  if (spaces.length === 0) return null;
  const i = rnd.pick(spaces);
  return rnd.chance(0.7) ? s.slice(0, i) + s.slice(i + 1) : s.slice(0, i) + '  ' + s.slice(i + 1);
}

/** Accented letters written without their marks, or transcribed (ü → ue), as ASCII-only systems do. */
const DIACRITIC_FOLDS: Readonly<Record<string, readonly string[]>> = {
  ä: ['a', 'ae'],
  ö: ['o', 'oe'],
  ü: ['u', 'ue'],
  ß: ['ss'],
  é: ['e'],
  è: ['e'],
  ê: ['e'],
  à: ['a'],
  ó: ['o'],
  í: ['i'],
  á: ['a'],
  ñ: ['n'],
  ç: ['c'],
  å: ['a', 'aa'],
  ø: ['o', 'oe'],
  Ö: ['O', 'Oe'],
  Ü: ['U', 'Ue'],
  Ä: ['A', 'Ae'],
  É: ['E'],
};

function foldDiacritics(s: string, rnd: Random): string | null {
  let changed = false;
  let out = '';
  for (const ch of s) {
    const folds = DIACRITIC_FOLDS[ch];
    if (folds) {
      out += rnd.pick(folds);
      changed = true;
    } else out += ch;
  }
  return changed ? out : null;
}
