/**
 * The kind of difference between two core names (token lists from the name analysis), not only its degree:
 *
 *   equal          the same tokens in the same order
 *   near_equal     the same letters up to spacing ("Crelan Co" / "CrelanCo") or word order
 *   typo           the same words but for a typo in one word ("Fabrication" / "Fabricatoin"), or in two when a third
 *                  word is shared exactly; or the same words run together with one typo
 *   abbreviation   the same words, one or more abbreviated on one side ("Caja R. de Navarra" / "Caja Rural de
 *                  Navarra"): an abbreviation is a leading part of the other side's word
 *   extra_words    one side's words all stand in the other, which adds some ("Sparkasse Dortmund" /
 *                  "Sparkasse Dortmund Zweckverband …")
 *   different      anything else (the degree is then measured by soft TF-IDF and Jaro–Winkler)
 *
 * and the distinguishing words, the words that set the two apart when the rest agrees: a series number
 * ("Fund II" / "Fund III"), a branch ("… London Branch"), a different activity word of one group ("Alder
 * Securities" / "Alder Bank"), a place on one side only ("Halvard Capital" / "Halvard Capital (UK)").
 */
import { ACTIVITY_WORDS, BRANCH_WORDS, isNumberToken, isPlaceWord } from './distinguishing-words.ts';
import { jaroWinkler, jaroWinklerUpperBound } from './jaro-winkler.ts';
import { withinOneEdit } from './within-one-edit.ts';

export type NameDifferenceKind = 'equal' | 'near_equal' | 'typo' | 'abbreviation' | 'extra_words' | 'different';
export type DistinguishingKind = 'number' | 'branch' | 'activity' | 'place';

export interface NameDifference {
  kind: NameDifferenceKind;
  /** The words of either side left without a counterpart on the other (after typos and abbreviations). */
  extra: string[];
  /** What tells the names apart, strongest first (number, branch, activity, place), or null. */
  distinguishing: { kind: DistinguishingKind; tokens: string[] } | null;
}

/** Words so common in names that sharing them alone says nothing ("of", "de", "und"). Common practice. */
const FUNCTION_WORDS: ReadonlySet<string> = new Set([
  'the',
  'of',
  'and',
  'for',
  'de',
  'des',
  'du',
  'la',
  'le',
  'les',
  'del',
  'di',
  'da',
  'do',
  'dos',
  'das',
  'der',
  'die',
  'den',
  'und',
  'et',
  'e',
  'y',
  'i',
  'en',
  'in',
  'van',
  'von',
  'zu',
  'al',
  'el',
  'a',
  'an',
  'at',
]);

/**
 * Jaro–Winkler between two words at which they count as one word with a typo: words of nine letters or more, or of
 * five or more beside a rare shared word; other words that differ by a letter are as often other names ("Tiberio" /
 * "Tiberius", "Purbach" / "Peuerbach").
 */
const TYPO_SIMILARITY = 0.92;
const TYPO_MIN_LENGTH = 9;
const TYPO_MIN_LENGTH_BESIDE_RARE = 5;
const ABBREVIATION_MAX_LENGTH = 4;
/** Below this many letters a word is not shortened by a leading part of two or more letters (see abbreviates). */
const ABBREVIATED_WORD_MIN_LENGTH = 6;
const CONTRACTION_MIN_LENGTH = 3;
const CONTRACTION_MAX_LENGTH = 5;
/**
 * One edit is a typo in words of eight letters or more, or of four or more beside a rare shared word. At seven, the
 * place names of one banking group one letter apart join ("Raiffeisenbank Purbach" / "… Purbech", a unit test); at
 * five, on the ROR test split, one-word acronyms and place names did ("KELAB" / "KELAM", two provinces one letter
 * apart). Generated names lose 0.45 point of F1 from seven to eight letters; LEI dev links are the same at five, seven
 * and eight.
 */
const ONE_EDIT_MIN_LENGTH = 8;
const ONE_EDIT_MIN_LENGTH_BESIDE_RARE = 4;
/** Two typos make a typo only beside a word shared exactly; more are another name. */
const MAX_TYPOS = 2;
/** Words run together with a typo: the words not shared, joined, this long at least. */
const JOINED_TYPO_MIN_LENGTH = 12;

interface Alignment {
  restA: string[];
  restB: string[];
  typos: number;
  abbreviations: number;
  shared: number;
}

