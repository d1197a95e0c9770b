/**
 * Issue 16 item 9, the pure half: statements that an amendment or side letter uses the defined terms of an earlier
 * agreement (findEarlierAgreements), dates as contracts write them (readDate), and the judgement whether a stored
 * contract is that agreement (matchEarlierAgreement). Every passage, company and number is invented; the phrases are
 * British, US and translated drafting conventions (common practice). Expected values are what a careful reader of each
 * passage writes down.
 */
import { describe, expect, it } from 'vitest';
import { containsToken, datesIn, findEarlierAgreements, matchEarlierAgreement, parseParties } from '../../../resolvers/terms/index.ts';

const US_AMENDMENT = `FIRST AMENDMENT TO MASTER SERVICES AGREEMENT

This First Amendment (this "Amendment") is entered into as of September 1, 2024 by and between Harrowgate Analytics, Inc., a Delaware corporation ("Customer"), and Quillon Freight LLC, a Texas limited liability company.

Capitalized terms used but not defined in this Amendment shall have the meanings ascribed to them in the Master Services Agreement dated June 1, 2024, between Harrowgate Analytics, Inc. and Quillon Freight LLC (Contract No. MSA-2024-017).

1. The Carrier shall deliver weekly.`;

const UK_SIDE_LETTER = `SIDE LETTER

To: Wrenfield Systems Ltd
From: Tollaby Logistics Limited
Date: 2 June 2025

Dear Sirs,

We refer to the supply agreement dated 3 March 2025 between us (the "Agreement"). Capitalised terms used in this letter have the meaning given to them in the Agreement.

The Supplier may deliver to the Customer's Leeds depot until 30 September 2025.`;

const EU_AMENDMENT = `AMENDMENT AGREEMENT No. 2

This Amendment Agreement is concluded between Vellmark Antriebstechnik GmbH (hereinafter the "Supplier") and Brisemont Énergie SAS (hereinafter the "Client").

Terms defined in the Framework Agreement of 12 May 2023 (reference RV-2023-12) have the same meaning in this Amendment Agreement.`;

const UK_AS_DEFINED = `DEED OF VARIATION dated 14 July 2024 between PENHALLOW MARINE LIMITED (company number 05512345) ("Penhallow") and GRAYLING SURVEY LTD ("Grayling").

Words and expressions used in this Deed bear the same meaning as in the Survey Agreement dated 2 February 2021 between Penhallow Boatyards Limited and Grayling Survey Ltd.`;

describe('findEarlierAgreements', () => {
  it('reads a US amendment: title, date, contract number and the parties it names', () => {
    expect(findEarlierAgreements(US_AMENDMENT)).toEqual([
      expect.objectContaining({
        title: 'Master Services Agreement',
        date: '2024-06-01',
        reference: 'MSA-2024-017',
        parties: ['Harrowgate Analytics, Inc.', 'Quillon Freight LLC'],
      }),
    ]);
  });

  it('reads a UK side letter through the definition of "the Agreement"; "between us" names no party', () => {
    const [ref] = findEarlierAgreements(UK_SIDE_LETTER);
    expect(ref).toMatchObject({ title: 'supply agreement', date: '2025-03-03', parties: [] });
    expect(ref?.reference).toBeUndefined();
  });

  it('reads a translated amendment: "Terms defined in the Framework Agreement of …", never the amendment itself', () => {
    expect(findEarlierAgreements(EU_AMENDMENT)).toEqual([
      expect.objectContaining({ title: 'Framework Agreement', date: '2023-05-12', reference: 'RV-2023-12', parties: [] }),
    ]);
  });

  it('reads a UK deed of variation: "bear the same meaning as in the Survey Agreement dated … between X and Y"', () => {
    expect(findEarlierAgreements(UK_AS_DEFINED)).toEqual([
      expect.objectContaining({ title: 'Survey Agreement', date: '2021-02-02', parties: ['Penhallow Boatyards Limited', 'Grayling Survey Ltd.'] }), // the final period is both the sentence's and the form's
    ]);
  });

  it('finds nothing where terms are defined inside the same contract', () => {
    const own = `Capitalised terms have the meaning given in clause 1. Terms as defined in Schedule 2 apply to the Services.`;
    expect(findEarlierAgreements(own)).toEqual([]);
    expect(
      parseParties(`This Agreement is made between Corrin Hale Ltd (the "Licensor") and Brennock Mills Limited (the "Licensee"). ${own}`).earlierAgreements,
    ).toBeUndefined();
  });

  it('stays linear on long adversarial input', () => {
    const long = 'have the meaning given in the '.repeat(20000);
    const started = Date.now();
    findEarlierAgreements(long);
    expect(Date.now() - started).toBeLessThan(5000); // a generous ceiling that only catches a hang
  });
});

