/**
 * Issue 16 item 9 in the corpus: amendments, variations and side letters that say they use the defined terms of an
 * earlier agreement ("Capitalized terms … have the meanings ascribed to them in the Master Services Agreement dated
 * …", "We refer to the supply agreement dated … between us (the "Agreement")", "Terms defined in the Framework
 * Agreement of … have the same meaning …"). Each passage must yield its parties and the earlier agreement as the text
 * describes it (title, date, reference number, the parties it names). Every passage, company and number is invented;
 * the shapes are British, US and translated continental drafting conventions (common practice). EARLIER_SHAPES_OF
 * names the shapes each passage shows, so that the test can count three per shape:
 *   reference        the statement gives a reference or contract number;
 *   defined          it names the agreement by a term defined elsewhere in the text ("the Agreement");
 *   named-parties    it names the earlier agreement's parties ("between X and Y").
 */
import type { CorpusCase } from './contracts.ts';

export const EARLIER_AGREEMENT_SHAPES: CorpusCase[] = [
  {
    id: 'us-earlier-amendment-meanings-ascribed',
    style:
      'US: "First Amendment", "Capitalized terms used but not defined … shall have the meanings ascribed to them in the … dated June 1, 2024, between X and Y (Contract No. …)"',
    text: `FIRST AMENDMENT TO MASTER SERVICES AGREEMENT

This First Amendment (this "Amendment") is entered into as of September 1, 2024 by and between Harrowgate Analytics, Inc., a Delaware corporation ("Customer"), and Quillon Freight LLC, a Texas limited liability company ("Carrier").

Capitalized terms used but not defined in this Amendment shall have the meanings ascribed to them in the Master Services Agreement dated June 1, 2024, between Harrowgate Analytics, Inc. and Quillon Freight LLC (Contract No. MSA-2024-017).`,
    parties: [
      { name: 'Harrowgate Analytics, Inc.', terms: ['Customer'] },
      { name: 'Quillon Freight LLC', terms: ['Carrier'] },
    ],
    earlier: [
      { title: 'Master Services Agreement', date: '2024-06-01', reference: 'MSA-2024-017', parties: ['Harrowgate Analytics, Inc.', 'Quillon Freight LLC'] },
    ],
  },
  {
    id: 'us-earlier-letter-as-defined-in',
    style: 'US: letter agreement amending an agreement defined in the same sentence ("the "Purchase Agreement""), "as defined in the Purchase Agreement"',
    text: `LETTER AGREEMENT

Marlowe Pumps Corporation
Attn: Legal Department

Re: Master Purchase Agreement dated as of January 15, 2023 (Agreement No. MPA-0093) (the "Purchase Agreement")

Ladies and Gentlemen: This letter agreement amends the Purchase Agreement. All capitalized terms used herein shall have the meanings as defined in the Purchase Agreement. The Seller shall extend the warranty period to 24 months.`,
    parties: [],
    earlier: [{ title: 'Master Purchase Agreement', date: '2023-01-15', reference: 'MPA-0093', parties: [] }],
  },
  {
    id: 'uk-earlier-side-letter-between-us',
    style:
      'UK: side letter "We refer to the supply agreement dated 3 March 2025 between us (the "Agreement")"; "Capitalised terms … have the meaning given to them in the Agreement"',
    text: `SIDE LETTER

Dear Sirs,

We refer to the supply agreement dated 3 March 2025 between us (the "Agreement"). Capitalised terms used in this letter have the meaning given to them in the Agreement.

The Supplier may deliver to the Customer's Leeds depot until 30 September 2025.`,
    parties: [],
    earlier: [{ title: 'supply agreement', date: '2025-03-03', parties: [] }],
  },
  {
    id: 'uk-earlier-deed-bear-same-meaning',
    style: 'UK: deed of variation, "Words and expressions used in this Deed bear the same meaning as in the Survey Agreement dated … between X and Y"',
    text: `THIS DEED OF VARIATION is dated 14 July 2024 and made between PENHALLOW MARINE LIMITED (company number 05512345) ("Penhallow") and GRAYLING SURVEY LTD ("Grayling").

Words and expressions used in this Deed bear the same meaning as in the Survey Agreement dated 2 February 2021 between Penhallow Boatyards Limited and Grayling Survey Ltd (reference SA/2021/044).`,
    parties: [
      { name: 'PENHALLOW MARINE LIMITED', terms: ['Penhallow'] },
      { name: 'GRAYLING SURVEY LTD', terms: ['Grayling'] },
    ],
    earlier: [{ title: 'Survey Agreement', date: '2021-02-02', reference: 'SA/2021/044', parties: ['Penhallow Boatyards Limited', 'Grayling Survey Ltd'] }],
  },
  {
    id: 'eu-earlier-terms-defined-in',
    style:
      'EU translated: "Terms defined in the Framework Agreement of 12 May 2023 (reference …) have the same meaning in this Amendment Agreement", hereinafter terms',
    text: `AMENDMENT AGREEMENT No. 2

This Amendment Agreement is concluded between Vellmark Antriebstechnik GmbH (hereinafter the "Supplier") and Brisemont Énergie SAS (hereinafter the "Client").

Terms defined in the Framework Agreement of 12 May 2023 (reference RV-2023-12) have the same meaning in this Amendment Agreement.`,
    parties: [
      { name: 'Vellmark Antriebstechnik GmbH', terms: ['Supplier'] },
      { name: 'Brisemont Énergie SAS', terms: ['Client'] },
    ],
    earlier: [{ title: 'Framework Agreement', date: '2023-05-12', reference: 'RV-2023-12', parties: [] }],
  },
  {
    id: 'eu-earlier-cooperation-defined-therein',
    style:
      'EU translated: "With reference to the Cooperation Agreement concluded on … between X and Y (the "Cooperation Agreement")"; "shall have the meaning given to them in the Cooperation Agreement"',
    text: `Supplementary Letter

With reference to the Cooperation Agreement concluded on 4 April 2022 between Hollerbach Sensorik GmbH and Ostrelle Distribution SARL (the "Cooperation Agreement"), we confirm the following. The capitalised terms used in this letter shall have the meaning given to them in the Cooperation Agreement, of which this letter forms an integral part.`,
    parties: [],
    earlier: [{ title: 'Cooperation Agreement', date: '2022-04-04', parties: ['Hollerbach Sensorik GmbH', 'Ostrelle Distribution SARL'] }],
  },
];

export const EARLIER_SHAPES_OF: Readonly<Record<string, readonly string[]>> = {
  'us-earlier-amendment-meanings-ascribed': ['reference', 'named-parties'],
  'us-earlier-letter-as-defined-in': ['reference', 'defined'],
  'uk-earlier-side-letter-between-us': ['defined'],
  'uk-earlier-deed-bear-same-meaning': ['reference', 'named-parties'],
  'eu-earlier-terms-defined-in': ['reference'],
  'eu-earlier-cooperation-defined-therein': ['defined', 'named-parties'],
};
