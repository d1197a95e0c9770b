/**
 * The scale generator: invented organisation names with known entity ids and realistic variants, streamed
 * so that a million names never sit in memory at once (only a shuffle window of a few thousand rows).
 * The mix of variants is documented in docs/generator.md; keep the two in step.
 */
import { seededRandom, weightedIndex, type Random } from '../../resolvers/prng.ts';
import { corrupt, VARIANT_KINDS, type VariantKind } from './corrupt.ts';
import { renderName, type NameParts } from './render-name.ts';
import {
  branchOf,
  carriesMarker,
  HARD_NEGATIVE_KINDS,
  nextInSeries,
  placeQualified,
  startSeries,
  type HardNegativeKind,
  type HardNegativeName,
  type SeriesPosition,
} from './hard-negatives.ts';
import { DESCRIPTORS, ENDINGS, INDUSTRIES, JURISDICTIONS, LEGAL_FORMS, LOCAL_INDUSTRIES, SYLLABLES, countryOf } from './name-parts.ts';

export interface GeneratedNameRow {
  /** Shared by every variant of one invented organisation (the ground truth). */
  entityId: string;
  name: string;
  /** ISO 3166-1 alpha-2, or ISO 3166-2 for US states ("US-DE"). */
  country: string;
  /** "original", one VariantKind, or two joined by "+" ("keyboard_typo+case"). */
  variantKind: string;
  /**
   * For an original that imitates another entity (a sibling: another legal form or jurisdiction, another
   * activity word, a series number, a place qualifier, a branch): that entity's id.
   */
  siblingOf?: string;
  /** How a sibling's original differs from the entity it imitates. Not written to the CSV. */
  siblingKind?: SiblingKind;
}

/** The ways a sibling differs from the entity it imitates (docs/generator.md). */
export const SIBLING_KINDS = ['legal_form', 'jurisdiction', ...HARD_NEGATIVE_KINDS] as const;
export type SiblingKind = (typeof SIBLING_KINDS)[number];

export interface NameMix {
  /** Probability of 0, 1, 2… variants per entity (index = number of variants). Sums to 1. */
  variantsPerEntity: readonly number[];
  /** Probability of each corruption kind for a variant. Sums to 1. */
  kinds: Readonly<Record<VariantKind, number>>;
  /** Probability that a variant gets a second, different corruption on top of the first. */
  secondCorruption: number;
  /** Probability that a new entity is a sibling: same name words, other legal form or jurisdiction. */
  sibling: number;
  /**
   * Probability that a new entity is a hard negative of each kind, imitating the entity before it: another
   * activity word of the same coined word, a numbered series member, a place-qualified subsidiary, a branch.
   */
  hardNegatives: Readonly<Record<HardNegativeKind, number>>;
  /** Probability that a numbered series member is followed by the next number of the same series. */
  seriesContinues: number;
  /** Rows held back and emitted in random order, so that variants do not follow their original. */
  shuffleWindow: number;
}

/** The documented default mix (docs/generator.md). */
export const DEFAULT_MIX: NameMix = {
  variantsPerEntity: [0.3, 0.25, 0.2, 0.13, 0.07, 0.05],
  kinds: {
    legal_form: 0.2,
    punctuation: 0.08,
    case: 0.08,
    keyboard_typo: 0.18,
    ocr: 0.06,
    phonetic: 0.08,
    abbreviation: 0.1,
    token_drop: 0.1,
    token_swap: 0.05,
    whitespace: 0.05,
    diacritics: 0.02,
  },
  secondCorruption: 0.2,
  sibling: 0.03,
  hardNegatives: { activity: 0.035, series: 0.025, place: 0.03, branch: 0.03 },
  seriesContinues: 0.3,
  shuffleWindow: 4096,
};

/** Above this, entity cores would repeat (see coreSpace); a clear limit beats silent duplicates. */
export const MAX_NAMES = 10_000_000;

/** Coined words (two syllables and an ending); a core number is a coined word and an activity word. */
export const COINED_WORDS = SYLLABLES.length * SYLLABLES.length * ENDINGS.length;
const CORE_SPACE = COINED_WORDS * INDUSTRIES.length;
/** Activity numbers whose word is one word ("Logistics", not "Rail Components"): activity siblings use these. */
const ONE_WORD_ACTIVITIES = INDUSTRIES.flatMap((w, i) => (w.includes(' ') ? [] : [i]));

