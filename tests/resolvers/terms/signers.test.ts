/**
 * Issue 16 items 4 and 5: people who sign for a party are never parties, a job title is never a non-party name, and
 * an entity the contract says is no party is recorded as mentioned. Invented names and passages only; the shapes
 * are the execution-clause conventions of US, UK and translated drafting (common practice).
 */
import { describe, expect, it } from 'vitest';
import { parseParties, resolveInContract } from '../../../resolvers/terms/index.ts';
import { MAX_SIGNERS } from '../../../resolvers/terms/merge-signers.ts';
import { findSigners } from '../../../resolvers/terms/find-signers.ts';
import { findExclusions } from '../../../resolvers/terms/find-exclusions.ts';
import { isJobTitle, jobTitleOf } from '../../../resolvers/terms/is-job-title.ts';
import { readPersonName } from '../../../resolvers/terms/read-person-name.ts';
import { grow } from './support.ts';
import { oneLine } from '../../../resolvers/terms/parse-parties.ts';

const read = (s: string): string | null => readPersonName(s, 0, s.length)?.name ?? null;

describe('job titles', () => {
  it('reads the titles of execution blocks, with their leading "its"/"a" dropped', () => {
    // Common practice: titles of US, UK and translated signature blocks.
    for (const t of [
      'Managing Director',
      'Chief Executive Officer',
      'Vice President, Operations',
      'Head of Procurement',
      'Company Secretary',
      'Representative Director',
      'Geschäftsführer',
      'Président',
      'Notary Public',
      'General Counsel',
    ]) {
      expect(isJobTitle(t), t).toBe(true);
    }
    expect(jobTitleOf('its managing director')).toBe('managing director');
    expect(jobTitleOf('a director')).toBe('director');
  });

  it('is no title for names, places or prose', () => {
    for (const t of ['Oswin Tarrant', 'Bramwell Cartography Limited', 'England and Wales', 'the Supplier shall deliver the goods', '']) {
      expect(isJobTitle(t), t).toBe(false);
    }
  });
});

describe('person names after a signature cue', () => {
  it('reads given names, initials, particles and a form of address', () => {
    expect(read('Oswin Tarrant, Managing Director')).toBe('Oswin Tarrant');
    expect(read('Mrs Odile Marchal, Président')).toBe('Odile Marchal');
    expect(read('Maître Solène Garnier')).toBe('Solène Garnier');
    expect(read('Theda J. van der Kornblum')).toBe('Theda J. van der Kornblum');
    expect(read('QUENTIN ALDOUS')).toBe('QUENTIN ALDOUS');
  });

  it('refuses companies, titles, rules and lone words', () => {
    for (const s of ['Hexham Loom Ltd', 'Managing Director', '______', 'Tarrant', 'its director', '']) expect(read(s), s).toBeNull();
  });
});

describe('findSigners', () => {
  const one = (text: string) => findSigners(text);

  it('"Signed for and on behalf of X by Y, President" names Y for X with her title', () => {
    expect(one('Signed for and on behalf of QORVANE TEXTILES LTD by Maren Holloway, President')).toEqual([
      { name: 'Maren Holloway', title: 'President', capacity: 'signatory', signsFor: 'QORVANE TEXTILES LTD' },
    ]);
  });

  it('"Y, duly authorised", "acting through its director Y", "represented by Mr Y"', () => {
    expect(one('For Vellmark GmbH: Anselm Voigt, duly authorised').map((s) => s.name)).toEqual(['Anselm Voigt']);
    expect(one('Brunnhof GmbH, acting through its director Oskar Lindqvist (the "Seller")')).toEqual([
      { name: 'Oskar Lindqvist', title: 'director', capacity: 'signatory' },
    ]);
    expect(one('Atelier Faure SARL, represented by Mr Lucien Faure, its manager (the "Client")')).toEqual([
      { name: 'Lucien Faure', title: 'manager', capacity: 'signatory' },
    ]);
  });

  it('witness and notary lines, on one line or with the name below', () => {
    const text = `Witness: ____________________
Name: Theda Kornblum

Name of witness: Corbin Yates

Before me, Hester Galloway, a Notary Public in and for said State, personally appeared Harlan Beeche.

Notary: Maître Solène Garnier`;
    const got = one(text).map((s) => `${s.capacity}:${s.name}`);
    expect(got).toEqual(
      expect.arrayContaining(['witness:Theda Kornblum', 'witness:Corbin Yates', 'notary:Hester Galloway', 'signatory:Harlan Beeche', 'notary:Solène Garnier']),
    );
  });

  it('a conformed "/s/" signature with the bare title on the next line', () => {
    expect(one('/s/ Quentin Aldous\nQuentin Aldous\nChief Financial Officer')).toEqual([
      { name: 'Quentin Aldous', title: 'Chief Financial Officer', capacity: 'signatory' },
    ]);
  });

  it('"IN WITNESS WHEREOF" and "signed by the Parties" name no one', () => {
    expect(one('IN WITNESS WHEREOF, this Agreement has been signed by the Parties on the date above.')).toEqual([]);
    // A company after "represented by" is no person: it needs a title, a form of address or a person's name.
    expect(one('Fenwick Fund LP, represented by Fenwick Harbour Partners')).toEqual([]);
  });
});

