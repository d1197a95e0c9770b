import { describe, expect, it } from 'vitest';
import {
  abnWeightedSum,
  acnCheckDigit,
  frenchVatKey,
  isLuhnValid,
  isValidAbn,
  luhnCheckDigit,
  normaliseIdentifier,
} from '../../../resolvers/identifiers/index.ts';

const norm = (scheme: string, value: string, defaultCountry?: string): string => {
  const r = normaliseIdentifier({ scheme, value }, { defaultCountry });
  if (!r.ok) throw new Error(r.reason);
  return r.identifier.value;
};
const reason = (scheme: string, value: string, defaultCountry?: string): string => {
  const r = normaliseIdentifier({ scheme, value }, { defaultCountry });
  if (r.ok) throw new Error(`expected ${scheme} "${value}" to be rejected, got ${r.identifier.value}`);
  return r.reason;
};

/** Second, independent computation of a Luhn check: digit sums of products with weights 1,2,1,2… from the right. */
function luhnByDigitSums(digits: string): boolean {
  let total = 0;
  [...digits].reverse().forEach((d, i) => {
    const product = Number(d) * (i % 2 === 0 ? 1 : 2);
    total += Math.floor(product / 10) + (product % 10);
  });
  return total % 10 === 0;
}

describe('AU ACN (ASIC check-digit algorithm)', () => {
  it("ASIC worked example 004 085 616 (from memory of ASIC's published ACN check-digit description)", () => {
    // Weights 8..1: 0·8 + 0·7 + 4·6 + 0·5 + 8·4 + 5·3 + 6·2 + 1·1 = 84; 84 mod 10 = 4; 10 − 4 = 6.
    expect(acnCheckDigit('00408561')).toBe(6);
    expect(norm('au_acn', '004 085 616')).toBe('004085616');
  });
  it.each([
    // Valid ACNs listed by ASIC beside the algorithm (from memory); each re-computed two ways below.
    '000000019',
    '000250000',
    '000500005',
    '000750005',
    '001000004',
    '001250004',
    '001500009',
    '001749999',
    '001999999',
    '002249998',
    '002499998',
    '002749993',
    '002999993',
    '003249992',
    '003499992',
    '003749988',
    '003999988',
    '004249987',
    '004499987',
    '004749982',
    '004999982',
    '005249981',
    '005499981',
    '005749986',
  ])('%s verifies, and the check digit is the same computed two ways', (acn) => {
    expect(norm('au_acn', acn)).toBe(acn);
    const formula = acnCheckDigit(acn.slice(0, 8));
    // Second way: the digit d that makes the weighted sum plus d a multiple of 10.
    let sum = 0;
    for (let i = 0; i < 8; i++) sum += Number(acn[i]) * (8 - i);
    const searched = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9].find((d) => (sum + d) % 10 === 0);
    expect(formula).toBe(searched);
    expect(String(formula)).toBe(acn[8]);
  });
  it('rejects a wrong check digit and a wrong length, naming the scheme', () => {
    expect(reason('au_acn', '004 085 617')).toMatch(/^AU ACN "004 085 617": check digit is 7, ASIC's algorithm gives 6/);
    expect(reason('au_acn', '04 085 616')).toMatch(/^AU ACN .*9 digits, found 8/);
  });
});

describe('AU ABN (ATO mod-89 algorithm)', () => {
  it("ATO worked example 51 824 753 556 (from memory of the ATO's published ABN format description)", () => {
    // (5−1)·10 + 1·1 + 8·3 + 2·5 + 4·7 + 7·9 + 5·11 + 3·13 + 5·15 + 5·17 + 6·19 = 534 = 6 · 89.
    expect(abnWeightedSum('51824753556')).toBe(534);
    expect(isValidAbn('51824753556')).toBe(true);
    expect(norm('au_abn', 'ABN 51 824 753 556')).toBe('51824753556');
  });
  it('the check digits 51 computed a second way, from the nine-digit body', () => {
    // With prefix p = 10x + y the sum is p − 10 + B, B the weighted body: p ≡ 10 − B (mod 89), p in 10..99.
    const body = '824753556';
    let b = 0;
    for (let i = 0; i < 9; i++) b += Number(body[i]) * [3, 5, 7, 9, 11, 13, 15, 17, 19][i]!;
    let p = (((10 - b) % 89) + 89) % 89;
    if (p < 10) p += 89;
    expect(p).toBe(51);
  });
  it('rejects a changed digit', () => {
    expect(reason('au_abn', '51 824 753 557')).toMatch(/^AU ABN .*mod-89/);
  });
});

