import { describe, expect, it } from 'vitest';
import { transliterate } from 'transliteration';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import { blockingKeys, type MatchRecord } from '../../../resolvers/block/index.ts';
import { buildIdfTable } from '../../../resolvers/compare/index.ts';
import { compareRecords, FEATURE_LEVELS } from '../../../resolvers/score/index.ts';
import { NAME_STRENGTH } from '../../../resolvers/score/compare-records.ts';

// Invented names only.
const rec = (id: string, name: string, country?: string): MatchRecord => ({
  id,
  analysis: analyseName(name, country ? { country } : {}),
  ...(country ? { country } : {}),
});

describe('other spellings take part in matching (aliases, transliteration)', () => {
  const idf = buildIdfTable([
    ['tollaby', 'logistics'],
    ['tollaby', 'cold', 'storage'],
    ['kelda', 'yarn'],
    ['kelda', 'studio'],
    ['norvesk', 'kredit'],
  ]);

  it('a former name declared in the name ("formerly …") meets a later mention of it', () => {
    const a = rec('a', 'Tollaby Logistics Limited (formerly Tollaby Cold Storage Ltd)', 'GB');
    const b = rec('b', 'Tollaby Cold Storage Ltd', 'GB');
    expect(a.analysis.alternatives).toEqual([{ kind: 'alias', tokens: ['tollaby', 'cold', 'storage'], core: 'tollaby cold storage' }]);
    expect(compareRecords(a, b, idf).levels.name).toBe('exact');
    expect(blockingKeys(a)).toContain('t:cold');
  });

  it('a trading name ("t/a") meets a mention of the trading name', () => {
    expect(compareRecords(rec('a', 'Kelda Yarn Ltd t/a Kelda Studio', 'GB'), rec('b', 'Kelda Studio', 'GB'), idf).levels.name).toBe('exact');
  });

  it('a register short form ("in forma abbreviata", "en abrégé") is an alias', () => {
    expect(analyseName('Orvelta Credito S.p.A. in forma abbreviata Orcred S.p.A.', { country: 'IT' }).alternatives[0]?.core).toBe('orcred');
    expect(analyseName('Banque Velmont (Europe) S.A., en abrégé BVE S.A.', { country: 'LU' }).alternatives[0]?.core).toBe('bve');
  });

  it('a Cyrillic name is also compared in Latin letters', () => {
    // Reference: the general-purpose `transliteration` package gives "Norvesk Kredit" for "Норвеск Кредит".
    expect(transliterate('Норвеск Кредит')).toBe('Norvesk Kredit');
    const a = rec('a', 'Норвеск Кредит', 'BG');
    expect(a.analysis.alternatives.map((x) => x.kind)).toEqual(['latin']);
    expect(compareRecords(a, rec('b', 'Norvesk Kredit', 'BG'), idf).levels.name).toBe('exact');
  });

  it('a successor is a related party, never another spelling', () => {
    expect(analyseName('Kelda Yarn Ltd, successor in interest to Kelda Wool Ltd').alternatives).toEqual([]);
  });

  it('every name level has one place in the strength order used to pick among spellings', () => {
    expect([...NAME_STRENGTH].sort()).toEqual([...FEATURE_LEVELS.name].sort());
  });
});