describe('parseParties: signers', () => {
  it('keeps the signer and her title out of the parties and the title out of the non-party names', () => {
    // The demo's shape (services/demo contract generator): the entity on the same line as its signer.
    const p = parseParties('Signed for and on behalf of BRAMWELL CARTOGRAPHY LIMITED by Oswin Tarrant, Managing Director\n\n______________________');
    expect(p.parties.map((x) => x.name)).toEqual(['BRAMWELL CARTOGRAPHY LIMITED']);
    expect(p.notParties).toEqual(['Oswin Tarrant']);
    expect(p.signers).toEqual([{ name: 'Oswin Tarrant', title: 'Managing Director', capacity: 'signatory', signsFor: 'BRAMWELL CARTOGRAPHY LIMITED' }]);
  });

  it('a signer mention resolves to not_a_party and says for whom she signs', () => {
    const p = parseParties('QORVANE TEXTILES LTD\n\nBy: ______\nName: Maren Holloway\nTitle: Company Secretary');
    const r = resolveInContract(p, 'Maren Holloway');
    expect(r.status).toBe('not_a_party');
    expect(r.explanation).toContain('signs for QORVANE TEXTILES LTD as Company Secretary');
    expect(resolveInContract(p, 'Company Secretary').status).not.toBe('bound');
  });

  it('an individual party who signs for herself stays a party', () => {
    const p = parseParties(
      'This Agreement is made between Ravensholt Surveys Limited, a company registered in England and Wales (the "Company"), and Harriet Quillan (the "Consultant").\n\nSigned by Harriet Quillan, Consultant',
    );
    expect(p.parties.map((x) => [x.name, x.kind])).toEqual([
      ['Ravensholt Surveys Limited', 'organisation'],
      ['Harriet Quillan', 'person'],
    ]);
    expect(p.notParties).not.toContain('Harriet Quillan');
  });
});

describe('express exclusions', () => {
  it('finds the name before "which is not a party hereto" and a term defined before "is not a party"', () => {
    expect(findExclusions('The fees are paid by Dunmore Realty Partners LLC, which is not a party hereto.').map((e) => e.name)).toEqual([
      'Dunmore Realty Partners LLC',
    ]);
    expect(findExclusions('Kittering Holdings plc (the "Guarantor") is not a party to this Deed.')).toEqual([
      { name: 'Kittering Holdings plc', start: 0, terms: ['Guarantor'] },
    ]);
    expect(findExclusions('For the avoidance of doubt, the Guarantor shall not be a party to this Agreement.').map((e) => e.name)).toEqual(['Guarantor']);
    expect(findExclusions('No third party shall have any right under it.')).toEqual([]);
  });

  it('records the entity as mentioned, not as a party; its term binds no party', () => {
    const text =
      'This Agreement is made between Ashcombe Joinery Limited (the "Tenant") and Pennock Estates LLP (the "Landlord"). Kittering Holdings plc (the "Guarantor") is not a party to this Agreement.';
    const p = parseParties(text);
    expect(p.parties.map((x) => x.name)).toEqual(['Ashcombe Joinery Limited', 'Pennock Estates LLP']);
    expect(p.mentioned).toEqual([{ name: 'Kittering Holdings plc', terms: ['Guarantor'] }]);
    // A role word the contract gives no party: kept out of the register either way.
    const term = resolveInContract(p, 'the Guarantor');
    expect(['unbound_term', 'not_a_party']).toContain(term.status);
    expect(term.party).toBeUndefined();
    const named = resolveInContract(p, 'Kittering Holdings plc');
    expect(named.status).toBe('match');
    expect(named.party).toBeUndefined();
    expect(named.explanation).toContain('not a party');
  });
});

describe('signer and exclusion scanners on adversarial 1 MB inputs', () => {
  // The ceiling only catches hangs and quadratic scans (a per-signer search of the whole text took minutes).
  const HANG_CEILING_MS = 30_000;
  // Letters, not digits, make each invented name unique: a name holds no digit.
  const coined = (i: number): string => `Q${i.toString(26).replace(/\d/gu, (d) => String.fromCharCode(0x61 + Number(d)))}by`;
  const inputs: Array<[string, string]> = [
    ['on-behalf lines with a new signer each', grow((i) => `Signed for and on behalf of QORV LTD by Maren ${coined(i)}, Managing Director\n`)],
    ['witness labels with a new name each', grow((i) => `Witness: ____\nName: Theda ${coined(i)}\n`)],
    ['conformed signatures', grow((i) => `/s/ Quentin ${coined(i)}\nChief Executive Officer\n`)],
    ['represented-by runs on one line', grow(() => 'represented by Mr Anselm Anselm Anselm, its ')],
    ['exclusions', grow((i) => `${coined(i)} Holdings plc (the "Guarantor") is not a party to this Deed. `)],
    ['not-a-party phrases after lower-case words', grow(() => 'which is not a party ')],
  ];
  it.each(inputs)(
    '%s: finishes well under the hang ceiling',
    (_label, text) => {
      const started = Date.now();
      const parsed = parseParties(text);
      expect(Date.now() - started).toBeLessThan(HANG_CEILING_MS);
      for (const p of parsed.parties) expect(oneLine(text).includes(p.name)).toBe(true);
      expect((parsed.signers ?? []).length).toBeLessThanOrEqual(MAX_SIGNERS);
    },
    HANG_CEILING_MS * 2,
  );
});