describe('FR SIREN (Luhn, INSEE) and RCS forms', () => {
  it('INSEE example SIREN 732 829 320 (from memory), checked two ways', () => {
    expect(isLuhnValid('732829320')).toBe(true);
    expect(luhnByDigitSums('732829320')).toBe(true);
    expect(luhnCheckDigit('73282932')).toBe(0);
  });
  it('reads RCS mentions and SIRETs', () => {
    expect(norm('fr_siren', '732 829 320')).toBe('732829320');
    expect(norm('fr_siren', 'RCS Lyon B 732 829 320')).toBe('732829320');
    expect(norm('fr_siren', '732 829 320 R.C.S. Lyon')).toBe('732829320');
    // SIRET = SIREN + an (invented) establishment number 00074: the SIREN part is kept and checked.
    expect(norm('fr_siren', '732 829 320 00074')).toBe('732829320');
  });
  it('rejects bad ones', () => {
    expect(reason('fr_siren', '732 829 321')).toMatch(/^FR SIREN .*Luhn/);
    expect(reason('fr_siren', '12345')).toMatch(/9 digits/);
    expect(reason('fr_siren', 'Lyon 732 829 320')).toMatch(/RCS/);
  });
  it('French VAT key of SIREN 732 829 320 is 44: FR 44 732 829 320 (from memory of the published example), which cross-checks the key formula', () => {
    expect(frenchVatKey('732829320')).toBe('44');
    expect(norm('vat', 'FR 44 732 829 320')).toBe('FR44732829320');
    expect(reason('vat', 'FR 45 732 829 320')).toMatch(/key 45 does not match SIREN 732829320 \(expected 44\)/);
  });
});

describe('SE organisationsnummer (Luhn)', () => {
  // Invented numbers; check digit computed with our Luhn and with the independent digit-sum version.
  it.each(['5566778899', '5560000001'].filter((n) => luhnByDigitSums(n)).concat([`556123456${luhnCheckDigit('556123456')}`]))('%s', (n) => {
    expect(luhnByDigitSums(n)).toBe(true);
    expect(norm('se_org', `${n.slice(0, 6)}-${n.slice(6)}`)).toBe(n);
    expect(norm('se_org', `16${n}`)).toBe(n);
  });
  it('rejects a wrong check digit', () => {
    expect(reason('se_org', '556677-8898')).toMatch(/^SE organisation number .*Luhn/);
  });
});

describe('GB company number', () => {
  // Companies House: 8 characters, digits zero-padded or a two-letter prefix + 6 digits (common practice).
  it('pads and keeps prefixes', () => {
    expect(norm('gb_company', '123456')).toBe('00123456');
    expect(norm('gb_company', 'Company No. 01234567')).toBe('01234567');
    expect(norm('gb_company', 'sc 12345')).toBe('SC012345');
    expect(norm('gb_company', 'OC301234')).toBe('OC301234');
  });
  it('rejects too long or odd values', () => {
    expect(reason('gb_company', '123456789')).toMatch(/^GB company number .*at most 8/);
    expect(reason('gb_company', 'S1234567')).toMatch(/two letters followed by digits/);
    expect(reason('gb_company', '0000')).toMatch(/all zeros/);
  });
});

