/**
 * Misread characters of optical character recognition in a scanned name (rn for m, 0 for O).
 */
import type { Random } from '../../../resolvers/prng.ts';
import { replaceOne } from './replace-one.ts';

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
