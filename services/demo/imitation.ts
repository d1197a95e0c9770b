/**
 * Entities of the scale generator that imitate the entity before them (siblings and hard negatives): the same words
 * with another legal form or jurisdiction, another activity word, a series number, a place, a branch.
 */
import type { Random } from '../../resolvers/prng.ts';
import { branchOf, HARD_NEGATIVE_KINDS, nextInSeries, placeQualified, startSeries, type HardNegativeKind, type HardNegativeName } from './hard-negatives.ts';
import { INDUSTRIES, JURISDICTIONS, LEGAL_FORMS, LOCAL_INDUSTRIES, countryOf } from './name-parts.ts';
import { COINED_WORDS } from './core-permutation.ts';
import { entityIdOf, type InventedOrganisation } from './invent-organisation.ts';
import type { NameMix } from './name-mix.ts';

/** Activity numbers whose word is one word ("Logistics", not "Rail Components"): activity siblings use these. */
const ONE_WORD_ACTIVITIES = INDUSTRIES.flatMap((w, i) => (w.includes(' ') ? [] : [i]));

/**
 * The next entity as an imitation of the previous one, or undefined for a new organisation. A numbered
 * series member may be followed by the next number; otherwise only an entity that imitates no other gets
 * an imitation (a sibling of a sibling could repeat the first organisation's name exactly). One draw picks
 * the kind; a kind that does not apply to the previous entity gives a new organisation.
 */
export function imitation(
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
