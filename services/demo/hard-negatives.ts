/**
 * Hard negatives for the scale generator: new entities whose names imitate an existing entity's name and
 * differ from it in one small way that, in practice, means another company — another activity word of the
 * same group, a number in a series, a place qualifier, a branch. A benchmark that contains them penalises a
 * matcher that links on "nearly the same words". The mix and the word lists are documented in
 * docs/generator.md ("Hard negatives"); keep the two in step. Place names are ordinary geography; every
 * company word stays the generator's coined word.
 */
import { weightedIndex, type Random } from '../../resolvers/prng.ts';
import type { NameParts } from './render-name.ts';
import type { LegalFormFamily } from './name-parts.ts';
import { countryOf, JURISDICTIONS } from './name-parts.ts';

/** The kinds of hard negative added to the sibling kinds `legal_form` and `jurisdiction`. */
export const HARD_NEGATIVE_KINDS = ['activity', 'series', 'place', 'branch'] as const;
export type HardNegativeKind = (typeof HARD_NEGATIVE_KINDS)[number];

/** How a numbered series writes its number: "Belpelmore Capital II Ltd", "Belpelmore Capital 2 Ltd", "Belpelmore Capital Two Ltd". */
export const SERIES_MARKERS = {
  roman: ['I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII', 'IX', 'X', 'XI', 'XII'],
  digit: ['1', '2', '3', '4', '5', '6', '7', '8', '9', '10', '11', '12'],
  word: ['One', 'Two', 'Three', 'Four', 'Five', 'Six', 'Seven', 'Eight', 'Nine', 'Ten', 'Eleven', 'Twelve'],
} as const;
export type SeriesStyle = keyof typeof SERIES_MARKERS;
const SERIES_STYLES = Object.keys(SERIES_MARKERS) as SeriesStyle[];
/** The highest number a series reaches; a series stops there. */
export const SERIES_MAX = SERIES_MARKERS.roman.length;

/** Where a series member sits: its style, its number (1-based) and the unnumbered base it numbers. */
export interface SeriesPosition {
  style: SeriesStyle;
  n: number;
  rootBase: string;
}

/** A hard negative before it gets an entity id: its jurisdiction, its name and the words that set it apart. */
export interface HardNegativeName {
  country: string;
  parts: NameParts;
  /** The words that tell it from the entity it imitates; a variant that loses them is not kept. */
  marker: string;
  series?: SeriesPosition;
}

/** Country qualifiers of a subsidiary's name, by legal-form country ("Belpelmore Logistics (UK) Ltd"). */
export const COUNTRY_QUALIFIERS: Readonly<Record<string, readonly string[]>> = {
  US: ['USA', 'US', 'America'],
  GB: ['UK', 'Great Britain'],
  DE: ['Deutschland', 'Germany'],
  FR: ['France'],
  NL: ['Nederland', 'Netherlands'],
  JP: ['Japan'],
  AU: ['Australia', 'Aust'],
  SE: ['Sverige', 'Sweden'],
  IT: ['Italia', 'Italy'],
  ES: ['España', 'Spain'],
};

/** Regional qualifiers ("Belpelmore Logistics (Asia) Ltd"). */
export const REGION_QUALIFIERS = ['Asia', 'Europe', 'Asia Pacific', 'Americas', 'EMEA', 'Nordic', 'Middle East'] as const;

/** Cities where a branch sits, by jurisdiction: the local spelling, then the English one. */
export const BRANCH_CITIES: Readonly<Record<string, ReadonlyArray<readonly [string, string]>>> = {
  'US-DE': [['Wilmington', 'Wilmington']],
  'US-CA': [
    ['San Francisco', 'San Francisco'],
    ['Los Angeles', 'Los Angeles'],
  ],
  'US-NY': [['New York', 'New York']],
  'US-TX': [
    ['Houston', 'Houston'],
    ['Dallas', 'Dallas'],
  ],
  GB: [
    ['London', 'London'],
    ['Manchester', 'Manchester'],
    ['Edinburgh', 'Edinburgh'],
  ],
  DE: [
    ['Frankfurt am Main', 'Frankfurt'],
    ['München', 'Munich'],
    ['Hamburg', 'Hamburg'],
    ['Düsseldorf', 'Dusseldorf'],
  ],
  FR: [
    ['Paris', 'Paris'],
    ['Lyon', 'Lyon'],
  ],
  NL: [
    ['Amsterdam', 'Amsterdam'],
    ['Rotterdam', 'Rotterdam'],
  ],
  JP: [
    ['Tokyo', 'Tokyo'],
    ['Osaka', 'Osaka'],
  ],
  AU: [
    ['Sydney', 'Sydney'],
    ['Melbourne', 'Melbourne'],
  ],
  SE: [
    ['Stockholm', 'Stockholm'],
    ['Göteborg', 'Gothenburg'],
  ],
  IT: [
    ['Milano', 'Milan'],
    ['Roma', 'Rome'],
  ],
  ES: [
    ['Madrid', 'Madrid'],
    ['Barcelona', 'Barcelona'],
  ],
};

