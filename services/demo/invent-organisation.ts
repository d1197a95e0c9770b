/**
 * A new invented organisation of the scale generator, built from its core number: name words, jurisdiction and legal
 * form.
 */
import { weightedIndex, type Random } from '../../resolvers/prng.ts';
import type { NameParts } from './render-name.ts';
import type { SeriesPosition } from './hard-negatives.ts';
import { DESCRIPTORS, ENDINGS, INDUSTRIES, JURISDICTIONS, LEGAL_FORMS, LOCAL_INDUSTRIES, SYLLABLES, countryOf } from './name-parts.ts';
import type { SiblingKind } from './generated-name-row.ts';

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