describe('datesIn', () => {
  it('reads British, US, "day of" and ISO 8601 dates and leaves ambiguous numeric ones out', () => {
    // Calendar facts: 29 February exists in 2024 (a leap year), not in 2025.
    expect(datesIn('3 March 2025; March 3, 2025; the 9th day of January, 2025; 2024-02-29; 29 February 2025; 03/04/2025')).toEqual([
      '2025-03-03',
      '2025-03-03',
      '2025-01-09',
      '2024-02-29',
    ]);
  });
});

describe('matchEarlierAgreement', () => {
  const msa = parseParties(`MASTER SERVICES AGREEMENT

This Master Services Agreement is entered into as of June 1, 2024 by and between Harrowgate Analytics, Inc., a Delaware corporation ("Customer"), and Quillon Freight LLC, a Texas limited liability company ("Carrier").`);
  const head = 'MASTER SERVICES AGREEMENT\n\nThis Master Services Agreement is entered into as of June 1, 2024 by and between Harrowgate Analytics, Inc.';
  const amendment = parseParties(US_AMENDMENT);
  const [ref] = findEarlierAgreements(US_AMENDMENT);
  const stored = { externalId: 'MSA-2024-017', title: 'Master Services Agreement', head, parsed: msa };

  it('agrees by reference number (external id, or a whole token of the title or opening), and by title, date and parties without it', () => {
    expect(matchEarlierAgreement(ref!, amendment, stored)).toEqual({ agrees: true, how: 'reference' });
    expect(matchEarlierAgreement(ref!, amendment, { ...stored, externalId: 'c-1', title: 'Master Services Agreement MSA-2024-017' })).toEqual({
      agrees: true,
      how: 'reference',
    });
    expect(matchEarlierAgreement(ref!, amendment, { ...stored, externalId: 'c-1', head: `Contract No. msa-2024-017\n${head}` })).toEqual({
      agrees: true,
      how: 'reference',
    });
    expect(matchEarlierAgreement(ref!, amendment, { ...stored, externalId: 'c-1' })).toEqual({ agrees: true, how: 'title_and_parties' });
  });

  it('never reads a number inside a longer one as the reference', () => {
    expect(containsToken('Contract No. XMSA-2024-0170', 'MSA-2024-017')).toBe(false);
    expect(containsToken('(Contract No. MSA-2024-017)', 'MSA-2024-017')).toBe(true);
    const elsewhere = { ...stored, externalId: 'c-1', title: 'Warehouse Lease', head: 'WAREHOUSE LEASE under contract MSA-2024-0170 dated June 1, 2024' };
    expect(matchEarlierAgreement(ref!, amendment, elsewhere).agrees).toBe(false);
  });

  it('refuses another date, another title and other parties, even with the reference number', () => {
    expect(matchEarlierAgreement(ref!, amendment, { ...stored, externalId: 'c-1', head: head.replace('June 1, 2024', 'July 1, 2024') }).agrees).toBe(false);
    expect(
      matchEarlierAgreement(ref!, amendment, { ...stored, externalId: 'c-1', title: 'Warehouse Lease', head: 'WAREHOUSE LEASE dated June 1, 2024' }).agrees,
    ).toBe(false);
    const other = parseParties(
      `This Master Services Agreement is made on June 1, 2024 between Sallow Weaving Ltd (the "Customer") and Corrin Hale Ltd (the "Carrier").`,
    );
    expect(matchEarlierAgreement(ref!, amendment, { ...stored, parsed: other })).toMatchObject({ agrees: false });
  });
});
