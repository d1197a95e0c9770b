/**
 * Whether normalised name tokens name a place or a jurisdiction rather than a party: a country or subdivision
 * ("New South Wales", "the Netherlands"), the same after a polity word ("the State of New York", "the Kingdom of
 * Spain"), or a governing-law or venue phrase ("the laws of England and Wales", "the courts of Ontario",
 * "New York law"). Place names come from placeNames (ISO 3166-1 and 3166-2 as published); the framing words are
 * common practice in governing-law and jurisdiction clauses.
 */
import { placeNames } from './place-names.ts';

/** Words that open a law or venue phrase before "of": "the exclusive jurisdiction of the courts of". */
const VENUE_WORDS: ReadonlySet<string> = new Set([
  'the',
  'laws',
  'law',
  'courts',
  'court',
  'jurisdiction',
  'exclusive',
  'non',
  'federal',
  'state',
  'and',
  'of',
  'competent',
  'governing',
  'venue',
  'tribunals',
  'jurisdictions',
  'provincial',
  'supreme',
]);
/** The words among VENUE_WORDS that make the phrase a law or venue phrase ("the State of" alone is a polity). */
const VENUE_HEADS: ReadonlySet<string> = new Set(['laws', 'law', 'courts', 'court', 'jurisdiction', 'venue', 'tribunals', 'jurisdictions']);

/**
 * Polity words written before "of" and a place: "the Commonwealth of Massachusetts", "the Province of Ontario".
 * "Government of" and "City of" are left out: they name an authority that does sign contracts ("Government of
 * Alberta", "City of New York" are organisations in ROR).
 */
const POLITY_WORDS: ReadonlySet<string> = new Set([
  'state',
  'states',
  'commonwealth',
  'province',
  'territory',
  'kingdom',
  'republic',
  'federal',
  'federation',
  'grand',
  'duchy',
  'principality',
  'canton',
  'county',
  'emirate',
  'district',
  'people',
  'peoples',
  's',
  'democratic',
  'united',
  'islamic',
  'socialist',
  'union',
  'region',
  'autonomous',
  'community',
  'land',
  'free',
  'sultanate',
  'plurinational',
  'bolivarian',
  'oriental',
  'hellenic',
]);

/** Words after a place that keep it a jurisdiction: "New York law", "the Ontario courts". */
const TRAILING_VENUE: ReadonlySet<string> = new Set(['law', 'laws', 'courts', 'court', 'jurisdiction']);

export function isPlacePhrase(tokens: readonly string[]): boolean {
  let rest = dropLeading(tokens, 'the');
  while (rest.length > 1 && TRAILING_VENUE.has(rest[rest.length - 1] as string)) rest = rest.slice(0, -1);
  // Each stage is tried whole first: "United States of America" is a name, not "America" after a polity word.
  if (isPlaceOrPlaces(rest)) return true;
  rest = dropLeading(dropFramed(rest, VENUE_WORDS, VENUE_HEADS), 'the');
  if (isPlaceOrPlaces(rest)) return true;
  rest = dropLeading(dropFramed(rest, POLITY_WORDS, null), 'the');
  return isPlaceOrPlaces(rest);
}

/** One place, or places joined by "and"/"or" ("Jersey and Guernsey"; "England and Wales" is one ISO name). */
function isPlaceOrPlaces(tokens: readonly string[]): boolean {
  if (tokens.length === 0) return false;
  const names = placeNames();
  if (names.has(tokens.join(' '))) return true;
  const parts: string[][] = [[]];
  for (const t of tokens) {
    if (t === 'and' || t === 'or') parts.push([]);
    else (parts[parts.length - 1] as string[]).push(t);
  }
  if (parts.length < 2) return false;
  return parts.every((p) => p.length > 0 && names.has(dropLeading(p, 'the').join(' ')));
}

function dropLeading(tokens: readonly string[], word: string): readonly string[] {
  return tokens[0] === word ? tokens.slice(1) : tokens;
}

/**
 * Drops a run of framing words that ends with "of" ("laws of the State of", "Republic of"), when the run holds one
 * of `heads` (any word when null); the run stops at the last "of" inside it.
 */
function dropFramed(tokens: readonly string[], words: ReadonlySet<string>, heads: ReadonlySet<string> | null): readonly string[] {
  let lastOf = -1;
  let hasHead = heads === null;
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i] as string;
    if (!words.has(t) && t !== 'of' && t !== 'the') break;
    if (t === 'of') lastOf = i;
    if (heads !== null && heads.has(t)) hasHead = true;
  }
  if (lastOf < 0 || !hasHead) return tokens;
  return tokens.slice(lastOf + 1);
}
