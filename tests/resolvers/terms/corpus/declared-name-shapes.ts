/**
 * Issue 16 item 8 in the corpus: former names and other names a contract declares for a party ("formerly known as",
 * "f/k/a", "previously", "trading as", "t/a", "doing business as", and the same declaration in translated
 * continental contracts: "vormals", "anciennement dénommée"), and a later mention of such a name in the same contract,
 * which must resolve to that party. Every passage, company, address and number is invented; the drafting shapes are
 * the conventions of British, US and translated continental contracts (common practice). DECLARED_SHAPES_OF names the
 * shapes each passage shows, so that the test can count three per shape.
 */
import type { CorpusCase } from './contracts.ts';

export const DECLARED_NAME_SHAPES: CorpusCase[] = [
  {
    id: 'uk-declared-formerly-trading-as',
    style: 'UK: numbered parties, "(formerly X)" in parentheses after the name, "t/a" trade name, company numbers',
    text: `THIS AGREEMENT is dated 3 March 2025

PARTIES
(1) Tollaby Logistics Limited (formerly Tollaby Cold Storage Ltd), a company incorporated in England and Wales with company number 04417731 whose registered office is at 2 Wharf Street, Hull HU1 2AA (the "Customer"); and
(2) Keston Dairy Ltd t/a Keston Creamery, a company incorporated in England and Wales with company number 05120877 (the "Supplier").

1. The Supplier shall deliver the Goods to the Customer's depot, which Tollaby Cold Storage Ltd operated before the change of name.
2. Invoices addressed to Keston Creamery are invoices of the Supplier.`,
    parties: [
      {
        name: 'Tollaby Logistics Limited',
        terms: ['Customer'],
        role: 'Customer',
        jurisdiction: 'GB',
        identifiers: [{ scheme: 'gb_company', value: '04417731' }],
        aliases: [{ kind: 'former', name: 'Tollaby Cold Storage Ltd' }],
      },
      { name: 'Keston Dairy Ltd', terms: ['Supplier'], role: 'Supplier', aliases: [{ kind: 'trade', name: 'Keston Creamery' }] },
    ],
    resolves: [
      { mention: 'Tollaby Cold Storage Ltd', party: 'Tollaby Logistics Limited', alias: 'former' },
      { mention: 'TOLLABY COLD STORAGE LIMITED', party: 'Tollaby Logistics Limited', alias: 'former' },
      { mention: 'Keston Creamery', party: 'Keston Dairy Ltd', alias: 'trade' },
    ],
  },
  {
    id: 'uk-declared-formerly-known-as-recital',
    style: 'UK: "BETWEEN:" block in capitals, "(formerly known as X)" followed by a registration parenthesis, short-name terms',
    text: `THIS DEED OF VARIATION is made on 14 July 2024

BETWEEN:

PENHALLOW MARINE LIMITED (formerly known as Penhallow Boatyards Limited) (company number 05512345) ("Penhallow"); and

GRAYLING SURVEY LTD, trading as Grayling Hydrographics, a company incorporated in Scotland ("Grayling").

WHEREAS Penhallow Boatyards Limited entered into the Survey Agreement with Grayling on 2 February 2021.`,
    parties: [
      { name: 'PENHALLOW MARINE LIMITED', terms: ['Penhallow'], aliases: [{ kind: 'former', name: 'Penhallow Boatyards Limited' }] },
      { name: 'GRAYLING SURVEY LTD', terms: ['Grayling'], aliases: [{ kind: 'trade', name: 'Grayling Hydrographics' }] },
    ],
    resolves: [
      { mention: 'Penhallow Boatyards Limited', party: 'PENHALLOW MARINE LIMITED', alias: 'former' },
      { mention: 'Grayling Hydrographics', party: 'GRAYLING SURVEY LTD', alias: 'trade' },
    ],
  },
  {
    id: 'us-declared-fka-dba',
    style: 'US: "by and between X, f/k/a Y, a Delaware corporation", "Z LLC, doing business as W", quoted short terms',
    text: `This Master Services Agreement (this "Agreement") is entered into as of June 1, 2024 by and between Harrowgate Analytics, Inc., f/k/a Harrowgate Data Corp., a Delaware corporation ("Harrowgate"), and Quillon Freight LLC, doing business as QuickQuill Shipping, a Texas limited liability company ("Carrier").

Carrier shall invoice Harrowgate monthly. Purchase orders issued in the name of Harrowgate Data Corp. before the Effective Date remain valid.`,
    parties: [
      { name: 'Harrowgate Analytics, Inc.', terms: ['Harrowgate'], jurisdiction: 'US-DE', aliases: [{ kind: 'former', name: 'Harrowgate Data Corp.' }] },
      { name: 'Quillon Freight LLC', terms: ['Carrier'], role: 'Carrier', jurisdiction: 'US-TX', aliases: [{ kind: 'trade', name: 'QuickQuill Shipping' }] },
    ],
    resolves: [
      { mention: 'Harrowgate Data Corp.', party: 'Harrowgate Analytics, Inc.', alias: 'former' },
      { mention: 'Harrowgate Data Corp', party: 'Harrowgate Analytics, Inc.', alias: 'former' },
      { mention: 'QuickQuill Shipping', party: 'Quillon Freight LLC', alias: 'trade' },
    ],
  },
  {
    id: 'us-declared-previously-dba-compact',
    style: 'US: recital style "among X (previously known as Y), a New York corporation" and "d/b/a" written compactly',
    text: `This Equipment Lease is made and entered into this 9th day of January, 2025, by and among Marlowe Pumps Corporation (previously known as Marlowe Irrigation Corporation), a New York corporation (the "Lessor"), and Dana Whitcombe d/b/a Whitcombe Orchards, an individual residing in Ulster County, New York (the "Lessee").`,
    parties: [
      {
        name: 'Marlowe Pumps Corporation',
        terms: ['Lessor'],
        role: 'Lessor',
        jurisdiction: 'US-NY',
        aliases: [{ kind: 'former', name: 'Marlowe Irrigation Corporation' }],
      },
      { name: 'Dana Whitcombe', terms: ['Lessee'], role: 'Lessee', kind: 'person', aliases: [{ kind: 'trade', name: 'Whitcombe Orchards' }] },
    ],
    resolves: [
      { mention: 'Marlowe Irrigation Corporation', party: 'Marlowe Pumps Corporation', alias: 'former' },
      { mention: 'Marlowe Irrigation Corp.', party: 'Marlowe Pumps Corporation', alias: 'former' },
      { mention: 'Whitcombe Orchards', party: 'Dana Whitcombe', alias: 'trade' },
    ],
  },
  {
    id: 'eu-declared-previously-trading-as',
    style: 'EU in English (German/French drafting): "concluded between", "(previously X)", "trading as", "hereinafter the"',
    text: `This Framework Agreement is concluded between

Vellmark Antriebstechnik GmbH (previously Vellmark Motoren GmbH), with registered office in Stuttgart, registered in the commercial register of the local court of Stuttgart under HRB 765432 (hereinafter the "Supplier"),

and

Brisemont Énergie SAS, trading as Brisemont Solaire, with registered office in Lyon (hereinafter the "Client").`,
    parties: [
      { name: 'Vellmark Antriebstechnik GmbH', terms: ['Supplier'], role: 'Supplier', aliases: [{ kind: 'former', name: 'Vellmark Motoren GmbH' }] },
      { name: 'Brisemont Énergie SAS', terms: ['Client'], role: 'Client', aliases: [{ kind: 'trade', name: 'Brisemont Solaire' }] },
    ],
    resolves: [
      { mention: 'Vellmark Motoren GmbH', party: 'Vellmark Antriebstechnik GmbH', alias: 'former' },
      { mention: 'Brisemont Solaire', party: 'Brisemont Énergie SAS', alias: 'trade' },
    ],
  },
  {
    id: 'eu-declared-vormals-anciennement',
    style: 'EU translated: the original-language declarations kept in the English text, "(vormals X)" and "(anciennement dénommée X)", "t/a"',
    text: `This Distribution Agreement is entered into between

Hollerbach Sensorik GmbH (vormals Hollerbach Messgeräte GmbH), represented by its managing director (hereinafter the "Manufacturer"),

and

Ostrelle Distribution SARL (anciennement dénommée Ostrelle Import SARL), t/a Ostrelle Pro, represented by its gérant (hereinafter the "Distributor").`,
    parties: [
      { name: 'Hollerbach Sensorik GmbH', terms: ['Manufacturer'], role: 'Manufacturer', aliases: [{ kind: 'former', name: 'Hollerbach Messgeräte GmbH' }] },
      {
        name: 'Ostrelle Distribution SARL',
        terms: ['Distributor'],
        role: 'Distributor',
        aliases: [
          { kind: 'former', name: 'Ostrelle Import SARL' },
          { kind: 'trade', name: 'Ostrelle Pro' },
        ],
      },
    ],
    resolves: [
      { mention: 'Hollerbach Messgeräte GmbH', party: 'Hollerbach Sensorik GmbH', alias: 'former' },
      { mention: 'Ostrelle Import S.A.R.L.', party: 'Ostrelle Distribution SARL', alias: 'former' },
      { mention: 'Ostrelle Pro', party: 'Ostrelle Distribution SARL', alias: 'trade' },
    ],
  },
];

export const DECLARED_SHAPES_OF: Readonly<Record<string, readonly string[]>> = {
  'uk-declared-formerly-trading-as': ['former', 'trade'],
  'uk-declared-formerly-known-as-recital': ['former', 'trade'],
  'us-declared-fka-dba': ['former', 'trade'],
  'us-declared-previously-dba-compact': ['former', 'trade'],
  'eu-declared-previously-trading-as': ['former', 'trade'],
  'eu-declared-vormals-anciennement': ['former', 'trade'],
};
