// The scale generator's hard negatives (docs/generator.md, "Hard negatives"): new entities whose original
// names imitate another entity's and differ in one intended way only.
import { rorNames } from './support.ts';
import { describe, expect, it } from 'vitest';
import {
  BRANCH_CITIES,
  carriesMarker,
  COUNTRY_QUALIFIERS,
  HARD_NEGATIVE_KINDS,
  LOCAL_BRANCH_PHRASES,
  markerKey,
  REGION_QUALIFIERS,
  SERIES_MARKERS,
} from '../../../services/demo/hard-negatives.ts';
import { generateNames } from '../../../services/demo/generate-names.ts';
import { COINED_WORDS, corePermutation } from '../../../services/demo/core-permutation.ts';
import { DEFAULT_MIX } from '../../../services/demo/name-mix.ts';
import { SIBLING_KINDS, type GeneratedNameRow, type SiblingKind } from '../../../services/demo/generated-name-row.ts';
import { siblingActivity } from '../../../services/demo/imitation.ts';
import { countryOf, DESCRIPTORS, INDUSTRIES, LEGAL_FORMS, LOCAL_INDUSTRIES } from '../../../services/demo/name-parts.ts';

const SIZE = 5_000;
const SEED = 7;
const rows = [...generateNames(SIZE, SEED)];
const originals = new Map(rows.filter((r) => r.variantKind === 'original').map((r) => [r.entityId, r]));
const siblings = [...originals.values()].filter((r) => r.siblingOf !== undefined);
const ofKind = (kind: SiblingKind): GeneratedNameRow[] => siblings.filter((r) => r.siblingKind === kind);
const imitated = (r: GeneratedNameRow): GeneratedNameRow => originals.get(r.siblingOf!)!;
/** Each sibling of a kind with the entity it imitates; the kind occurs more than 10 times. */
const pairsOfKind = (kind: SiblingKind): { s: GeneratedNameRow; of: GeneratedNameRow }[] => {
  const found = ofKind(kind);
  expect(found.length).toBeGreaterThan(10);
  return found.map((s) => ({ s, of: imitated(s) }));
};

/** Legal forms the generator writes, longest first, so that "Pty Ltd" is found before "Ltd". */
const FORMS = [...new Set(Object.values(LEGAL_FORMS).flatMap((families) => families.map((f) => f.canonical)))].sort((a, b) => b.length - a.length);

/** An original split before its legal form: "Belpelmore Logistics, Inc." → base "Belpelmore Logistics", tail ", Inc.". */
function splitForm(name: string): { base: string; tail: string } {
  for (const form of FORMS) {
    for (const sep of [', ', ' ']) {
      if (name.endsWith(sep + form)) return { base: name.slice(0, -(sep + form).length), tail: sep + form };
    }
  }
  throw new Error(`no legal form at the end of "${name}"`);
}

const ACTIVITY_WORDS = new Set<string>([...INDUSTRIES.filter((w) => !w.includes(' ')), ...Object.values(LOCAL_INDUSTRIES).flat()]);

function seriesNumber(marker: string): { style: string; n: number } | undefined {
  for (const [style, markers] of Object.entries(SERIES_MARKERS)) {
    const i = (markers as readonly string[]).indexOf(marker);
    if (i >= 0) return { style, n: i + 1 };
  }
  return undefined;
}

function branchPhrases(jurisdiction: string): string[] {
  return BRANCH_CITIES[jurisdiction]!.flatMap(([local, english]) => [
    `, ${english} Branch`,
    ...(LOCAL_BRANCH_PHRASES[countryOf(jurisdiction)] ?? []).map((p) => p.replace('{city}', local)),
  ]);
}