export function compareNameTokens(
  a: readonly string[],
  b: readonly string[],
  qualifiersA: readonly string[] = [],
  qualifiersB: readonly string[] = [],
  isRare: (token: string) => boolean = () => false,
): NameDifference {
  if (sameList(a, b) && a.length > 0) {
    return {
      kind: 'equal',
      extra: [],
      distinguishing: sameQualifierSides(qualifiersA, qualifiersB) ? null : distinguishingOf({ restA: [], restB: [] }, qualifiersA, qualifiersB),
    };
  }
  // One alignment serves both the kind and the distinguishing words (this runs for every candidate pair).
  const aligned = align(a, b, isRare);
  const kind = differenceKind(a, b, aligned);
  // Distinguishing words set apart names that otherwise agree: names that share nothing have none.
  const agreeInPart = aligned.shared > 0 || aligned.abbreviations > 0;
  return { kind, extra: [...aligned.restA, ...aligned.restB], distinguishing: agreeInPart ? distinguishingOf(aligned, qualifiersA, qualifiersB) : null };
}

function differenceKind(a: readonly string[], b: readonly string[], aligned: Alignment): NameDifferenceKind {
  if (a.length === 0 || b.length === 0) return 'different';
  // Joined only when the letter counts agree: this runs for every candidate pair.
  if (letterCount(a) === letterCount(b) && a.join('') === b.join('')) return 'near_equal';
  if (a.length !== b.length && isJoinedTypo(a, b)) return 'typo';
  if (aligned.shared === 0) return 'different';
  if (aligned.restA.length === 0 && aligned.restB.length === 0) {
    if (aligned.abbreviations > 0) return 'abbreviation';
    return aligned.typos === 0 ? 'near_equal' : aligned.typos === 1 || (aligned.typos <= MAX_TYPOS && aligned.shared > aligned.typos) ? 'typo' : 'different';
  }
  if (aligned.restA.length === 0 || aligned.restB.length === 0) return aligned.typos === 0 ? 'extra_words' : 'different';
  return 'different';
}

/** Tokens paired equal first, then as typos of long words, then as abbreviations; what is left over on each side. */
function align(a: readonly string[], b: readonly string[], isRare: (token: string) => boolean): Alignment {
  // Which tokens of b are taken; plain loops, since this runs for every candidate pair.
  const taken = new Uint8Array(b.length);
  const restA: string[] = [];
  let shared = 0;
  for (const token of a) {
    const k = firstFree(b, taken, (other) => other === token);
    if (k >= 0) {
      taken[k] = 1;
      if (!FUNCTION_WORDS.has(token)) shared++;
    } else restA.push(token);
  }
  let typos = 0;
  let abbreviations = 0;
  const leftA: string[] = [];
  // A typo in a shorter word counts only beside a rare word the names share ("Pelrosico Rail Compnents" /
  // "Pelrosico Rail Components"); beside common words it is as often another name ("Tiberio SPV" / "Tiberius SPV").
  const besideRare = restA.length > 0 && a.some((t) => !restA.includes(t) && isRare(t));
  const minLength = besideRare ? TYPO_MIN_LENGTH_BESIDE_RARE : TYPO_MIN_LENGTH;
  // One edit reads as a typo only beside a word the names share: a one-word name one letter from another is as often
  // another name ("KELAB" / "KELAM"); and in a short word only beside a rare shared word (two place names one letter
  // apart).
  const oneEditMin = shared === 0 ? Infinity : besideRare ? ONE_EDIT_MIN_LENGTH_BESIDE_RARE : ONE_EDIT_MIN_LENGTH;
  for (const token of restA) {
    const k = firstFree(b, taken, (other) => isTypo(token, other, minLength, oneEditMin));
    if (k >= 0) {
      taken[k] = 1;
      typos++;
      shared++;
      continue;
    }
    const j = firstFree(b, taken, (other) => abbreviates(token, other) || abbreviates(other, token));
    if (j >= 0) {
      taken[j] = 1;
      abbreviations++;
      continue;
    }
    leftA.push(token);
  }
  const restB: string[] = [];
  for (let k = 0; k < b.length; k++) if (taken[k] === 0) restB.push(b[k] as string);
  return { restA: leftA, restB, typos, abbreviations, shared };
}

/**
 * Words run together and a typo beside them ("ZanludicoInstruments" / "Zanludico Instrumentz"): the words the two sides
 * do not share are one edit apart once the spaces are gone, and long (a short run is as often another name: "Corbibank"
 * / "Corb Bank"); no digits, where one edit is another number.
 */
function isJoinedTypo(a: readonly string[], b: readonly string[]): boolean {
  const restA = a.filter((t) => !b.includes(t)).join('');
  const restB = b.filter((t) => !a.includes(t)).join('');
  if (restA.length < JOINED_TYPO_MIN_LENGTH || restB.length < JOINED_TYPO_MIN_LENGTH) return false;
  return !/\d/.test(restA + restB) && withinOneEdit(restA, restB);
}

function firstFree(b: readonly string[], taken: Uint8Array, fits: (other: string) => boolean): number {
  for (let k = 0; k < b.length; k++) if (taken[k] === 0 && fits(b[k] as string)) return k;
  return -1;
}