/**
 * How a branch's name continues after the head office's legal form, in the branch country's language
 * ("Belpelmore Logistics AG Zweigniederlassung Hamburg", "Belpelmore Logistics AG, Sucursal en Madrid"); `{city}` is
 * the local spelling. Everywhere the English ", {city} Branch" is used too (with the English spelling).
 */
export const LOCAL_BRANCH_PHRASES: Readonly<Record<string, readonly string[]>> = {
  DE: [' Zweigniederlassung {city}', ' Niederlassung {city}'],
  FR: [', succursale de {city}'],
  NL: [', bijkantoor {city}'],
  SE: [', filial {city}'],
  IT: [', sede secondaria di {city}'],
  ES: [', Sucursal en {city}'],
};
const ENGLISH_BRANCH_PHRASE = ', {city} Branch';

/** One member of a numbered series: the unnumbered base with the series number before the legal form. */
export function seriesMember(parent: NameParts, country: string, position: SeriesPosition): HardNegativeName {
  const marker = SERIES_MARKERS[position.style][position.n - 1]!;
  return { country, parts: { ...parent, base: `${position.rootBase} ${marker}` }, marker, series: position };
}

/** The first numbered member of a series whose unnumbered name is the parent's: mostly 2, sometimes 1 or 3. */
export function startSeries(parent: NameParts, country: string, rnd: Random): HardNegativeName {
  const style = rnd.pick(SERIES_STYLES);
  const n = [1, 2, 2, 2, 3][rnd.int(5)]!;
  return seriesMember(parent, country, { style, n, rootBase: parent.base });
}

/** The next member after a numbered one ("… II" → "… III"), or undefined at the end of the numbers. */
export function nextInSeries(previous: NameParts, country: string, at: SeriesPosition): HardNegativeName | undefined {
  if (at.n >= SERIES_MAX) return undefined;
  return seriesMember(previous, country, { ...at, n: at.n + 1 });
}

/**
 * A subsidiary named after its parent with a place qualifier before the legal form, same form and
 * jurisdiction: its own country's qualifier ("(UK)") or a region ("(Asia)"), in brackets three times in four.
 */
export function placeQualified(parent: NameParts, country: string, rnd: Random): HardNegativeName {
  const place = rnd.chance(0.6) ? rnd.pick(COUNTRY_QUALIFIERS[countryOf(country)]!) : rnd.pick(REGION_QUALIFIERS);
  const written = rnd.chance(0.75) ? `(${place})` : place;
  return { country, parts: { ...parent, base: `${parent.base} ${written}` }, marker: place };
}

/**
 * A branch of the parent: the parent's full name followed by the branch's place ("Belpelmore Logistics AG,
 * London Branch"). Half the time the branch sits in the parent's own jurisdiction (another city), otherwise
 * in another one drawn by the jurisdiction weights; its country is where the branch is. The phrase is held
 * with the legal form, so that legal-form variants keep it ("Belpelmore Logistics Aktiengesellschaft, London Branch").
 */
export function branchOf(parent: NameParts, country: string, rnd: Random): HardNegativeName | undefined {
  if (!parent.form || !parent.family) return undefined;
  const others = JURISDICTIONS.filter((j) => j.code !== country);
  const where = rnd.chance(0.5)
    ? country
    : others[
        weightedIndex(
          others.map((j) => j.weight),
          rnd,
        )
      ]!.code;
  const [local, english] = rnd.pick(BRANCH_CITIES[where]!);
  const localPhrases = LOCAL_BRANCH_PHRASES[countryOf(where)];
  const phrase = localPhrases && rnd.chance(0.6) ? rnd.pick(localPhrases).replace('{city}', local) : ENGLISH_BRANCH_PHRASE.replace('{city}', english);
  const family: LegalFormFamily = { canonical: parent.family.canonical + phrase, variants: parent.family.variants.map((v) => v + phrase) };
  return { country: where, parts: { ...parent, form: parent.form + phrase, family }, marker: phrase };
}

/**
 * The comparison key of a marker or a name: accents removed, lower case, every run of characters other than
 * letters and digits one space. "Belpelmore Logistics AG, LONDON BRANCH" → "belpelmore logistics ag london branch".
 */
export function markerKey(s: string): string {
  return s
    .normalize('NFD')
    .replace(/\p{M}+/gu, '')
    .toLowerCase()
    .replace(/[^\p{L}\p{N}]+/gu, ' ')
    .trim();
}

/** Whether a name still carries the marker as whole words (after markerKey on both). */
export function carriesMarker(name: string, marker: string): boolean {
  return ` ${markerKey(name)} `.includes(` ${markerKey(marker)} `);
}
