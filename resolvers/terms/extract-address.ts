/**
 * The address a descriptive phrase gives ("whose registered office is at 4 Quarry Lane, Leeds LS1 4AB").
 * Kept as written; it helps a reviewer more than the matcher.
 */
import { isWordChar, trimBounds } from './text-scan.ts';

const ADDRESS_CUES = [
  'registered office is situated at',
  'registered office is at',
  'registered office at',
  'registered office is',
  'registered address is',
  'registered address at',
  'principal place of business at',
  'principal place of business is',
  'principal office at',
  'principal offices at',
  'offices at',
  'office at',
  'located at',
  'address at',
  'whose address is',
  'residing at',
  'domiciled at',
  'with its seat in',
  'mit sitz in',
  'mit sitz',
  'siège social est situé',
  'siège social est',
  'siège social',
  'con sede legale in',
  'con sede in',
  'con domicilio social en',
  'con domicilio en',
  'domicilio social en',
];

/** Words that end the address: the next clause of the descriptive phrase. */
const END_CUES = [
  ', registered',
  ', company',
  ', with company',
  ', represented',
  ', acting',
  ', incorporated',
  ', hereinafter',
  ', a company',
  ', eingetragen',
  ', immatriculée',
  ', inscrite',
  ', registrada',
  ', iscritta',
  ' and ',
  ' with company',
  ' registered under',
  ', vertreten',
  ', représentée',
  ', representada',
  ', rappresentata',
  ', acn',
  ', abn',
  ', vat',
  ', organisation number',
  ', corporate',
  ', tax',
  ', ein',
  ' (',
  ', under',
];

const MAX_ADDRESS = 200;
const FIRST_LETTERS = new Set(ADDRESS_CUES.map((c) => c[0]));

export function extractAddress(phrase: string): string | undefined {
  const lower = phrase.toLowerCase();
  if (lower.length !== phrase.length) return undefined;
  let from = -1;
  for (let i = 0; i < lower.length && from < 0; i++) {
    if (!FIRST_LETTERS.has(lower[i]) || isWordChar(lower[i - 1])) continue;
    for (const cue of ADDRESS_CUES) {
      if (lower.startsWith(cue, i)) {
        from = i + cue.length;
        break;
      }
    }
  }
  if (from < 0) return undefined;
  let end = Math.min(phrase.length, from + MAX_ADDRESS);
  for (const cue of END_CUES) {
    const at = lower.indexOf(cue, from);
    if (at >= 0 && at < end) end = at;
  }
  const semi = phrase.indexOf(';', from);
  if (semi >= 0 && semi < end) end = semi;
  const [s, e] = trimBounds(phrase, from, end, ':,.');
  const address = phrase.slice(s, e);
  return address.length >= 3 ? address : undefined;
}
