import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import { blockingKeys, candidatePairs, nameScript, type MatchRecord } from '../../../resolvers/block/index.ts';
import { buildIdfTable } from '../../../resolvers/compare/index.ts';
import { seededRandom } from '../../../resolvers/prng.ts';

// Invented names (BRIEF: no real companies in tests).
const record = (id: string, name: string, extra: Partial<MatchRecord> = {}): MatchRecord => ({ id, analysis: analyseName(name), ...extra });

describe('blockingKeys', () => {
  it('gives token, stem, stem-pair, acronym and prefix keys for a multi-word name', () => {
    const keys = blockingKeys(record('1', 'Northfield Rail Components Ltd'));
    expect(keys).toEqual(expect.arrayContaining(['t:northfield', 't:rail', 't:components', 's:north', 's:compo', 'a:nrc', 'p:northf', 'q:compo|north']));
    // The legal form is not part of the core, so it gives no key (it would pair every "Ltd").
    expect(keys).not.toContain('t:ltd');
  });

  it('a short one-token name keys as an acronym that meets the initials of the long form', () => {
    const short = blockingKeys(record('1', 'NRC'));
    const long = blockingKeys(record('2', 'Northfield Rail Components'));
    expect(short).toContain('a:nrc');
    expect(long.filter((k) => short.includes(k))).toEqual(['a:nrc']);
  });

  it('identifier keys: strong schemes as i:, shared ones as w:', () => {
    const keys = blockingKeys(
      record('1', 'Brackwater Tooling', {
        identifiers: [
          { scheme: 'lei', value: '506700GE1G29325QX363' }, // GLEIF's own LEI (worked-examples.json → lei_iso17442)
          { scheme: 'phone', value: '+441632960000' }, // Ofcom drama range number (invented use)
        ],
      }),
    );
    expect(keys).toContain('i:lei:506700GE1G29325QX363');
    expect(keys).toContain('w:phone:+441632960000');
  });

  it('character-bigram keys for names in scripts written without spaces', () => {
    const keys = blockingKeys(record('1', '東邦精機工業'));
    expect(keys).toEqual(expect.arrayContaining(['b:東邦', 'b:邦精', 'b:工業']));
  });

  it('keys are the same whatever the IDF table (stable for the register), only their order changes', () => {
    const r = record('1', 'Kittering Bay Outfitters');
    const idf = buildIdfTable([['bay'], ['bay'], ['outfitters']]);
    expect([...blockingKeys(r, idf)].sort()).toEqual([...blockingKeys(r)].sort());
    expect(blockingKeys(r, idf)[0]).toBe('t:kittering'); // the rarest token first
  });
});

describe('nameScript', () => {
  it('tells Latin, non-Latin and mixed names apart; digits and punctuation do not count', () => {
    expect(nameScript('Fonderie Émeraude de Vésigny')).toBe('latin');
    expect(nameScript('東邦精機')).toBe('non_latin');
    expect(nameScript('Βορέας AE')).toBe('mixed');
    expect(nameScript('123 - 456')).toBe('none');
  });
});

