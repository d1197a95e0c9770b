/**
 * The scale generator: invented organisation names with known entity ids and realistic variants, streamed
 * so that a million names never sit in memory at once (only a shuffle window of a few thousand rows).
 * The mix of variants is documented in docs/generator.md; keep the two in step.
 */
import { seededRandom, type Random } from '../../resolvers/prng.ts';
import { corrupt, renderName, VARIANT_KINDS, type NameParts, type VariantKind } from './corrupt.ts';
import {
  DESCRIPTORS,
  ENDINGS,
  INDUSTRIES,
  JURISDICTIONS,
  LEGAL_FORMS,
  LOCAL_INDUSTRIES,
  SYLLABLES,
  countryOf,
} from './name-parts.ts';

export interface GeneratedNameRow {
  /** Shared by every variant of one invented organisation (the ground truth). */
  entityId: string;
  name: string;
  /** ISO 3166-1 alpha-2, or ISO 3166-2 for US states ("US-DE"). */
  country: string;
  /** "original", one VariantKind, or two joined by "+" ("keyboard_typo+case"). */
  variantKind: string;
  /** For an original that differs from another entity only in legal form or jurisdiction: that entity's id. */
  siblingOf?: string;
}

export interface NameMix {
  /** Probability of 0, 1, 2… variants per entity (index = number of variants). Sums to 1. */
  variantsPerEntity: readonly number[];
  /** Probability of each corruption kind for a variant. Sums to 1. */
  kinds: Readonly<Record<VariantKind, number>>;
  /** Probability that a variant gets a second, different corruption on top of the first. */
  secondCorruption: number;
  /** Probability that a new entity is a sibling: same name words, other legal form or jurisdiction. */
  sibling: number;
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
  shuffleWindow: 4096,
};

/** Above this, entity cores would repeat (see coreSpace); a clear limit beats silent duplicates. */
export const MAX_NAMES = 10_000_000;

const CORE_SPACE = SYLLABLES.length * SYLLABLES.length * ENDINGS.length * INDUSTRIES.length;

/** An invented organisation: the name words, its jurisdiction and its legal form. */
export interface InventedOrganisation {
  entityId: string;
  country: string;
  parts: NameParts;
  siblingOf?: string;
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
  const coreOf = corePermutation(seed);
  const window: GeneratedNameRow[] = [];
  let emitted = 0;
  let entityIndex = 0;
  let coreIndex = 0;
  let previous: InventedOrganisation | undefined;
  while (emitted + window.length < count) {
    // Siblings of siblings could repeat the first organisation's name exactly: only originals get siblings.
    const sibling = previous && !previous.siblingOf && rnd.chance(mix.sibling) ? siblingOf(previous, entityIndex, rnd) : undefined;
    const org = sibling ?? inventOrganisation(coreOf(coreIndex++), entityIndex, rnd);
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

/** A bijection of [0, CORE_SPACE) chosen by the seed, so entity cores never repeat and look unordered. */
function corePermutation(seed: number): (i: number) => number {
  let a = 1_000_003 + 2 * (seed % 1000);
  while (gcd(a, CORE_SPACE) !== 1) a += 2;
  const b = (seed * 7919) % CORE_SPACE;
  return (i) => Number((BigInt(a) * BigInt(i) + BigInt(b)) % BigInt(CORE_SPACE));
}

function gcd(x: number, y: number): number {
  while (y !== 0) [x, y] = [y, x % y];
  return x;
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
  return { entityId: entityIdOf(index), country, parts: { base: words.join(' '), form: family.canonical, family, comma } };
}

/** Same words, another legal form in the same country or the same form family elsewhere: a different entity. */
function siblingOf(org: InventedOrganisation, index: number, rnd: Random): InventedOrganisation {
  const families = LEGAL_FORMS[countryOf(org.country)]!;
  const others = families.filter((f) => f !== org.parts.family);
  if (others.length > 0 && rnd.chance(0.5)) {
    const family = rnd.pick(others);
    return { entityId: entityIdOf(index), country: org.country, siblingOf: org.entityId, parts: { ...org.parts, form: family.canonical, family } };
  }
  const country = rnd.pick(JURISDICTIONS.filter((j) => countryOf(j.code) !== countryOf(org.country))).code;
  const family = LEGAL_FORMS[countryOf(country)]![0]!;
  return { entityId: entityIdOf(index), country, siblingOf: org.entityId, parts: { ...org.parts, form: family.canonical, family } };
}

function originalRow(org: InventedOrganisation): GeneratedNameRow {
  return { entityId: org.entityId, name: renderName(org.parts), country: org.country, variantKind: 'original', siblingOf: org.siblingOf };
}

function variantRows(org: InventedOrganisation, rnd: Random, mix: NameMix): GeneratedNameRow[] {
  const n = pickIndex(mix.variantsPerEntity, rnd);
  const rows: GeneratedNameRow[] = [];
  const seen = new Set<string>([renderName(org.parts)]);
  for (let v = 0; v < n; v++) {
    const variant = makeVariant(org.parts, rnd, mix);
    if (!variant || seen.has(variant.name)) continue;
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
    const kind = VARIANT_KINDS[pickIndex(weights, rnd)]!;
    const out = corrupt(kind, parts, rnd);
    if (out) return { parts: out, kind };
  }
  return null;
}

function pickIndex(weights: readonly number[], rnd: Random): number {
  const total = weights.reduce((a, b) => a + b, 0);
  let x = rnd.next() * total;
  for (let i = 0; i < weights.length; i++) {
    x -= weights[i]!;
    if (x < 0) return i;
  }
  return weights.length - 1;
}

export function pickJurisdiction(rnd: Random): string {
  return JURISDICTIONS[pickIndex(JURISDICTIONS.map((j) => j.weight), rnd)]!.code;
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