/** An invented organisation: the name words, its jurisdiction and its legal form. */
export interface InventedOrganisation {
  entityId: string;
  country: string;
  parts: NameParts;
  siblingOf?: string;
  siblingKind?: SiblingKind;
  /** Its core number (coined word and activity), for an organisation invented from one. */
  core?: number;
  /** For a hard negative: the words that tell it from the entity it imitates (a variant must keep them). */
  marker?: string;
  /** For a member of a numbered series: where it sits. */
  series?: SeriesPosition;
}

/**
 * Yields `count` rows: originals and their variants, mixed by a shuffle window. Same seed, same rows.
 * Throws a RangeError naming the limit when count is out of range.
 */
export function* generateNames(count: number, seed: number, mix: NameMix = DEFAULT_MIX): Generator<GeneratedNameRow> {
  if (!Number.isInteger(count) || count < 0 || count > MAX_NAMES) {
    throw new RangeError(`names: expected a whole number from 0 to ${MAX_NAMES}, got ${count}`);
  }
  const rnd = seededRandom(seed);
  const cores = corePermutation(seed);
  // Entity cores are drawn in order 0, 1, 2 … and there are at most `count` entities: a core whose position
  // is `count` or more is never drawn, so an activity sibling can take it without repeating anyone's name.
  const drawn = (core: number): boolean => cores.indexOf(core) < count;
  const window: GeneratedNameRow[] = [];
  let emitted = 0;
  let entityIndex = 0;
  let coreIndex = 0;
  let previous: InventedOrganisation | undefined;
  while (emitted + window.length < count) {
    const sibling = previous ? imitation(previous, entityIndex, rnd, mix, drawn) : undefined;
    const org = sibling ?? inventOrganisation(cores.coreOf(coreIndex++), entityIndex, rnd);
    entityIndex++;
    previous = org;
    const rows = [originalRow(org), ...variantRows(org, rnd, mix)];
    for (const row of rows) {
      if (emitted + window.length >= count) break;
      window.push(row);
      if (window.length > mix.shuffleWindow) {
        yield takeRandom(window, rnd);
        emitted++;
      }
    }
  }
  while (window.length > 0) yield takeRandom(window, rnd);
}

function takeRandom<T>(items: T[], rnd: Random): T {
  const i = rnd.int(items.length);
  const item = items[i]!;
  items[i] = items[items.length - 1]!;
  items.pop();
  return item;
}

/**
 * A bijection of [0, CORE_SPACE) chosen by the seed, so entity cores never repeat and look unordered:
 * `coreOf(i)` is the i-th entity's core, `indexOf(core)` the position at which a core is drawn.
 */
export function corePermutation(seed: number): { coreOf: (i: number) => number; indexOf: (core: number) => number } {
  let a = 1_000_003 + 2 * (seed % 1000);
  while (gcd(a, CORE_SPACE) !== 1) a += 2;
  const b = (seed * 7919) % CORE_SPACE;
  const n = BigInt(CORE_SPACE);
  const inverse = modInverse(BigInt(a), n);
  return {
    coreOf: (i) => Number((BigInt(a) * BigInt(i) + BigInt(b)) % n),
    indexOf: (core) => Number(((((BigInt(core) - BigInt(b)) % n) + n) * inverse) % n),
  };
}

function gcd(x: number, y: number): number {
  while (y !== 0) [x, y] = [y, x % y];
  return x;
}

/** x⁻¹ mod n for x coprime to n (extended Euclid). */
function modInverse(x: bigint, n: bigint): bigint {
  let [r0, r1] = [x % n, n];
  let [s0, s1] = [1n, 0n];
  while (r1 !== 0n) {
    const q = r0 / r1;
    [r0, r1] = [r1, r0 - q * r1];
    [s0, s1] = [s1, s0 - q * s1];
  }
  return ((s0 % n) + n) % n;
}

export function entityIdOf(index: number): string {
  return `e${String(index + 1).padStart(7, '0')}`;
}

/** Builds one organisation from its core number: coined word (two syllables and an ending) plus activity. */
export function inventOrganisation(core: number, index: number, rnd: Random): InventedOrganisation {
  const country = pickJurisdiction(rnd);
  let rest = core;
  const s1 = rest % SYLLABLES.length;
  rest = Math.floor(rest / SYLLABLES.length);
  const s2 = rest % SYLLABLES.length;
  rest = Math.floor(rest / SYLLABLES.length);
  const end = rest % ENDINGS.length;
  const industry = Math.floor(rest / ENDINGS.length);
  const coined = capitalise(SYLLABLES[s1]! + SYLLABLES[s2]! + ENDINGS[end]!);
  const local = LOCAL_INDUSTRIES[countryOf(country)];
  // Injective: a local word is used only for the first industry numbers, one word per number.
  const activity = local && industry < local.length && rnd.chance(0.6) ? local[industry]! : INDUSTRIES[industry]!;
  const words = [coined];
  if (rnd.chance(0.15)) words.push(rnd.pick(DESCRIPTORS));
  words.push(activity);
  const families = LEGAL_FORMS[countryOf(country)]!;
  const family = families[rnd.chance(0.7) ? 0 : rnd.int(families.length)]!;
  const comma = countryOf(country) === 'US' && rnd.chance(0.5);
  return { entityId: entityIdOf(index), country, core, parts: { base: words.join(' '), form: family.canonical, family, comma } };
}

