/**
 * Precision comes first: text that merely looks like a definition must not yield a party. Invented passages;
 * the expected readings are common drafting practice.
 */
import { describe, expect, it } from 'vitest';
import { parseParties } from '../../../resolvers/terms/index.ts';

const names = (text: string): string[] => parseParties(text).parties.map((p) => p.name);

describe('parseParties does not invent parties', () => {
  it('a term defined for two companies at once names no single party', () => {
    const text = 'This Side Letter relates to the Master Services Agreement dated 1 May 2020 between Qorv Widgets Ltd and Beta Tools Ltd (the "MSA").';
    const r = parseParties(text);
    expect(r.parties).toEqual([]);
    expect(r.notParties).toContain('MSA');
  });

  it('keeps "GmbH & Co. KG" and "Smith and Jones LLP" as one name each', () => {
    expect(names('This Agreement is made between Holzner Feinmechanik GmbH & Co. KG ("Holzner") and Smith and Jones LLP ("SJ").')).toEqual([
      'Holzner Feinmechanik GmbH & Co. KG',
      'Smith and Jones LLP',
    ]);
  });

  it('ignores definitions of things in recitals, definitions sections and body text', () => {
    const text = `This Agreement is made between Corran Vale Ltd, a company incorporated in England ("Corran") and Ashby Lane Ltd, a company incorporated in England ("Ashby").

WHEREAS, the Licensor owns certain software (the "Software") and wishes to license it in Italy (the "Territory").

1. Definitions
"Affiliate" means any entity that controls a party.
"Confidential Information" has the meaning given in clause 9.

2. Corran shall give Ashby access to the Corran Analytics Suite (the "Suite") and to the Dashboard (the "Portal").`;
    const r = parseParties(text);
    expect(r.parties.map((p) => p.name)).toEqual(['Corran Vale Ltd', 'Ashby Lane Ltd']);
    for (const term of ['Software', 'Territory', 'Suite', 'Portal'])
      expect(
        r.parties.some((p) => p.terms.includes(term)),
        term,
      ).toBe(false);
  });

  it('does not take a witness clause above "By:" for a party', () => {
    const text = 'IN WITNESS WHEREOF, the parties have signed this Agreement on the date first written above.\nBy: ______\nName: Ada Quill\nTitle: Director';
    const r = parseParties(text);
    expect(r.parties).toEqual([]);
    expect(r.reason?.code).toBe('no_parties_found');
  });

  it('does not take identifiers or pronouns for names', () => {
    const text = 'between LEI 984500W7K2MQ3RZ8LN12 ("Issuer") and you ("Customer")';
    expect(parseParties(text).parties).toEqual([]);
  });

  it('label lines that are not party labels introduce no party', () => {
    const text =
      'Notices: Harrowby Fine Foods Limited\nBank: Lowther Bank plc\nCopy to: Ashdown Mills Ltd\nAttention: Corran Vale Ltd\nBetween: Brockley Farms Ltd';
    expect(parseParties(text).parties).toEqual([]);
  });
});