describe('DE register entries', () => {
  it('normalises court, type and number', () => {
    expect(norm('de_register', 'Amtsgericht München HRB 12345')).toBe('muenchen HRB 12345');
    expect(norm('de_register', 'HRB 12345, AG Muenchen')).toBe('muenchen HRB 12345');
    expect(norm('de_register', 'HRB 1234 B, AG Charlottenburg')).toBe('berlin-charlottenburg HRB 1234 B');
    expect(norm('de_register', 'Amtsgericht Berlin (Charlottenburg) HRB 1234 B')).toBe('berlin-charlottenburg HRB 1234 B');
    expect(norm('de_register', 'Frankfurt a. M. HR B 987')).toBe('frankfurt-main HRB 987');
    expect(norm('de_register', 'Amtsgericht Frankfurt am Main HRB 987')).toBe('frankfurt-main HRB 987');
    expect(norm('de_register', 'AG Frankfurt/Main, HRB 987')).toBe('frankfurt-main HRB 987');
    expect(norm('de_register', 'Amtsgericht Freiburg i. Br. HRB 701')).toBe(norm('de_register', 'Amtsgericht Freiburg im Breisgau HRB 701'));
    expect(norm('de_register', 'Registergericht Köln, HRA 00042')).toBe('koeln HRA 42');
    expect(norm('de_register', 'AG Köln HRB12345')).toBe('koeln HRB 12345');
    expect(norm('de_register', 'HRB1234B Amtsgericht Charlottenburg')).toBe('berlin-charlottenburg HRB 1234 B');
  });
  it('requires a court and a type', () => {
    expect(reason('de_register', 'HRB 12345')).toMatch(/^DE register entry .*register court/);
    expect(reason('de_register', 'München 12345')).toMatch(/register type/);
  });
});

describe('EU VAT prefixes', () => {
  it('uses EL for Greece (a GR prefix is read as EL)', () => {
    expect(norm('vat', 'GR 123456789')).toBe('EL123456789');
    expect(norm('vat', 'EL123456789')).toBe('EL123456789');
    expect(norm('vat', '123456789', 'GR')).toBe('EL123456789');
  });
  it('applies per-country formats (from memory of the VIES formats)', () => {
    expect(norm('vat', 'DE 123 456 789')).toBe('DE123456789');
    expect(norm('vat', 'NL123456789B01')).toBe('NL123456789B01');
    expect(norm('vat', 'ATU12345678')).toBe('ATU12345678');
    expect(norm('vat', 'CHE-123.456.789 MWST')).toBe('CHE123456789');
    expect(reason('vat', 'DE 12345678')).toMatch(/^VAT number .*DE999999999/);
    expect(reason('vat', '123456789')).toMatch(/needs a country prefix/);
    expect(reason('vat', 'US123456789')).toMatch(/prefix US is not a VAT prefix/);
  });
});

describe('US EIN, NL KvK', () => {
  it('EIN: NN-NNNNNNN', () => {
    expect(norm('us_ein', '123456789')).toBe('12-3456789');
    expect(norm('us_ein', 'EIN: 12-3456789')).toBe('12-3456789');
    expect(reason('us_ein', '00-3456789')).toMatch(/prefix 00/);
    expect(reason('us_ein', '12-345678')).toMatch(/9 digits/);
  });
  it('KvK: 8 digits', () => {
    expect(norm('nl_kvk', 'KvK 1234 5678')).toBe('12345678');
    expect(reason('nl_kvk', '1234567')).toMatch(/^NL KvK number .*8 digits, found 7/);
  });
});

describe('IBAN (ibantools)', () => {
  it('published examples GB82 WEST 1234 5698 7654 32 and DE89 3704 0044 0532 0130 00 (from memory: the ISO 13616 / bank-published sample IBANs)', () => {
    expect(norm('iban', 'GB82 WEST 1234 5698 7654 32')).toBe('GB82WEST12345698765432');
    expect(norm('iban', 'de89 3704 0044 0532 0130 00')).toBe('DE89370400440532013000');
    expect(reason('iban', 'GB82 WEST 1234 5698 7654 33')).toMatch(/^IBAN .*check digits/);
  });
});
