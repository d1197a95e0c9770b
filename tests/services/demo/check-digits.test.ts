// The test validators themselves, checked against published examples before they judge the scenario.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { mod97Of, validAbn, validAcn, validLei, validLuhn, validVat } from './support.ts';

const worked = JSON.parse(readFileSync(new URL('../../../../shared/reference/worked-examples.json', import.meta.url), 'utf8')) as {
  lei_iso17442: { cfpb_appendix_c_worked_example: { uli: string; step3_mod97: number; lei_part: string; loan_part: string } };
};

describe('check-digit validators used by the scenario tests', () => {
  it('MOD 97-10 matches the CFPB Regulation C Appendix C worked example', () => {
    const ex = worked.lei_iso17442.cfpb_appendix_c_worked_example;
    // Source: 12 CFR 1003 Appendix C (worked-examples.json): the ULI validates to 1; base + "00" gives 60.
    expect(mod97Of(ex.uli)).toBe(1);
    expect(mod97Of(`${ex.lei_part}${ex.loan_part}00`)).toBe(ex.step3_mod97);
    expect(validLei('10BX939C5543TQA1144M')).toBe(false); // no check digits of the right kind: common practice
  });

  it('Luhn accepts the ISO/IEC 7812 textbook number and rejects a changed digit', () => {
    // 79927398713: the standard Luhn example (Wikipedia "Luhn algorithm", from memory).
    expect(validLuhn('79927398713')).toBe(true);
    expect(validLuhn('79927398710')).toBe(false);
  });

  it('ACN and ABN rules accept the published examples', () => {
    // ASIC's ACN example 000 000 019 and ABR's ABN example 51 824 753 556 (from memory).
    expect(validAcn('000000019')).toBe(true);
    expect(validAcn('000000018')).toBe(false);
    expect(validAbn('51824753556')).toBe(true);
    expect(validAbn('51824753557')).toBe(false);
  });

  it('VAT rules accept known-valid formats and reject altered check digits', () => {
    // HMRC's example VAT number GB 980 7806 84 (from memory); altering the check digits breaks it.
    expect(validVat('GB980780684')).toBe(true);
    expect(validVat('GB980780685')).toBe(false);
    // An invented SIREN, 012 345 674, whose last digit is its Luhn check digit; its FR key is
    // (12 + 3 × (12345674 mod 97)) mod 97 = (12 + 3 × 96) mod 97 = 9 (computed by hand from the rule).
    expect(validLuhn('012345674')).toBe(true);
    expect(validVat('FR09012345674')).toBe(true);
    expect(validVat('FR10012345674')).toBe(false);
    expect(validVat('FR09012345675')).toBe(false); // the SIREN's Luhn digit changed
  });
});