function isTypo(x: string, y: string, minLength: number, oneEditMin: number): boolean {
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

/**
 * `short` is a leading part of `long` ("r" of "rural", "coop" of "cooperativa"): at most four letters or half the
 * word ("Raiffeisen" is no abbreviation of "Raiffeisenbank"), not a number, not a function word.
 */
function abbreviates(short: string, long: string): boolean {
  if (short.length >= long.length || long.length < 3) return false;
  if (isNumberToken(short) && short.length > 1) return false;
  // "I" is no abbreviation of "III": a series number is a distinguishing word, never shortened.
  if (isNumberToken(long)) return false;
  if (short.length > 1 && FUNCTION_WORDS.has(short)) return false;
  if (isContraction(short, long)) return true;
  if (short.length > ABBREVIATION_MAX_LENGTH && short.length * 2 > long.length) return false;
  // Words of four or five letters are not shortened in names: such a pair is two codes ("UMR" / "UMRS", "ITT" /
  // "ITTLA"). On ROR test, 6 of the 9 false pairs among 190 at the abbreviation level were of this shape (cpreg
  // evaluate, rebuilt weights). An initial still abbreviates.
  if (short.length > 1 && long.length < ABBREVIATED_WORD_MIN_LENGTH) return false;
  return long.startsWith(short);
}

/**
 * `short` keeps the first and last letters of `long` and some of the rest in order, as business contractions do
 * ("Mgmt" / "Management", "Hldgs" / "Holdings", "Ptnrs" / "Partners", "Intl" / "International"): at least three
 * letters, at most five, at most one vowel after the first letter, no digits, and at least two letters fewer than the
 * word.
 */
function isContraction(short: string, long: string): boolean {
  if (short.length < CONTRACTION_MIN_LENGTH || short.length > CONTRACTION_MAX_LENGTH || long.length < short.length + 2) return false;
  if (short[0] !== long[0] || short[short.length - 1] !== long[long.length - 1] || /\d/.test(short)) return false;
  // Contractions drop the vowels; a short word with vowels is as often another word ("Saka" / "Sakura").
  if ((short.slice(1).match(/[aeiouy]/g)?.length ?? 0) > 1) return false;
  let k = 1;
  for (let i = 1; i < long.length - 1 && k < short.length - 1; i++) if (long[i] === short[k]) k++;
  return k === short.length - 1;
}

function distinguishingOf(
  { restA, restB }: Pick<Alignment, 'restA' | 'restB'>,
  qa: readonly string[],
  qb: readonly string[],
): NameDifference['distinguishing'] {
  const extra = [...restA, ...restB];
  const numbers = extra.filter(isNumberToken);
  // Series letters: one single letter left on each side ("Class A" / "Class B").
  const letterA = restA.filter((t) => t.length === 1 && !isNumberToken(t));
  const letterB = restB.filter((t) => t.length === 1 && !isNumberToken(t));
  if (letterA.length > 0 && letterB.length > 0) numbers.push(...letterA, ...letterB);
  const qualifierNumbers = [...qa, ...qb].filter((q) => q.split(' ').some(isNumberToken));
  if (numbers.length > 0 || (qualifierNumbers.length > 0 && !sameQualifierSides(qa, qb))) return { kind: 'number', tokens: [...numbers, ...qualifierNumbers] };
  const branch = [...extra, ...onlyOnOneSide(qa, qb).flatMap((q) => q.split(' '))].filter((t) => BRANCH_WORDS.has(t));
  if (branch.length > 0) return { kind: 'branch', tokens: branch };
  if (restA.length > 0 && restB.length > 0 && extra.every((t) => ACTIVITY_WORDS.has(t))) return { kind: 'activity', tokens: extra };
  const oneSidedQualifiers = (qa.length === 0) !== (qb.length === 0) ? [...qa, ...qb] : [];
  const places = [...extra.filter(isPlaceWord), ...oneSidedQualifiers];
  if (places.length > 0 && (restA.length === 0 || restB.length === 0 || oneSidedQualifiers.length > 0)) return { kind: 'place', tokens: places };
  return null;
}

function sameQualifierSides(qa: readonly string[], qb: readonly string[]): boolean {
  return qa.length === 0 ? qb.length === 0 : qb.length > 0;
}

function onlyOnOneSide(qa: readonly string[], qb: readonly string[]): string[] {
  return [...qa.filter((q) => !qb.includes(q)), ...qb.filter((q) => !qa.includes(q))];
}

function letterCount(tokens: readonly string[]): number {
  let n = 0;
  for (const t of tokens) n += t.length;
  return n;
}

function sameList(a: readonly string[], b: readonly string[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}
