/**
 * A name whose accented letters a system without them wrote plain or transcribed.
 */
import type { Random } from '../../../resolvers/prng.ts';

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

export function foldDiacritics(s: string, rnd: Random): string | null {
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