/**
 * The next entity as an imitation of the previous one, or undefined for a new organisation. A numbered
 * series member may be followed by the next number; otherwise only an entity that imitates no other gets
 * an imitation (a sibling of a sibling could repeat the first organisation's name exactly). One draw picks
 * the kind; a kind that does not apply to the previous entity gives a new organisation.
 */
function imitation(
  previous: InventedOrganisation,
  index: number,
  rnd: Random,
  mix: NameMix,
  drawn: (core: number) => boolean,
): InventedOrganisation | undefined {
  if (previous.series) {
    if (!rnd.chance(mix.seriesContinues)) return undefined;
    return hardNegative(previous, index, 'series', nextInSeries(previous.parts, previous.country, previous.series));
  }
  if (previous.siblingOf) return undefined;
  const kinds: ReadonlyArray<'sibling' | HardNegativeKind> = ['sibling', ...HARD_NEGATIVE_KINDS];
  let x = rnd.next();
  for (const kind of kinds) {
    x -= kind === 'sibling' ? mix.sibling : mix.hardNegatives[kind];
    if (x >= 0) continue;
    switch (kind) {
      case 'sibling':
        return siblingOf(previous, index, rnd);
      case 'activity':
        return hardNegative(previous, index, kind, activitySibling(previous, drawn));
      case 'series':
        return hardNegative(previous, index, kind, startSeries(previous.parts, previous.country, rnd));
      case 'place':
        return hardNegative(previous, index, kind, placeQualified(previous.parts, previous.country, rnd));
      case 'branch':
        return hardNegative(previous, index, kind, branchOf(previous.parts, previous.country, rnd));
    }
  }
  return undefined;
}

function hardNegative(of: InventedOrganisation, index: number, kind: HardNegativeKind, made: HardNegativeName | undefined): InventedOrganisation | undefined {
  if (!made) return undefined;
  return {
    entityId: entityIdOf(index),
    country: made.country,
    parts: made.parts,
    siblingOf: of.entityId,
    siblingKind: kind,
    marker: made.marker,
    series: made.series,
  };
}

/**
 * A company of the same group that differs in its one activity word only: same coined word, descriptor,
 * legal form and jurisdiction ("Belnatbrook Freight Ltd" beside "Belnatbrook Logistics Ltd"). Its core (the coined
 * word with the other activity) is one that is never drawn for an entity of this run, and two siblings of
 * one coined word never take the same one: the k-th drawn activity of a coined word (in activity order)
 * maps to the k-th undrawn one, counted from an offset that depends on the coined word only. Undefined when
 * the parent's activity is more than one word, or no undrawn activity is left (runs of several million names).
 */
function activitySibling(parent: InventedOrganisation, drawn: (core: number) => boolean): HardNegativeName | undefined {
  if (parent.core === undefined) return undefined;
  const industry = Math.floor(parent.core / COINED_WORDS);
  const other = siblingActivity(parent.core, drawn);
  if (other === undefined) return undefined;
  const words = parent.parts.base.split(' ');
  const local = LOCAL_INDUSTRIES[countryOf(parent.country)];
  // A parent written with its local activity word gets a local word too where there is one (injective as in inventOrganisation).
  const wasLocal = local !== undefined && local[industry] === words[words.length - 1];
  const activity = wasLocal && other < local.length ? local[other]! : INDUSTRIES[other]!;
  words[words.length - 1] = activity;
  return { country: parent.country, parts: { ...parent.parts, base: words.join(' ') }, marker: activity };
}

/**
 * The activity number (index into INDUSTRIES) of an activity sibling of the entity with this core, or
 * undefined. `drawn(core)` says whether a core may be drawn for an entity of the run.
 */
