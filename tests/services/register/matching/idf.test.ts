/**
 * Token rarity in the register is counted over the names `cpreg evaluate` counts (register + batch), so that a
 * word is common in the register exactly when it is common in an evaluation of the same names; a job's plan
 * freezes the counts its partitions use. Smoothed IDF: ln((1 + N) / (1 + df)) + 1, scikit-learn's smooth_idf form
 * (from memory); the reference here is resolvers/compare buildIdfTable, the table `cpreg evaluate` builds.
 * Names are invented.
 */
import { describe, expect, it } from 'vitest';
import { buildIdfTable } from '../../../../resolvers/compare/index.ts';
import { analyseName } from '../../../../resolvers/analyse/index.ts';
import { isInformativeCore } from '../../../../resolvers/score/index.ts';
import { basisOf, DF_CAP, freezeRarity, idfFromCounts } from '../../../../services/register/matching/idf.ts';

const NAMES = [
  'Harrowgate Bank eG',
  'Tellmoor Bank eG',
  'Quenby Bank eG',
  'Ostwick Bank eG',
  'Lanford Bank eG',
  'Harrowgate Timber Ltd',
  'Brisco Mills Ltd',
  'Vantry Pumps Ltd',
].map((n) => analyseName(n).tokens);

function tokensOf(lists: readonly (readonly string[])[]): string[] {
  return [...new Set(lists.flat())];
}

function counts(lists: readonly (readonly string[])[]): Map<string, number> {
  return basisOf(lists).frequencies as Map<string, number>;
}

describe('register token rarity (services/register/matching/idf.ts)', () => {
  it('an empty register plus a batch weighs every token as evaluate does over the same names', () => {
    const reference = buildIdfTable(NAMES);
    const table = idfFromCounts(new Map(tokensOf(NAMES).map((t) => [t, 0])), 0, basisOf(NAMES));
    expect(table.documentCount).toBe(NAMES.length);
    for (const token of tokensOf(NAMES)) expect(table.idf(token)).toBeCloseTo(reference.idf(token), 12);
  });

  it('names split between the register and the batch weigh as the whole file does', () => {
    const reference = buildIdfTable(NAMES);
    const stored = NAMES.slice(0, 5);
    const table = idfFromCounts(new Map(tokensOf(NAMES).map((t) => [t, counts(stored).get(t) ?? 0])), stored.length, basisOf(NAMES.slice(5)));
    for (const token of tokensOf(NAMES)) expect(table.idf(token)).toBeCloseTo(reference.idf(token), 12);
  });

  it('a word in five of eight names is common, so an equal core of it alone is not informative', () => {
    const table = idfFromCounts(new Map(), 0, basisOf(NAMES));
    // "bank" is in 5 of 8 names: COMMON_MIN_NAMES is 5 (resolvers/score/features.ts, common practice for the floor).
    expect(isInformativeCore(['bank'], table)).toBe(false);
    expect(isInformativeCore(['harrowgate'], table)).toBe(true);
  });

  it('one company written many ways counts once per spelling, so its own words do not become common', () => {
    const spellings = ['Quellbrook Textiles Ltd', 'QUELLBROOK TEXTILES LTD', 'Quellbrook Textiles Limited', 'Quellbrook Textiles Ltd.'];
    const batch = Array.from({ length: 24 }, (_, i) => analyseName(spellings[i % spellings.length]!).tokens);
    const basis = basisOf(batch);
    // The legal form is not a token (resolvers/analyse), so the four spellings share one token list.
    expect(basis.documents).toBe(1);
    expect(isInformativeCore(['quellbrook', 'textiles'], idfFromCounts(new Map(), 0, basis))).toBe(true);
  });

  it('a token counted to the cap stays common in a register of more than a million names', () => {
    const table = idfFromCounts(
      new Map([
        ['holdings', DF_CAP],
        ['zanvory', 3],
      ]),
      5_000_000,
    );
    // Share 0.001 of 5,000,000 = 5,000 names (COMMON_TOKEN_SHARE): the capped count is raised to it.
    expect(isInformativeCore(['holdings'], table)).toBe(false);
    expect(isInformativeCore(['zanvory'], table)).toBe(true);
  });

  it('a partition weighs as its whole job whatever the other partitions wrote before it', () => {
    const job = NAMES;
    const reference = buildIdfTable(job);
    const frozen = freezeRarity(new Map(), 0, basisOf(job), new Set(tokensOf(job)));
    const partitions = [job.slice(0, 3), job.slice(3, 6), job.slice(6)];
    for (const [p, own] of partitions.entries()) {
      // Whatever ran before this partition is already in the register, in any order.
      for (const before of [partitions.filter((_, q) => q !== p), []]) {
        const stored = before.flat();
        const table = idfFromCounts(new Map(tokensOf(job).map((t) => [t, counts(stored).get(t) ?? 0])), stored.length, basisOf(own, frozen));
        for (const token of tokensOf(own)) expect({ token, idf: table.idf(token) }).toEqual({ token, idf: reference.idf(token) });
      }
    }
  });
});
