/**
 * Issue 15 (audit): rules of legal-form reading that had no test of their own. Names are invented.
 * Forms, codes and jurisdictions: ISO 20275 ELF code list v1.5 (../shared/reference/iso20275-elf-code-list.csv), rows
 * quoted beside each check, or resolvers/analyse/legal-form-supplement.ts where v1.5 gives no abbreviation.
 */
import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';

describe('a word that is a legal form in one other jurisdiction only stays a word of the name', () => {
  // ISO 20275 v1.5: "Bank (LLC)" 9EGO and "Bank (Corporation)" TPFL, both Puerto Rico (PR) only.
  it('"Renfenax Bank" keeps "bank" under a US or a DE hint', () => {
    for (const country of ['US', 'DE']) {
      const a = analyseName('Renfenax Bank', { country });
      expect(a.legalForm).toBeNull();
      expect(a.tokens).toEqual(['renfenax', 'bank']);
    }
  });

  it('without a hint, or under the PR hint, "Bank" is read as the Puerto Rican form', () => {
    for (const hints of [{}, { country: 'PR' }]) {
      const a = analyseName('Renfenax Bank', hints);
      expect(a.legalForm?.elfCodes).toEqual(['9EGO', 'TPFL']);
      expect(a.legalForm?.jurisdictions).toEqual(['PR']);
      expect(a.tokens).toEqual(['renfenax']);
    }
  });

  it('an initialism of one other jurisdiction stays a form ("DAC" is Irish only, LGWG)', () => {
    // ISO 20275 v1.5 LGWG, Ireland: "DAC – (limited by shares)"; the bare "DAC" is from legal-form-supplement.ts.
    const a = analyseName('Renfenax Holdings DAC', { country: 'US' });
    expect(a.legalForm?.elfCodes).toEqual(['LGWG']);
    expect(a.tokens).toEqual(['renfenax', 'holdings']);
  });
});

describe('supplement forms the ELF list v1.5 does not spell out (legal-form-supplement.ts)', () => {
  const form = (name: string, country?: string) => analyseName(name, country ? { country } : {}).legalForm;

  it('"DAC" and "D.A.C.": Irish designated activity company, LGWG (IE)', () => {
    for (const text of ['DAC', 'D.A.C.']) {
      expect(form(`Renfenax Holdings ${text}`)).toMatchObject({ text, elfCodes: ['LGWG'], jurisdictions: ['IE'] });
      expect(form(`Renfenax Holdings ${text}`, 'IE')?.elfCodes).toEqual(['LGWG']);
    }
  });

  it('"S.A.U." and "SAU": ES sociedad anónima unipersonal (5RDO, the ES S.A. row) and AR WUAZ', () => {
    // ISO 20275 v1.5: WUAZ Argentina "Sociedad Anonima Unipersonal", abbreviation "S.A.U."; 5RDO Spain
    // "Sociedad Anonima" "S.A.", with "S.A.U." added by the supplement (common practice in Spain).
    for (const text of ['S.A.U.', 'SAU']) {
      expect(form(`Renfenax Inversiones ${text}`)).toMatchObject({ text, elfCodes: ['5RDO', 'WUAZ'], jurisdictions: ['ES', 'AR'] });
      expect(form(`Renfenax Inversiones ${text}`, 'ES')?.elfCodes).toEqual(['5RDO']);
      expect(form(`Renfenax Inversiones ${text}`, 'AR')?.elfCodes).toEqual(['WUAZ']);
    }
  });

  it('"S.C.C." and its variants: ES cooperativa de crédito, SS0L', () => {
    // ISO 20275 v1.5: SS0L Spain "Cooperativa de Credito", no abbreviation; the short forms are the supplement's.
    const variants = ['S.C.C.', 'SCC', 'S.C.C.V.', 'C.C.V.', 'S.C.A.C.', 'S. Coop. de Crédito', 'Sociedad Cooperativa de Crédito'];
    for (const text of variants) {
      const a = analyseName(`Caja Renfenax ${text}`);
      expect(a.legalForm).toMatchObject({ text, elfCodes: ['SS0L'], jurisdictions: ['ES'] });
      expect(a.tokens).toEqual(['caja', 'renfenax']);
    }
  });

  it('"C.C." is also the South African close corporation (4YUU); the ES hint narrows it to SS0L', () => {
    // ISO 20275 v1.5: 4YUU South Africa "Close Corporation" "CC".
    expect(form('Caja Renfenax C.C.')).toMatchObject({ elfCodes: ['4YUU', 'SS0L'], jurisdictions: ['ZA', 'ES'] });
    expect(form('Caja Renfenax C.C.', 'ES')?.elfCodes).toEqual(['SS0L']);
    expect(form('Caja Renfenax C.C.', 'ZA')?.elfCodes).toEqual(['4YUU']);
  });
});