describe('candidatePairs', () => {
  it('pairs records that share a key and never pairs a record with itself or twice', () => {
    const records = [
      record('0', 'Kittering Bay Outfitters, L.L.C.'),
      record('1', 'KITTERING BAY OUTFITTERS LLC'),
      record('2', 'Ardmore Street Bank plc'),
      record('3', 'Ardmore Street Bank GmbH'),
      record('4', 'Quillon Vale Dairy'),
    ];
    const pairs = candidatePairs(records, { globalWindow: 0 });
    const list = Array.from({ length: pairs.count }, (_, k) => `${pairs.left[k]}-${pairs.right[k]}`);
    expect(list).toContain('0-1');
    expect(list).toContain('2-3');
    expect(list).not.toContain('0-4');
    expect(new Set(list).size).toBe(list.length);
    for (let k = 0; k < pairs.count; k++) expect(pairs.left[k]!).toBeLessThan(pairs.right[k]!);
  });

  it('thins an oversized block to a sorted neighbourhood instead of pairing all of it', () => {
    // 300 invented names sharing the word "holdings" and nothing else.
    const random = seededRandom(5);
    const syllables = ['ka', 'lo', 'mir', 'ten', 'vas', 'qu', 'dor', 'pel', 'zan', 'rho'];
    const records = Array.from({ length: 300 }, (_, i) => {
      const word = Array.from({ length: 4 }, () => random.pick(syllables)).join('') + i;
      return record(String(i), `${word} Holdings`);
    });
    const pairs = candidatePairs(records, { maxBlockSize: 100, window: 4, globalWindow: 0 });
    expect(pairs.oversizedBlocks).toBeGreaterThanOrEqual(1);
    // Exhaustive pairing would give 300·299/2 = 44,850 pairs; the window gives at most 300·4 from that block.
    expect(pairs.count).toBeLessThan(44_850 / 4);
  });

  it('inside an oversized block, pairs names of one country with each other', () => {
    // 300 invented names sharing only "holdings"; 20 of them in IS, the rest in GB or DE (150 / 130).
    const random = seededRandom(6);
    const syllables = ['ka', 'lo', 'mir', 'ten', 'vas', 'qu', 'dor', 'pel', 'zan', 'rho'];
    const records = Array.from({ length: 300 }, (_, i) => {
      const word = Array.from({ length: 4 }, () => random.pick(syllables)).join('') + i;
      return record(String(i), `${word} Holdings`, { country: i % 15 === 0 ? 'IS' : i % 2 === 0 ? 'GB' : 'DE' });
    });
    const icelandic = records.filter((r) => r.country === 'IS').map((r) => Number(r.id));
    const pairSet = (countryBlockSize: number, countryWindow = 4): Set<string> => {
      const pairs = candidatePairs(records, { maxBlockSize: 100, window: 4, globalWindow: 0, countryBlockSize, countryWindow });
      return new Set(Array.from({ length: pairs.count }, (_, k) => `${pairs.left[k]}-${pairs.right[k]}`));
    };
    const islandPairs = (set: Set<string>): number =>
      icelandic.flatMap((i) => icelandic.filter((j) => j > i).map((j) => `${i}-${j}`)).filter((p) => set.has(p)).length;
    expect(islandPairs(pairSet(100))).toBe((20 * 19) / 2);
    expect(islandPairs(pairSet(0))).toBeLessThan((20 * 19) / 2);
    // The GB and DE groups (140 each) exceed 100: a sorted neighbourhood inside them, not all their pairs. What
    // the country groups add is at most the 190 IS pairs plus 2 · 4 neighbours for each of the 280 others.
    expect(pairSet(100).size - pairSet(0).size).toBeLessThanOrEqual(190 + 280 * 8);
    expect(pairSet(100).size - pairSet(0).size).toBeGreaterThan(190);
    // Without a window inside the large groups, the groups add exactly the IS pairs the window had not found.
    const withoutWindow = pairSet(100, 0);
    expect(islandPairs(withoutWindow)).toBe(190);
    expect(withoutWindow.size - pairSet(0).size).toBe(190 - islandPairs(pairSet(0)));
  });

  it('finds the same pairs whatever the input order (property)', () => {
    const names = [
      'Kittering Bay Outfitters',
      'Kittering Bay Outfitter',
      'Bay Outfitters Kittering',
      'Quillon Vale Dairy',
      'Quillon Dairy',
      'QVD',
      'Quillon Vale Dairies',
    ];
    fc.assert(
      fc.property(
        fc.shuffledSubarray(
          names.map((n, i) => record(`r${i}`, n, { country: i % 2 === 0 ? 'GB' : 'FR' })),
          { minLength: names.length },
        ),
        (shuffled) => {
          const pairs = candidatePairs(shuffled, { maxBlockSize: 2, window: 1, globalWindow: 1 });
          const set = new Set(Array.from({ length: pairs.count }, (_, k) => [shuffled[pairs.left[k]!]!.id, shuffled[pairs.right[k]!]!.id].sort().join('-')));
          const reference = candidatePairs(
            names.map((n, i) => record(`r${i}`, n, { country: i % 2 === 0 ? 'GB' : 'FR' })),
            { maxBlockSize: 2, window: 1, globalWindow: 1 },
          );
          const refSet = new Set(Array.from({ length: reference.count }, (_, k) => [`r${reference.left[k]}`, `r${reference.right[k]}`].sort().join('-')));
          expect(set).toEqual(refSet);
        },
      ),
      { numRuns: 50 },
    );
  });
});
