/**
 * A name written as it sounds (ph for f, k for c), as one who heard it over the phone writes it.
 */
import type { Random } from '../../../resolvers/prng.ts';
import { replaceOne } from './replace-one.ts';

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
