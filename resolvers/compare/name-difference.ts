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
import { abbreviates } from './abbreviates.ts';
import { ACTIVITY_WORDS, BRANCH_WORDS, isNumberToken, isPlaceWord } from './distinguishing-words.ts';
import { FUNCTION_WORDS } from './function-words.ts';
import { isTypo, ONE_EDIT_MIN_LENGTH, ONE_EDIT_MIN_LENGTH_BESIDE_RARE, TYPO_MIN_LENGTH, TYPO_MIN_LENGTH_BESIDE_RARE } from './is-typo.ts';
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
