/**
 * Whether one word of a name abbreviates a word of the other: a leading part of it ("r" / "rural") or a business
 * contraction ("Mgmt" / "Management"), within the length limits below.
 */
import { isNumberToken } from './distinguishing-words.ts';
import { FUNCTION_WORDS } from './function-words.ts';

const ABBREVIATION_MAX_LENGTH = 4;
/** Below this many letters a word is not shortened by a leading part of two or more letters (see abbreviates). */
const ABBREVIATED_WORD_MIN_LENGTH = 6;
const CONTRACTION_MIN_LENGTH = 3;
const CONTRACTION_MAX_LENGTH = 5;

/**
 * `short` is a leading part of `long` ("r" of "rural", "coop" of "cooperativa"): at most four letters or half the
 * word ("Raiffeisen" is no abbreviation of "Raiffeisenbank"), not a number, not a function word.
 */
export function abbreviates(short: string, long: string): boolean {
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