describe('generateNames: hard negatives', () => {
  it('plants every kind, each a modest share of the originals, as documented in DEFAULT_MIX', () => {
    expect(SIBLING_KINDS).toEqual(['legal_form', 'jurisdiction', 'activity', 'series', 'place', 'branch']);
    for (const kind of HARD_NEGATIVE_KINDS) {
      expect(DEFAULT_MIX.hardNegatives[kind], kind).toBeGreaterThanOrEqual(0.02);
      expect(DEFAULT_MIX.hardNegatives[kind], kind).toBeLessThanOrEqual(0.04);
    }
    for (const kind of SIBLING_KINDS) {
      const share = ofKind(kind).length / originals.size;
      // Each ≈ 2–3 % of originals (the docs give the realised figures of a 1,000,000-name run).
      expect(share, kind).toBeGreaterThan(kind === 'legal_form' || kind === 'jurisdiction' ? 0.005 : 0.01);
      expect(share, kind).toBeLessThan(0.05);
    }
    for (const s of siblings) expect(SIBLING_KINDS, s.name).toContain(s.siblingKind);
    // Only sibling originals carry a kind; variants never do.
    for (const r of rows) if (!r.siblingOf || r.variantKind !== 'original') expect(r.siblingKind).toBeUndefined();
  });

  it('points sibling_of at an entity whose original is in the output, another entity with another name', () => {
    for (const s of siblings) {
      const of = originals.get(s.siblingOf!);
      expect(of, `${s.entityId} → ${s.siblingOf}`).toBeDefined();
      expect(s.entityId).not.toBe(of!.entityId);
      expect(`${s.name}|${s.country}`).not.toBe(`${of!.name}|${of!.country}`);
      // The same coined word first: the imitation is of this very organisation.
      expect(s.name.split(' ')[0]).toBe(of!.name.split(' ')[0]);
    }
    const keys = [...originals.values()].map((r) => `${r.name}|${r.country}`);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('activity: the same coined word, descriptor, legal form and jurisdiction, one activity word other', () => {
    const found = pairsOfKind('activity');
    for (const { s, of } of found) {
      expect(s.country).toBe(of.country);
      const a = s.name.split(' ');
      const b = of.name.split(' ');
      expect(a.length, s.name).toBe(b.length);
      const differing = a.flatMap((w, i) => (w === b[i] ? [] : [i]));
      expect(differing, `${of.name} / ${s.name}`).toHaveLength(1);
      const at = differing[0]!;
      expect(at).toBeGreaterThan(0);
      expect(ACTIVITY_WORDS, s.name).toContain(a[at]!.replace(/,$/, ''));
      expect(ACTIVITY_WORDS, of.name).toContain(b[at]!.replace(/,$/, ''));
      expect(splitForm(s.name).tail).toBe(splitForm(of.name).tail);
    }
  });

  it('series: the same name with a series number before the legal form, or the next number of a series', () => {
    const found = pairsOfKind('series');
    let numberedPairs = 0;
    const styles = new Set<string>();
    for (const { s, of } of found) {
      expect(s.country).toBe(of.country);
      const mine = splitForm(s.name);
      const theirs = splitForm(of.name);
      expect(mine.tail).toBe(theirs.tail);
      const marker = mine.base.slice(mine.base.lastIndexOf(' ') + 1);
      const root = mine.base.slice(0, mine.base.lastIndexOf(' '));
      const number = seriesNumber(marker);
      expect(number, s.name).toBeDefined();
      styles.add(number!.style);
      if (of.siblingKind === 'series') {
        // "Belpelmore Capital II Ltd" → "Belpelmore Capital III Ltd": same style, next number.
        numberedPairs++;
        const previous = theirs.base.slice(theirs.base.lastIndexOf(' ') + 1);
        expect(theirs.base.slice(0, theirs.base.lastIndexOf(' '))).toBe(root);
        expect(seriesNumber(previous)).toEqual({ style: number!.style, n: number!.n - 1 });
      } else {
        // "Belpelmore Capital Ltd" → "Belpelmore Capital II Ltd".
        expect(root).toBe(theirs.base);
      }
    }
    expect(numberedPairs).toBeGreaterThan(0);
    expect([...styles].sort()).toEqual(['digit', 'roman', 'word']);
  });

  it('place: the parent name with a country or region qualifier before the same legal form, same jurisdiction', () => {
    const found = pairsOfKind('place');
    for (const { s, of } of found) {
      expect(s.country).toBe(of.country);
      const mine = splitForm(s.name);
      const theirs = splitForm(of.name);
      expect(mine.tail).toBe(theirs.tail);
      expect(mine.base.startsWith(`${theirs.base} `), `${of.name} / ${s.name}`).toBe(true);
      const qualifier = mine.base.slice(theirs.base.length + 1).replace(/^\((.*)\)$/, '$1');
      const allowed = [...COUNTRY_QUALIFIERS[countryOf(s.country)]!, ...REGION_QUALIFIERS];
      expect(allowed, s.name).toContain(qualifier);
    }
    expect(found.some(({ s }) => s.name.includes('('))).toBe(true);
  });

  it('branch: the head office name followed by a branch of a city in the branch’s jurisdiction', () => {
    const found = pairsOfKind('branch');
    for (const { s, of } of found) {
      expect(s.name.startsWith(of.name), `${of.name} / ${s.name}`).toBe(true);
      expect(branchPhrases(s.country), s.name).toContain(s.name.slice(of.name.length));
    }
    // Both a branch at home and a branch abroad.
    expect(found.some(({ s, of }) => s.country === of.country)).toBe(true);
    expect(found.some(({ s, of }) => s.country !== of.country)).toBe(true);
  });

  it('keeps in every variant of a hard negative what sets it apart, so no variant is a name of the entity it imitates', () => {
    const namesOf = new Map<string, Set<string>>();
    for (const r of rows) {
      if (!namesOf.has(r.entityId)) namesOf.set(r.entityId, new Set());
      namesOf.get(r.entityId)!.add(markerKey(r.name));
    }
    let checked = 0;
    for (const r of rows) {
      const o = originals.get(r.entityId)!;
      if (r.variantKind === 'original' || !o.siblingKind || !(HARD_NEGATIVE_KINDS as readonly string[]).includes(o.siblingKind)) continue;
      checked++;
      expect(r.country).toBe(o.country);
      expect(namesOf.get(o.siblingOf!)!.has(markerKey(r.name)), `${r.name} (${r.variantKind})`).toBe(false);
    }
    expect(checked).toBeGreaterThan(100);
  });

  it('names no organisation that appears in the ROR open dataset (the names are invented)', () => {
    const ror = rorNames();
    expect(ror.size).toBeGreaterThan(10_000);
    for (const s of siblings) {
      expect(ror.has(s.name.toLowerCase()), s.name).toBe(false);
      // A branch's words before the legal form are its head office's.
      const base = splitForm(s.siblingKind === 'branch' ? imitated(s).name : s.name).base;
      expect(ror.has(base.toLowerCase()), s.name).toBe(false);
    }
  });

  it('is deterministic: the same seed gives the same rows, another seed other rows', () => {
    expect([...generateNames(SIZE, SEED)]).toEqual(rows);
    const other = [...generateNames(SIZE, SEED + 1)];
    expect(other.filter((r) => r.siblingKind).map((r) => r.name)).not.toEqual(siblings.map((r) => r.name));
  });

  it('never repeats a name when activity siblings are frequent', () => {
    const mix = { ...DEFAULT_MIX, sibling: 0, hardNegatives: { activity: 0.6, series: 0, place: 0, branch: 0 } };
    const many = [...generateNames(20_000, 3, mix)].filter((r) => r.variantKind === 'original');
    expect(many.filter((r) => r.siblingKind === 'activity').length).toBeGreaterThan(2_000);
    // The coined word and the activity (the words after the descriptor): never two entities with the same pair.
    const pairs = many.map((r) => {
      const [coined, ...rest] = splitForm(r.name).base.split(' ');
      if ((DESCRIPTORS as readonly string[]).includes(rest[0]!)) rest.shift();
      return `${coined} ${rest.join(' ')}`;
    });
    expect(new Set(pairs).size).toBe(pairs.length);
  });
});

describe('activity siblings: a core no entity of the run can have', () => {
  it('corePermutation: indexOf undoes coreOf', () => {
    for (const seed of [0, 1, 999, 2 ** 32 - 1]) {
      const { coreOf, indexOf } = corePermutation(seed);
      for (const i of [0, 1, 2, 12_345, 4_000_000, COINED_WORDS * INDUSTRIES.length - 1]) expect(indexOf(coreOf(i))).toBe(i);
    }
  });

  it('siblingActivity: an undrawn one-word activity, a different one for each drawn activity of a coined word', () => {
    const oneWord = INDUSTRIES.flatMap((w, i) => (w.includes(' ') ? [] : [i]));
    const coined = 4_321;
    const activityOf = (core: number): number => Math.floor(core / COINED_WORDS);
    for (const drawnShare of [0.05, 0.3, 0.5, 0.7]) {
      // Activities drawn for this coined word: the first share of the one-word ones and every multi-word one.
      const drawnSet = new Set(INDUSTRIES.map((_, i) => i).filter((i) => !oneWord.includes(i) || oneWord.indexOf(i) < drawnShare * oneWord.length));
      const drawn = (core: number): boolean => drawnSet.has(activityOf(core));
      const given = new Map<number, number>();
      for (const i of drawnSet) {
        const other = siblingActivity(coined + COINED_WORDS * i, drawn);
        if (!oneWord.includes(i)) {
          expect(other, INDUSTRIES[i]).toBeUndefined();
          continue;
        }
        if (other === undefined) continue;
        expect(drawnSet.has(other), `${INDUSTRIES[i]} → ${INDUSTRIES[other]}`).toBe(false);
        expect(INDUSTRIES[other]!.includes(' ')).toBe(false);
        expect(given.has(other), `${INDUSTRIES[i]} and ${INDUSTRIES[given.get(other)!]} → ${INDUSTRIES[other]}`).toBe(false);
        given.set(other, i);
      }
      // As many siblings as there are undrawn activities to give.
      const drawnOneWord = oneWord.filter((i) => drawnSet.has(i)).length;
      expect(given.size).toBe(Math.min(drawnOneWord, oneWord.length - drawnOneWord));
    }
    expect(siblingActivity(coined, () => true)).toBeUndefined();
  });
});

describe('carriesMarker', () => {
  it('finds the marker as whole words, ignoring case, punctuation and accents', () => {
    expect(carriesMarker('ALDER LOGISTICS AG LONDON BRANCH', ', London Branch')).toBe(true);
    expect(carriesMarker('Belpelmore Logistics (Espana) S.L.', 'España')).toBe(true);
    expect(carriesMarker('Belpelmore Capital IIi Ltd', 'II')).toBe(false);
    expect(carriesMarker('Belpelmore Capital Ltd', 'II')).toBe(false);
  });
});
