import { describe, expect, it } from 'vitest';
import { isValidLei, leiCheckDigits, mod97, mod97CheckDigits, normaliseIdentifier } from '../../../resolvers/identifiers/index.ts';
import { workedExamples } from '../compare/reference-data.ts';

const lei = workedExamples.lei_iso17442 as Record<string, any>;

describe('ISO 7064 MOD 97-10', () => {
  it('reproduces the 12 CFR 1003 Appendix C worked example step by step', () => {
    // Source: 12 CFR Part 1003 (Regulation C) Appendix C, via worked-examples.json → lei_iso17442.cfpb_appendix_c_worked_example.
    const example = lei.cfpb_appendix_c_worked_example;
    expect(example.published_values.mod).toBe(60);
    expect(mod97(`${example.input_string}00`)).toBe(example.published_values.mod); // 60
    expect(mod97CheckDigits(example.input_string)).toBe(example.published_values.check_digit); // "38"
    expect(mod97(example.published_values.uli)).toBe(1); // the full ULI validates
  });
});

describe('LEI (ISO 17442)', () => {
  const real = lei.real_leis as Array<{ lei: string; recomputed_check_digits: string; legal_name_in_source: string }>;

  it('includes the LEI of the foundation that runs the LEI system', () => {
    // GLEIF's own sample data (GLEIF-IT/lei-rdf, see SOURCES.md §5): 506700GE1G29325QX363.
    expect(real.find((r) => r.legal_name_in_source === 'Global Legal Entity Identifier Foundation')?.lei).toBe('506700GE1G29325QX363');
    expect(isValidLei('506700GE1G29325QX363')).toBe(true);
  });

  it.each(real)('validates and recomputes the check digits of $lei', (row) => {
    expect(isValidLei(row.lei)).toBe(true);
    expect(leiCheckDigits(row.lei.slice(0, 18))).toBe(row.recomputed_check_digits);
    expect(row.lei.slice(18)).toBe(row.recomputed_check_digits);
  });

  it.each(lei.invalid_variants as Array<{ candidate: string; why: string; mod97: number; format_ok: boolean }>)('rejects $candidate ($why)', (row) => {
    expect(isValidLei(row.candidate)).toBe(false);
    if (row.format_ok) expect(mod97(row.candidate)).toBe(row.mod97);
  });

  it('normaliseIdentifier forgives case and spaces, then applies the strict rule', () => {
    // The lower-case variant fails the strict format (worked-examples.json) but is the same LEI once upper-cased.
    expect(normaliseIdentifier({ scheme: 'lei', value: '5067 00ge1g29325qx363' })).toEqual({
      ok: true,
      identifier: { scheme: 'lei', value: '506700GE1G29325QX363' },
    });
    const wrong = normaliseIdentifier({ scheme: 'lei', value: '506700GE1G29325QX364' });
    expect(wrong.ok).toBe(false);
    if (!wrong.ok) expect(wrong.reason).toMatch(/^LEI .*check digits.*expected 63/);
    const short = normaliseIdentifier({ scheme: 'lei', value: '506700GE1G29325QX36' });
    expect(!short.ok && short.reason).toMatch(/20 letters or digits, found 19/);
  });
});
