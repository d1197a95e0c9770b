/**
 * The memoised context levels (resolvers/score/context-levels.ts) against the comparators they memoise: the same
 * level for every pair of legal forms and countries, on first call and on a memo hit.
 */
import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import type { MatchRecord } from '../../../resolvers/block/index.ts';
import { compareJurisdictions, compareLegalForms } from '../../../resolvers/compare/index.ts';
import { jurisdictionLevel, legalFormLevel } from '../../../resolvers/score/context-levels.ts';

// Invented names; designators of the ISO 20275 ELF list's common forms (../shared/reference/iso20275-elf-code-list.csv).
const designators = ['Ltd', 'Limited', 'plc', 'GmbH', 'AG', 'SA', 'S.A.R.L.', 'LLC', 'Inc.', 'Pty Ltd', 'BV', 'Oy', 'AB', 'S.p.A.', ''];
const countries = ['GB', 'DE', 'FR', 'CH', 'US', 'US-DE', 'AU', 'nope', undefined];

const records: MatchRecord[] = [];
for (const d of designators) {
  for (const country of countries) {
    const analysis = analyseName(`Kittering Bay Outfitters ${d}`.trim(), country && country !== 'nope' ? { country } : undefined);
    records.push({ id: String(records.length), analysis, ...(country ? { country } : {}) });
  }
}

function expectedJurisdiction(a: MatchRecord, b: MatchRecord): string | null {
  try {
    const level = compareJurisdictions(a.country, b.country).level;
    return level === 'missing' ? null : level;
  } catch {
    return null;
  }
}

describe('memoised context levels', () => {
  it("give the comparators' levels for every pair, twice (fresh and memoised)", () => {
    let compared = 0;
    for (let round = 0; round < 2; round++) {
      for (const a of records) {
        for (const b of records) {
          const form = compareLegalForms(a.analysis.legalForm, b.analysis.legalForm).level;
          expect(legalFormLevel(a, b)).toBe(form === 'missing' ? null : form);
          expect(jurisdictionLevel(a, b)).toBe(expectedJurisdiction(a, b));
          compared++;
        }
      }
    }
    expect(compared).toBe(2 * records.length ** 2);
    // The fixture reaches every legal-form level, so the check is not vacuous.
    const seen = new Set(records.flatMap((a) => records.map((b) => legalFormLevel(a, b))));
    expect([...seen].sort()).toEqual(expect.arrayContaining(['same_family', 'compatible', 'conflicting', 'different_jurisdiction', null]));
  });
});
