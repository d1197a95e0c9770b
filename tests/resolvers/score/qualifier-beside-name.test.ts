/**
 * The qualifier level beside the name level (resolvers/score/compare-records.ts qualifierLevelBeside): companies of
 * one group share their place qualifier, so beside names where one side only adds words an equal qualifier is not
 * observed. Invented names.
 */
import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import type { MatchRecord } from '../../../resolvers/block/index.ts';
import { buildIdfTable } from '../../../resolvers/compare/index.ts';
import { compareRecords } from '../../../resolvers/score/index.ts';

const record = (name: string, id: string): MatchRecord => ({ id, analysis: analyseName(name, { country: 'LU' }), country: 'LU' });

function levels(a: string, b: string) {
  const x = record(a, '1');
  const y = record(b, '2');
  return compareRecords(x, y, buildIdfTable([x.analysis.tokens, y.analysis.tokens])).levels;
}

describe('qualifier beside the name', () => {
  it('an equal qualifier beside an added word is not observed ("Alder (Asia)" / "Alder Securities (Asia)")', () => {
    const l = levels('Alderwyn (Asia) S.A.', 'Alderwyn Securities (Asia) S.A.');
    expect(l.name).toBe('extra_activity');
    expect(l.qualifier).toBeNull();
    const m = levels('Bank of Norvell (Europe) S.A.', 'Farmers Bank of Norvell (Europe) S.A.');
    expect(m.name).toBe('extra_words');
    expect(m.qualifier).toBeNull();
  });
  it('an equal qualifier beside an equal or near name still counts, and a different one always does', () => {
    expect(levels('Alderwyn Securities (Asia) S.A.', 'ALDERWYN SECURITIES (ASIA) SA').qualifier).toBe('same');
    expect(levels('Alderwyn Securities (Asia) S.A.', 'Alderwyn Securities (Europe) S.A.').qualifier).toBe('different');
    expect(levels('Alderwyn (Asia) S.A.', 'Alderwyn Securities (Europe) S.A.').qualifier).toBe('different');
  });
});