export function siblingActivity(core: number, drawn: (core: number) => boolean): number | undefined {
  const coined = core % COINED_WORDS;
  const industry = Math.floor(core / COINED_WORDS);
  if (!ONE_WORD_ACTIVITIES.includes(industry)) return undefined;
  const taken: number[] = [];
  const free: number[] = [];
  for (const i of ONE_WORD_ACTIVITIES) (drawn(coined + COINED_WORDS * i) ? taken : free).push(i);
  const rank = taken.indexOf(industry);
  if (rank < 0 || rank >= free.length) return undefined;
  return free[(rank + (coined % free.length)) % free.length]!;
}

/** Same words, another legal form in the same country or the same form family elsewhere: a different entity. */
function siblingOf(org: InventedOrganisation, index: number, rnd: Random): InventedOrganisation {
  const families = LEGAL_FORMS[countryOf(org.country)]!;
  const others = families.filter((f) => f !== org.parts.family);
  if (others.length > 0 && rnd.chance(0.5)) {
    const family = rnd.pick(others);
    return {
      entityId: entityIdOf(index),
      country: org.country,
      siblingOf: org.entityId,
      siblingKind: 'legal_form',
      parts: { ...org.parts, form: family.canonical, family },
    };
  }
  const country = rnd.pick(JURISDICTIONS.filter((j) => countryOf(j.code) !== countryOf(org.country))).code;
  const family = LEGAL_FORMS[countryOf(country)]![0]!;
  // The comma before the form is a US habit ("Belpelmore Logistics, Inc."): kept only for a US sibling.
  const comma = countryOf(country) === 'US' && org.parts.comma;
  return {
    entityId: entityIdOf(index),
    country,
    siblingOf: org.entityId,
    siblingKind: 'jurisdiction',
    parts: { ...org.parts, form: family.canonical, family, comma },
  };
}

function originalRow(org: InventedOrganisation): GeneratedNameRow {
  const row: GeneratedNameRow = {
    entityId: org.entityId,
    name: renderName(org.parts),
    country: org.country,
    variantKind: 'original',
    siblingOf: org.siblingOf,
  };
  if (org.siblingKind) row.siblingKind = org.siblingKind;
  return row;
}

function variantRows(org: InventedOrganisation, rnd: Random, mix: NameMix): GeneratedNameRow[] {
  const n = weightedIndex(mix.variantsPerEntity, rnd);
  const rows: GeneratedNameRow[] = [];
  const seen = new Set<string>([renderName(org.parts)]);
  for (let v = 0; v < n; v++) {
    const variant = makeVariant(org.parts, rnd, mix);
    if (!variant || seen.has(variant.name)) continue;
    // A hard negative's variant that lost what sets it apart could be the imitated entity's name: not kept.
    if (org.marker !== undefined && !carriesMarker(variant.name, org.marker)) continue;
    seen.add(variant.name);
    rows.push({ entityId: org.entityId, name: variant.name, country: org.country, variantKind: variant.kind });
  }
  return rows;
}

/** One variant: a kind drawn from the mix (redrawn when it does not apply), maybe a second on top. */
export function makeVariant(parts: NameParts, rnd: Random, mix: NameMix = DEFAULT_MIX): { name: string; kind: string } | null {
  const first = applySome(parts, rnd, mix, undefined);
  if (!first) return null;
  if (!rnd.chance(mix.secondCorruption)) return { name: renderName(first.parts), kind: first.kind };
  const second = applySome(first.parts, rnd, mix, first.kind);
  if (!second) return { name: renderName(first.parts), kind: first.kind };
  return { name: renderName(second.parts), kind: `${first.kind}+${second.kind}` };
}

function applySome(parts: NameParts, rnd: Random, mix: NameMix, not: VariantKind | undefined): { parts: NameParts; kind: VariantKind } | null {
  const weights = VARIANT_KINDS.map((k) => (k === not ? 0 : mix.kinds[k]));
  for (let tries = 0; tries < 6; tries++) {
    const kind = VARIANT_KINDS[weightedIndex(weights, rnd)]!;
    const out = corrupt(kind, parts, rnd);
    if (out) return { parts: out, kind };
  }
  return null;
}

export function pickJurisdiction(rnd: Random): string {
  return JURISDICTIONS[
    weightedIndex(
      JURISDICTIONS.map((j) => j.weight),
      rnd,
    )
  ]!.code;
}

function capitalise(s: string): string {
  return s[0]!.toUpperCase() + s.slice(1);
}

export const NAME_CSV_HEADER = 'entity_id,name,country,variant_kind,sibling_of';

/** One CSV line (RFC 4180 quoting) without the line break. */
export function nameCsvLine(row: GeneratedNameRow): string {
  return [row.entityId, row.name, row.country, row.variantKind, row.siblingOf ?? ''].map(csvField).join(',');
}

function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replaceAll('"', '""')}"` : value;
}
