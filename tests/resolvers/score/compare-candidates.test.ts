/**
 * The batch path (compareCandidates: weights computed once, levels written straight into an array, the cores'
 * Jaro–Winkler skipped when its length bound cannot change the name level) must give exactly the levels and
 * overrides of compareRecords, pair by pair.
 */
import { FEATURE_LEVELS } from '../../../resolvers/score/features.ts';
import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import { candidatePairs, type MatchRecord } from '../../../resolvers/block/index.ts';
import { buildIdfTable } from '../../../resolvers/compare/index.ts';
import { seededRandom } from '../../../resolvers/prng.ts';
import { compareCandidates, compareRecords, FEATURE_NAMES, levelIndices } from '../../../resolvers/score/index.ts';
import { nameLevelOf } from '../../../resolvers/score/compare-records.ts';
import { nameLevel } from '../../../resolvers/score/features.ts';
import { jaroWinkler } from '../../../resolvers/compare/index.ts';

// Invented words and names only; typos and reorderings so that every name band occurs.
const words = [
  'kittering',
  'bay',
  'outfitters',
  'ardmore',
  'street',
  'bank',
  'northfield',
  'rail',
  'components',
  'holdings',
  'group',
  'brackenridge',
  'fabrication',
  'and',
  'of',
  'x',
];
const forms = ['Ltd', 'plc', 'GmbH', 'Inc.', 'LLC', 'SA', ''];
const countries = ['GB', 'DE', 'US', 'FR', undefined];

// Invented LEIs; check digits by ISO 7064 MOD 97-10 (the procedure of worked-examples.json → lei_iso17442).
const LEI_A = 'CPREGTEST00000000187';
const LEI_B = 'CPREGTEST00000000284';

function typo(word: string, random: ReturnType<typeof seededRandom>): string {
  if (word.length < 3 || random.int(3) > 0) return word;
  const at = random.int(word.length - 1);
  return word.slice(0, at) + word[at + 1] + word[at] + word.slice(at + 2);
}

function records(count: number): MatchRecord[] {
  const random = seededRandom(11);
  const out: MatchRecord[] = [];
  for (let i = 0; i < count; i++) {
    const length = 1 + random.int(4);
    const name = Array.from({ length }, () => typo(words[random.int(words.length)]!, random)).join(' ');
    const country = countries[random.int(countries.length)];
    const full = `${name} ${forms[random.int(forms.length)]}`.trim();
    out.push({
      id: `r${i}`,
      analysis: analyseName(full, country ? { country } : undefined),
      ...(country ? { country } : {}),
      ...(i % 7 === 0 ? { identifiers: [{ scheme: 'lei' as const, value: i % 14 === 0 ? LEI_A : LEI_B }] } : {}),
    });
  }
  return out;
}

describe('compareCandidates', () => {
  it('gives the levels and overrides of compareRecords for every candidate pair', () => {
    const batch = records(1500);
    const idf = buildIdfTable(batch.map((r) => r.analysis.tokens));
    const pairs = candidatePairs(batch, { idf });
    const compared = compareCandidates(batch, pairs, idf);
    const width = FEATURE_NAMES.length;
    const seenNameLevels = new Set<number>();
    expect(pairs.count).toBeGreaterThan(10_000);
    for (let k = 0; k < pairs.count; k++) {
      const c = compareRecords(batch[pairs.left[k]!]!, batch[pairs.right[k]!]!, idf);
      const expected = levelIndices(c.levels).map((v) => (v === null ? -1 : v));
      expect(Array.from(compared.levels.subarray(k * width, (k + 1) * width))).toEqual(expected);
      const override = c.identifiers?.cannotLink ? 'cannot_link' : c.identifiers?.decisive ? 'decisive_identifier' : undefined;
      expect(compared.overrides.get(k)).toBe(override);
      seenNameLevels.add(expected[0]!);
    }
    expect(compared.overrides.size).toBeGreaterThan(0);
    // Every band by degree occurs, so the skip of the cores' JW was exercised on each side of each cut.
    for (const band of ['very_high', 'high', 'medium', 'low', 'none']) expect(seenNameLevels).toContain(FEATURE_LEVELS.name.indexOf(band as never));
  });

  it("nameLevelOf equals nameLevel with the cores' JW on random cores and soft scores", () => {
    const random = seededRandom(12);
    for (let n = 0; n < 20_000; n++) {
      const a = Array.from({ length: 1 + random.int(40) }, () => 'abcdef '[random.int(7)]).join('');
      const b =
        random.int(4) === 0 ? a.slice(0, random.int(a.length + 1)) : Array.from({ length: 1 + random.int(40) }, () => 'abcdef '[random.int(7)]).join('');
      const soft = random.int(2) === 0 ? random.next() : [0.3, 0.55, 0.75, 0.9][random.int(4)]!;
      const expected = a.length === 0 || b.length === 0 ? null : nameLevel(a === b, soft, jaroWinkler(a, b));
      expect(nameLevelOf(a, b, soft)).toBe(expected);
    }
  });
});
