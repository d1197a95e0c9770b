/**
 * Names of countries and their subdivisions, normalised like party names, so that "New South Wales", "the
 * Netherlands" or "England and Wales" are recognised as places and never registered as parties.
 *
 * Sources, all offline (nothing is fetched at run time):
 * - ISO 3166-1 country names and ISO 3166-2 subdivision names as published, from the `iso-3166` npm package
 *   (iso31661, iso31662); ISO writes some names inverted ("Korea, Republic of", "Bristol, City of"), so both the
 *   head ("Korea") and the natural order ("Republic of Korea") are kept;
 * - the short English and local-language country names of the CLDR data that ships with Node (Intl.DisplayNames:
 *   "United Kingdom", "South Korea", "Deutschland", "Pays-Bas"), which contracts use more often than ISO's;
 * - the places of PLACE_JURISDICTIONS, which descriptors already read ("a Delaware corporation").
 */
import { iso31661, iso31662 } from 'iso-3166';
import { normaliseTokens } from './normalise-name.ts';
import { PLACE_JURISDICTIONS } from './place-jurisdictions.ts';

/** Languages whose country names contracts drafted in them use ("nach dem Recht der Bundesrepublik Deutschland"). */
const DISPLAY_LOCALES = ['en', 'de', 'fr', 'es', 'it', 'nl', 'pt'] as const;

/**
 * A place name shorter than this many letters is left out: ISO 3166-2 has three-letter districts ("Bam", "Est",
 * "Qax") that read as initials or words more often than as places in a party list.
 */
export const MIN_PLACE_CHARS = 4;

let cache: ReadonlySet<string> | null = null;

/** Every place name, as normalised tokens joined by one space ("new south wales", "netherlands"). */
export function placeNames(): ReadonlySet<string> {
  if (cache === null) cache = buildPlaceNames();
  return cache;
}

function buildPlaceNames(): Set<string> {
  const out = new Set<string>();
  const add = (raw: string | undefined): void => {
    if (raw === undefined) return;
    for (const written of spellings(raw)) {
      const key = normaliseTokens(written).join(' ');
      if (key.replace(/ /gu, '').length < MIN_PLACE_CHARS) continue;
      out.add(key);
    }
  };
  for (const c of iso31661) add(c.name);
  for (const s of iso31662) add(s.name);
  for (const locale of DISPLAY_LOCALES) {
    const names = displayNames(locale);
    if (names === null) continue;
    for (const c of iso31661) add(names.of(c.alpha2));
  }
  for (const place of PLACE_JURISDICTIONS.keys()) add(place);
  return out;
}

function displayNames(locale: string): Intl.DisplayNames | null {
  try {
    return new Intl.DisplayNames([locale], { type: 'region', fallback: 'none' });
  } catch {
    return null; // a Node built without that locale's data: ISO's names still cover the country
  }
}

/**
 * The ways one published name is written in running text: without its parenthesis ("Falkland Islands
 * (Malvinas)"), each side of a slash ("Bolama / Bijagós"), and an inverted name in both orders.
 */
export function spellings(published: string): string[] {
  const out: string[] = [];
  const bare = withoutParentheses(published).replace(/\s+/gu, ' ').trim();
  for (const part of bare.split('/')) {
    const name = part.trim();
    if (name === '') continue;
    const comma = name.indexOf(', ');
    if (comma < 0) {
      out.push(name);
      continue;
    }
    const head = name.slice(0, comma);
    const tail = name.slice(comma + 2);
    // "Korea, Republic of" → "Korea", "Republic of Korea"; "Virgin Islands, British" → "British Virgin Islands".
    out.push(head, `${tail} ${head}`, `${head} ${tail}`);
  }
  return out;
}

/** The text without its parenthesised parts (a scan, not a regex: names come from a package, not from users). */
function withoutParentheses(s: string): string {
  let out = '';
  let depth = 0;
  for (const ch of s) {
    if (ch === '(') depth++;
    else if (ch === ')' && depth > 0) depth--;
    else if (depth === 0) out += ch;
  }
  return out;
}
