/**
 * The jurisdiction a descriptive phrase gives a party: "a Delaware corporation" → US-DE,
 * "incorporated and registered in England and Wales" → GB, "under the laws of Sweden" → SE.
 * Cue words followed by a place from a table; the earliest cue in the phrase wins.
 */
import { US_STATES } from '../analyse/index.ts';
import { ADJECTIVES, COUNTRIES, FOREIGN_PHRASES, SUBDIVISIONS } from './places.ts';
import { isWordChar } from './text-scan.ts';

const PLACE_CUES = [
  'laws of the state of',
  'laws of the commonwealth of',
  'laws of the province of',
  'laws of the',
  'laws of',
  'law of the',
  'law of',
  'incorporated and registered in',
  'incorporated in',
  'registered in',
  'organized in',
  'organised in',
  'formed in',
  'established in',
  'constituted in',
  'existing in',
  'state of',
];
const ENTITY_WORDS = [
  'corporation',
  'company',
  'limited',
  'llc',
  'l.l.c.',
  'partnership',
  'statutory trust',
  'business trust',
  'public',
  'private',
  'stock',
  'trust',
  'corp',
  'nonprofit',
  'non-profit',
  // "a Florida not-for-profit corporation" (US drafting, common practice).
  'not-for-profit',
  'not for profit',
  'professional',
  'proprietary',
  'general',
  'joint',
  'mutual',
  'cooperative',
  'co-operative',
  'société',
  'societe',
  'kabushiki',
  'entity',
  'bank',
  'banking',
];

const ALL_PLACES = [...US_STATES, ...SUBDIVISIONS, ...COUNTRIES].sort((a, b) => b[0].length - a[0].length);
const ADJECTIVE_PLACES = [...US_STATES, ...SUBDIVISIONS, ...ADJECTIVES].sort((a, b) => b[0].length - a[0].length);

function placeAt(lower: string, pos: number, table: ReadonlyArray<[string, string]>): [string, string] | undefined {
  for (const entry of table) {
    if (lower.startsWith(entry[0], pos) && !isWordChar(lower[pos + entry[0].length])) return entry;
  }
  return undefined;
}

function startsWord(lower: string, i: number): boolean {
  return !isWordChar(lower[i - 1]);
}

export function extractJurisdiction(phrase: string): string | undefined {
  const lower = phrase.toLowerCase();
  for (let i = 0; i < lower.length; i++) {
    if (!startsWord(lower, i)) continue;
    for (const cue of PLACE_CUES) {
      if (!lower.startsWith(cue, i) || isWordChar(lower[i + cue.length])) continue;
      let p = i + cue.length + 1;
      if (lower.startsWith('the ', p)) p += 4;
      const place = placeAt(lower, p, ALL_PLACES);
      if (place !== undefined) return place[1];
    }
    if (lower.startsWith('a ', i) || lower.startsWith('an ', i)) {
      const p = i + (lower[i + 1] === ' ' ? 2 : 3);
      const place = placeAt(lower, p, ADJECTIVE_PLACES);
      if (place !== undefined) {
        const after = p + place[0].length + 1;
        if (ENTITY_WORDS.some((w) => lower.startsWith(w, after))) return place[1];
      }
    }
    for (const [phraseText, code] of FOREIGN_PHRASES) if (lower.startsWith(phraseText, i)) return code;
  }
  return undefined;
}
