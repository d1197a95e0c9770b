/**
 * Corpus of invented contract preambles, parties clauses, recitals and signature blocks, one drafting style each.
 * Every company, person, address and number here is invented for these tests; no real contract text is copied.
 * Expected values are what a careful reader of each passage would write down (the drafting conventions are
 * common practice). Identifier values are given in the canonical form of resolvers/identifiers; numbers with
 * check digits were made valid with that module's own check-digit functions, except two examples the issue
 * itself quotes ("RCS Nantes 533 214 907", "organisation number 559912-3381"), which fail their Luhn check
 * and so come back as written with a `problem`.
 */
import type { AliasKind, EntityKind, IdentifierScheme, RelationType } from '../../../../resolvers/vocabulary.ts';

export interface ExpectedParty {
  name: string;
  terms: string[];
  /** Checked when present: the party is one of the case's ownEntities. */
  ownEntity?: boolean;
  /** Checked when present (null = no role). */
  role?: string | null;
  jurisdiction?: string;
  /** Each must be among the party's identifiers. */
  identifiers?: { scheme: IdentifierScheme; value: string; problem?: true }[];
  aliases?: { kind: AliasKind; name: string }[];
  related?: { relation: RelationType; name: string }[];
  kind?: EntityKind;
  /** Substring the extracted address must contain. */
  address?: string;
}

export interface CorpusCase {
  id: string;
  /** Region and drafting style, for the report. */
  style: string;
  text: string;
  /** Exactly these parties, in this order. */
  parties: ExpectedParty[];
  /** Exactly these collective terms, with the names of the parties they cover. */
  collective?: { term: string; parties: string[] }[];
  /** Each must be in notParties and must not be a party name or a bound term. */
  notParties?: string[];
  /** Each must be among the signers, with this title, capacity and party when given; a title is never a non-party. */
  signers?: { name: string; title?: string; capacity?: 'signatory' | 'witness' | 'notary'; signsFor?: string }[];
  /** Exactly these entities are named but expressly not parties (absent: none). */
  mentioned?: string[];
  /** Mentions that resolveInContract must resolve to `party` through the other name the contract declares for it. */
  resolves?: { mention: string; party: string; alias: AliasKind }[];
  /** The organisation's own legal entities, passed to parseParties (issue 16 item 6). */
  ownEntities?: string[];
  /** Exactly these earlier agreements whose defined terms the text says it uses (absent: none). */
  earlier?: { title?: string; date?: string; reference?: string; parties: string[] }[];
}

export const CORPUS: CorpusCase[] = [
  {
    id: 'us-license-classic',
    style: 'US: (the "X") and ("X"), Delaware corporation, outside-paren collective, signature block with label',
    text: `This Software License Agreement (this "Agreement") is entered into as of March 1, 2024 (the "Effective Date") by and between Brackenridge Fabrication, Inc., a Delaware corporation with its principal place of business at 100 Foundry Road, Wilmington, DE 19801 ("Licensor"), and Pellinore Widgets Ltd, a company incorporated and registered in England and Wales with company number 04417782 whose registered office is at 4 Quarry Lane, Leeds LS1 4AB (the "Licensee"). Licensor and Licensee are each a "Party" and together the "Parties".

IN WITNESS WHEREOF, the Parties have executed this Agreement as of the Effective Date.

LICENSOR:
BRACKENRIDGE FABRICATION, INC.

By: ______________________
Name: Jane Harlow
Title: Chief Executive Officer`,
    parties: [
      {
        name: 'Brackenridge Fabrication, Inc.',
        terms: ['Licensor'],
        role: 'Licensor',
        jurisdiction: 'US-DE',
        address: '100 Foundry Road',
        kind: 'organisation',
      },
      {
        name: 'Pellinore Widgets Ltd',
        terms: ['Licensee'],
        role: 'Licensee',
        jurisdiction: 'GB',
        identifiers: [{ scheme: 'gb_company', value: '04417782' }],
        address: '4 Quarry Lane, Leeds LS1 4AB',
      },
    ],
    collective: [
      { term: 'Party', parties: ['Brackenridge Fabrication, Inc.', 'Pellinore Widgets Ltd'] },
      { term: 'Parties', parties: ['Brackenridge Fabrication, Inc.', 'Pellinore Widgets Ltd'] },
    ],
    notParties: ['Agreement', 'Effective Date', 'Jane Harlow'],
    signers: [{ name: 'Jane Harlow', title: 'Chief Executive Officer', capacity: 'signatory', signsFor: 'BRACKENRIDGE FABRICATION, INC.' }],
  },
  {
    id: 'us-two-terms-affiliates',
    style: 'US: two terms for one party ("TMG" or the "Reseller"); together with its Affiliates',
    text: `This Master Reseller Agreement is made as of June 3, 2024 between Tamarack Media Group, Inc., a California corporation ("TMG" or the "Reseller"), and Osprey Data Systems LLC, a Texas limited liability company (together with its Affiliates, "Osprey").`,
    parties: [
      { name: 'Tamarack Media Group, Inc.', terms: ['TMG', 'Reseller'], role: 'Reseller', jurisdiction: 'US-CA' },
      { name: 'Osprey Data Systems LLC', terms: ['Osprey'], role: null, jurisdiction: 'US-TX' },
    ],
    notParties: [],
  },
  {
    id: 'us-defined-pronouns',
    style: 'US online terms: defined pronouns ("Larkspur", "we", "us" or "our"); "you" is no named party',
    text: `These Terms of Service (these "Terms") form an agreement between Larkspur Analytics, Inc., a New York corporation ("Larkspur", "we", "us" or "our"), and you, the customer identified in the Order Form ("Customer", "you" or "your").`,
    parties: [{ name: 'Larkspur Analytics, Inc.', terms: ['Larkspur', 'we', 'us', 'our'], role: null, jurisdiction: 'US-NY' }],
    notParties: ['Terms', 'Customer'],
  },
  {
    id: 'us-hereinafter-referred-outside',
    style: 'US: hereinafter referred to as the "X" outside parentheses',
    text: `THIS PURCHASE AGREEMENT is made this 5th day of May, 2024, by and between Copperwick Orchards LLC, an Oregon limited liability company, hereinafter referred to as the "Seller", and Greywater Provisions Corp., a Washington corporation, hereinafter referred to as the "Buyer".`,
    parties: [
      { name: 'Copperwick Orchards LLC', terms: ['Seller'], role: 'Seller', jurisdiction: 'US-OR' },
      { name: 'Greywater Provisions Corp.', terms: ['Buyer'], role: 'Buyer', jurisdiction: 'US-WA' },
    ],
  },
  {
    id: 'us-signature-blocks-only',
    style: 'US: signature blocks only; signers and titles are not parties',
    text: `IN WITNESS WHEREOF, the parties hereto have caused this Agreement to be executed by their duly authorized officers.

QUILLFEATHER SOFTWARE, INC.

By: /s/ Marta Ekholm
Name: Marta Ekholm
Title: President

HALVERSON MARINE SUPPLY CO.

By: ______________________
Name: Darnell Price
Title: Vice President, Operations`,
    parties: [
      { name: 'QUILLFEATHER SOFTWARE, INC.', terms: [], role: null },
      { name: 'HALVERSON MARINE SUPPLY CO.', terms: [], role: null },
    ],
    notParties: ['Marta Ekholm', 'Darnell Price'],
    signers: [
      { name: 'Marta Ekholm', title: 'President', signsFor: 'QUILLFEATHER SOFTWARE, INC.' },
      { name: 'Darnell Price', title: 'Vice President, Operations', signsFor: 'HALVERSON MARINE SUPPLY CO.' },
    ],
  },
  {
    id: 'us-dba-ein-individual',
    style: 'US: d/b/a trade name, EIN in parentheses, an individual party',
    text: `This Consulting Agreement (the "Agreement") is entered into by and between Sunbury Logistics, Inc. d/b/a Sunbury Freight, a Georgia corporation (EIN 58-1234567) (the "Company"), and Rowan Ellery, an individual residing at 12 Birch Court, Athens, GA 30601 (the "Consultant").`,
    parties: [
      {
        name: 'Sunbury Logistics, Inc.',
        terms: ['Company'],
        role: 'Company',
        jurisdiction: 'US-GA',
        identifiers: [{ scheme: 'us_ein', value: '58-1234567' }],
        aliases: [{ kind: 'trade', name: 'Sunbury Freight' }],
      },
      { name: 'Rowan Ellery', terms: ['Consultant'], role: 'Consultant', kind: 'person', address: '12 Birch Court' },
    ],
    notParties: ['Agreement'],
  },
  {
    id: 'us-credit-roman-list',
    style: 'US credit agreement: (i)/(ii)/(iii) list, unnamed lenders as a collective term, "in such capacity"',
    text: `This Credit Agreement dated as of July 1, 2024 is among (i) Fenwick Harbor Holdings, L.P., a Delaware limited partnership (the "Borrower"), (ii) the lenders from time to time party hereto (each a "Lender" and collectively the "Lenders"), and (iii) Marlsteed Trust Company, as administrative agent (in such capacity, the "Administrative Agent").`,
    parties: [
      { name: 'Fenwick Harbor Holdings, L.P.', terms: ['Borrower'], role: 'Borrower', jurisdiction: 'US-DE' },
      { name: 'Marlsteed Trust Company', terms: ['Administrative Agent'], role: 'Administrative Agent' },
    ],
    collective: [
      { term: 'Lender', parties: [] },
      { term: 'Lenders', parties: [] },
    ],
  },
  {
    id: 'us-funds-collective',
    style: 'US fund documents: named parties with no own term, each a "Fund"',
    text: `This Subscription Agreement is entered into by and among Alder Growth Fund LP, Alder Income Fund LP and Alder Credit Fund LP (each a "Fund" and together the "Funds"), and Meridane Capital Management LLC, a Delaware limited liability company (the "Manager").`,
    parties: [
      { name: 'Alder Growth Fund LP', terms: [] },
      { name: 'Alder Income Fund LP', terms: [] },
      { name: 'Alder Credit Fund LP', terms: [] },
      { name: 'Meridane Capital Management LLC', terms: ['Manager'], role: 'Manager', jurisdiction: 'US-DE' },
    ],
    collective: [
      { term: 'Fund', parties: ['Alder Growth Fund LP', 'Alder Income Fund LP', 'Alder Credit Fund LP'] },
      { term: 'Funds', parties: ['Alder Growth Fund LP', 'Alder Income Fund LP', 'Alder Credit Fund LP'] },
    ],
  },
  {
    id: 'us-mixed-paren',
    style: 'US: one parenthesis with a party term and a collective term',
    text: `This Supply Agreement is made between Brightwater Tools Corp., a Nevada corporation (the "Distributor"), and Kestrel Outdoor Goods, Inc., a Colorado corporation (the "Supplier" and, together with the Distributor, the "Parties").`,
    parties: [
      { name: 'Brightwater Tools Corp.', terms: ['Distributor'], role: 'Distributor', jurisdiction: 'US-NV' },
      { name: 'Kestrel Outdoor Goods, Inc.', terms: ['Supplier'], role: 'Supplier', jurisdiction: 'US-CO' },
    ],
    collective: [{ term: 'Parties', parties: ['Brightwater Tools Corp.', 'Kestrel Outdoor Goods, Inc.'] }],
  },
  {
    id: 'us-curly-quotes',
    style: 'US: curly double quotes without article',
    text: `This Bakery Supply Agreement is entered into by and between Junivale Row Bakeries, Inc., an Illinois corporation (“Buyer”), and Thistle & Vine Farms LLC, a Wisconsin limited liability company (“Seller”).`,
    parties: [
      { name: 'Junivale Row Bakeries, Inc.', terms: ['Buyer'], role: 'Buyer', jurisdiction: 'US-IL' },
      { name: 'Thistle & Vine Farms LLC', terms: ['Seller'], role: 'Seller', jurisdiction: 'US-WI' },
    ],
  },
  {
    id: 'us-single-quotes',
    style: 'single straight quotes; second party with no descriptive phrase',
    text: `This Letter Agreement is made between Saltmarsh Robotics Inc., a Massachusetts corporation ('Saltmarsh'), and Ravensholt Ltd ('Ravensholt'). Saltmarsh's obligations are set out below.`,
    parties: [
      { name: 'Saltmarsh Robotics Inc.', terms: ['Saltmarsh'], role: null, jurisdiction: 'US-MA' },
      { name: 'Ravensholt Ltd', terms: ['Ravensholt'], role: null },
    ],
  },
  {
    id: 'us-fka-aka',
    style: 'US: formerly known as, a/k/a',
    text: `This Amendment is made by and between Harrowgate Financial Services, LLC, formerly known as Harrowgate Lending, LLC, a Delaware limited liability company ("Harrowgate"), and Pemberwick Mills Co. a/k/a Pemberwick Textile Mills, a North Carolina corporation ("Pemberwick").`,
    parties: [
      {
        name: 'Harrowgate Financial Services, LLC',
        terms: ['Harrowgate'],
        role: null,
        jurisdiction: 'US-DE',
        aliases: [{ kind: 'former', name: 'Harrowgate Lending, LLC' }],
      },
      {
        name: 'Pemberwick Mills Co.',
        terms: ['Pemberwick'],
        role: null,
        jurisdiction: 'US-NC',
        aliases: [{ kind: 'also_known_as', name: 'Pemberwick Textile Mills' }],
      },
    ],
  },
  {
    id: 'us-successor',
    style: 'US: successor in interest (a related entity, not an alias)',
    text: `This Transportation Agreement is entered into between Dunmore Freight Lines, Inc., successor in interest to Coldbrook Carriers, Inc., an Ohio corporation (the "Carrier"), and Osgood Grain Company, a Kansas corporation (the "Shipper").`,
    parties: [
      {
        name: 'Dunmore Freight Lines, Inc.',
        terms: ['Carrier'],
        role: 'Carrier',
        jurisdiction: 'US-OH',
        related: [{ relation: 'successor_of', name: 'Coldbrook Carriers, Inc.' }],
      },
      { name: 'Osgood Grain Company', terms: ['Shipper'], role: 'Shipper', jurisdiction: 'US-KS' },
    ],
  },
  {
    id: 'us-non-party-terms',
    style: 'US distribution: Agreement, Effective Date and Territory are terms of things, not parties',
    text: `This Distribution Agreement (this "Agreement"), dated as of January 15, 2025 (the "Effective Date"), is made by and between Wexford Lumen Corp., a Delaware corporation ("Wexford"), and Brisa Maritima S.A. de C.V., a Mexican sociedad anonima de capital variable ("Distributor"), for the sale of the Products in Mexico, Guatemala and Belize (the "Territory").`,
    parties: [
      { name: 'Wexford Lumen Corp.', terms: ['Wexford'], role: null, jurisdiction: 'US-DE' },
      { name: 'Brisa Maritima S.A. de C.V.', terms: ['Distributor'], role: 'Distributor', jurisdiction: 'MX' },
    ],
    notParties: ['Agreement', 'Effective Date', 'Territory'],
  },
  {
    id: 'uk-paying-agency-lei',
    style: 'UK capital markets: descriptive phrase after the definition, registered number and LEI',
    text: `This Paying Agency Agreement is dated 2 September 2024 and made between Wrenfield Capital plc (the "Issuer"), a public limited company incorporated in England and Wales with registered number 08812345 and LEI 984500W7K2MQ3RZ8LN12, and Astley Trust Services Limited (the "Paying Agent").`,
    parties: [
      {
        name: 'Wrenfield Capital plc',
        terms: ['Issuer'],
        role: 'Issuer',
        jurisdiction: 'GB',
        identifiers: [
          { scheme: 'gb_company', value: '08812345' },
          { scheme: 'lei', value: '984500W7K2MQ3RZ8LN12' },
        ],
      },
      { name: 'Astley Trust Services Limited', terms: ['Paying Agent'], role: 'Paying Agent' },
    ],
  },
  {
    id: 'uk-numbered-parties',
    style: 'UK: PARTIES heading, (1)/(2) list in capitals, parenthesised qualifier in a name',
    text: `THIS AGREEMENT is dated 14 March 2024

PARTIES

(1) PELLINORE WIDGETS LIMITED incorporated and registered in England and Wales with company number 04417782 whose registered office is at 4 Quarry Lane, Leeds LS1 4AB (the "Supplier"); and

(2) GOLDWREN (EUROPE) LTD incorporated and registered in Scotland with company number SC512345 whose registered office is at 9 Harbour Street, Leith EH6 6QX (the "Customer").`,
    parties: [
      {
        name: 'PELLINORE WIDGETS LIMITED',
        terms: ['Supplier'],
        role: 'Supplier',
        jurisdiction: 'GB',
        identifiers: [{ scheme: 'gb_company', value: '04417782' }],
      },
      { name: 'GOLDWREN (EUROPE) LTD', terms: ['Customer'], role: 'Customer', jurisdiction: 'GB', identifiers: [{ scheme: 'gb_company', value: 'SC512345' }] },
    ],
  },
  {
    id: 'uk-between-and-colon',
    style: 'UK: BETWEEN: ... AND: blocks, "registered in England under number"',
    text: `BETWEEN:

BRANNOCK PRINT WORKS LIMITED, a company registered in England under number 09123456, of 22 Mill Street, Bristol BS1 5AA ("Brannock");

AND:

MARLOW CREDIT UNION LIMITED, a credit union registered in England and Wales, of 3 Abbey Road, Marlow SL7 1AA ("Marlow").`,
    parties: [
      { name: 'BRANNOCK PRINT WORKS LIMITED', terms: ['Brannock'], role: null, jurisdiction: 'GB', identifiers: [{ scheme: 'gb_company', value: '09123456' }] },
      { name: 'MARLOW CREDIT UNION LIMITED', terms: ['Marlow'], role: null, jurisdiction: 'GB' },
    ],
  },
  {
    id: 'uk-between-and-no-terms',
    style: 'UK: BETWEEN:/AND: with numbered parties and no defined terms at all',
    text: `DATED 9 October 2024

BETWEEN:

(1) FERNHILL COMPOSITES LIMITED, a company incorporated in England and Wales with company number 06543210; and

(2) OAKAPPLE DESIGN STUDIO LTD, a company incorporated in England and Wales with company number 07123456.

IT IS AGREED as follows:`,
    parties: [
      { name: 'FERNHILL COMPOSITES LIMITED', terms: [], role: null, jurisdiction: 'GB', identifiers: [{ scheme: 'gb_company', value: '06543210' }] },
      { name: 'OAKAPPLE DESIGN STUDIO LTD', terms: [], role: null, jurisdiction: 'GB', identifiers: [{ scheme: 'gb_company', value: '07123456' }] },
    ],
  },
  {
    id: 'uk-hereinafter-colon',
    style: 'UK: (hereinafter: "X") and (hereinafter "X")',
    text: `This Framework Agreement is made between Ashcombe Utilities plc, a public limited company incorporated in England and Wales (company number 03456789) (hereinafter: "Ashcombe"), and Tolland Metering Ltd (hereinafter "Tolland").`,
    parties: [
      { name: 'Ashcombe Utilities plc', terms: ['Ashcombe'], role: null, jurisdiction: 'GB', identifiers: [{ scheme: 'gb_company', value: '03456789' }] },
      { name: 'Tolland Metering Ltd', terms: ['Tolland'], role: null },
    ],
  },
  {
    id: 'uk-signed-on-behalf',
    style: 'UK execution blocks: signed by a director for and on behalf of',
    text: `Signed by Fiona Castleton, director,
for and on behalf of WHITCOMBE ANALYTICS LIMITED
......................................
Director

Signed by Owen Pryce, director,
for and on behalf of KEMBLE HYDRAULICS LTD
......................................
Director`,
    parties: [
      { name: 'WHITCOMBE ANALYTICS LIMITED', terms: [] },
      { name: 'KEMBLE HYDRAULICS LTD', terms: [] },
    ],
  },
  {
    id: 'uk-deed-vat',
    style: 'UK lease deed: company number and VAT number in parentheses, "of" address',
    text: `THIS DEED is made on 1 May 2024 between Penhallow Estates Limited (company number 07654321, VAT number GB 123 4567 89) of 1 Fore Street, Truro TR1 2AA ("Landlord") and Trevose Surf Hire Ltd (company number 08765432) of 5 Beach Road, Newquay TR7 1AA ("Tenant").`,
    parties: [
      {
        name: 'Penhallow Estates Limited',
        terms: ['Landlord'],
        role: 'Landlord',
        identifiers: [
          { scheme: 'gb_company', value: '07654321' },
          { scheme: 'vat', value: 'GB123456789' },
        ],
      },
      { name: 'Trevose Surf Hire Ltd', terms: ['Tenant'], role: 'Tenant', identifiers: [{ scheme: 'gb_company', value: '08765432' }] },
    ],
  },
  {
    id: 'uk-welsh-abbreviation',
    style: 'UK Welsh company (Cyf); an abbreviation term made of initials',
    text: `This Services Agreement is made between Cwmni Teithio Glanrafon Cyf, a company incorporated in Wales with company number 05432109 ("Glanrafon"), and Pontypridd Bus Services Limited ("PBS").`,
    parties: [
      { name: 'Cwmni Teithio Glanrafon Cyf', terms: ['Glanrafon'], role: null, jurisdiction: 'GB', identifiers: [{ scheme: 'gb_company', value: '05432109' }] },
      { name: 'Pontypridd Bus Services Limited', terms: ['PBS'], role: null },
    ],
  },
  {
    id: 'uk-recitals-llp',
    style: 'UK recitals (A)/(B) with the descriptive phrase after the term',
    text: `BACKGROUND

(A) Hartfield Morrow LLP ("HM") is a limited liability partnership registered in England and Wales under number OC412345.

(B) Ingleby Foods Limited ("Ingleby") wishes to appoint HM to provide legal services on the terms of this letter.`,
    parties: [
      { name: 'Hartfield Morrow LLP', terms: ['HM'], role: null, jurisdiction: 'GB', identifiers: [{ scheme: 'gb_company', value: 'OC412345' }] },
      { name: 'Ingleby Foods Limited', terms: ['Ingleby'], role: null },
    ],
  },
  {
    id: 'uk-labelled-signatures',
    style: 'UK/US signature blocks with role labels (a label binds as a term); a public body without a legal form',
    text: `SUPPLIER:
FENWICK & DALE LIMITED

By: ________________________
Name: Alistair Bexley
Title: Managing Director

CUSTOMER:
Hartwell County Council

By: ________________________
Name: Sunita Marsh
Title: Head of Procurement`,
    parties: [
      { name: 'FENWICK & DALE LIMITED', terms: ['SUPPLIER'], role: 'SUPPLIER' },
      { name: 'Hartwell County Council', terms: ['CUSTOMER'], role: 'CUSTOMER' },
    ],
    notParties: ['Alistair Bexley', 'Sunita Marsh'],
    signers: [
      { name: 'Alistair Bexley', title: 'Managing Director' },
      { name: 'Sunita Marsh', title: 'Head of Procurement' },
    ],
  },
  {
    id: 'uk-guarantor-successors',
    style: 'UK guarantee: term followed by "which expression shall include its successors"',
    text: `THIS GUARANTEE is made between Ravenglass Steel Limited, a company incorporated in England and Wales with company number 02345678 (the "Guarantor", which expression shall include its successors and permitted assigns), and Lowther Bank plc (the "Lender").`,
    parties: [
      {
        name: 'Ravenglass Steel Limited',
        terms: ['Guarantor'],
        role: 'Guarantor',
        jurisdiction: 'GB',
        identifiers: [{ scheme: 'gb_company', value: '02345678' }],
      },
      { name: 'Lowther Bank plc', terms: ['Lender'], role: 'Lender' },
    ],
  },
  {
    id: 'eu-germany-sweden-english',
    style: 'EU in English: German GmbH with Amtsgericht and HRB; Swedish AB with organisation number',
    text: `This Supply Agreement is made between Holzner Feinmechanik GmbH, a company organised under the laws of Germany, registered with the commercial register of the Amtsgericht München under HRB 20931 ("Holzner"), and Vasterby Components AB, a company incorporated under the laws of Sweden with organisation number 556410-2712 ("Vasterby").`,
    parties: [
      {
        name: 'Holzner Feinmechanik GmbH',
        terms: ['Holzner'],
        role: null,
        jurisdiction: 'DE',
        identifiers: [{ scheme: 'de_register', value: 'muenchen HRB 20931' }],
      },
      { name: 'Vasterby Components AB', terms: ['Vasterby'], role: null, jurisdiction: 'SE', identifiers: [{ scheme: 'se_org', value: '5564102712' }] },
    ],
  },
  {
    id: 'eu-france-english',
    style: 'EU in English: French SAS with RCS number',
    text: `This Services Agreement is entered into between Lumiere Atlantique SAS, a French societe par actions simplifiee registered with the RCS Nantes 533 214 904, whose registered office is at 12 quai de la Fosse, 44000 Nantes, France (the "Service Provider"), and Brightwater Tools Corp., a Nevada corporation (the "Client").`,
    parties: [
      {
        name: 'Lumiere Atlantique SAS',
        terms: ['Service Provider'],
        role: 'Service Provider',
        jurisdiction: 'FR',
        identifiers: [{ scheme: 'fr_siren', value: '533214904' }],
        address: '12 quai de la Fosse',
      },
      { name: 'Brightwater Tools Corp.', terms: ['Client'], role: 'Client', jurisdiction: 'US-NV' },
    ],
  },
  {
    id: 'eu-netherlands-undersigned',
    style: 'EU (Dutch style): The undersigned: 1./2. list, hereinafter jointly the "Parties" and each individually a "Party"',
    text: `The undersigned:

1. Kroonvelde Logistiek B.V., a private limited liability company incorporated under the laws of the Netherlands, registered with the Dutch Chamber of Commerce under number 34216590 ("Kroonvelde"); and

2. Fjordlyse Analytics AS, a company incorporated under the laws of Norway ("Fjordlyse"),

hereinafter jointly referred to as the "Parties" and each individually as a "Party",

have agreed as follows:`,
    parties: [
      { name: 'Kroonvelde Logistiek B.V.', terms: ['Kroonvelde'], role: null, jurisdiction: 'NL', identifiers: [{ scheme: 'nl_kvk', value: '34216590' }] },
      { name: 'Fjordlyse Analytics AS', terms: ['Fjordlyse'], role: null, jurisdiction: 'NO' },
    ],
    collective: [
      { term: 'Parties', parties: ['Kroonvelde Logistiek B.V.', 'Fjordlyse Analytics AS'] },
      { term: 'Party', parties: ['Kroonvelde Logistiek B.V.', 'Fjordlyse Analytics AS'] },
    ],
  },
  {
    id: 'eu-sweden-issue-example',
    style: "EU Nordic: the issue's organisation number example (fails its Luhn check: kept with a problem)",
    text: `This Agreement is entered into between Norrvik Energi AB, a company incorporated under the laws of Sweden with organisation number 559912-3381 ("Norrvik"), and Kallfors Data Oy, a company incorporated in Finland ("Kallfors").`,
    parties: [
      {
        name: 'Norrvik Energi AB',
        terms: ['Norrvik'],
        role: null,
        jurisdiction: 'SE',
        identifiers: [{ scheme: 'se_org', value: '559912-3381', problem: true }],
      },
      { name: 'Kallfors Data Oy', terms: ['Kallfors'], role: null, jurisdiction: 'FI' },
    ],
  },
  {
    id: 'eu-ireland-dac',
    style: 'EU Ireland: designated activity company, registered number',
    text: `This Agreement is made between Ballyconneely Seafoods Designated Activity Company, a company incorporated in Ireland with registered number 612345 ("BSD"), and Corrib Cold Storage Limited, a company incorporated in Ireland ("Corrib").`,
    parties: [
      { name: 'Ballyconneely Seafoods Designated Activity Company', terms: ['BSD'], role: null, jurisdiction: 'IE' },
      { name: 'Corrib Cold Storage Limited', terms: ['Corrib'], role: null, jurisdiction: 'IE' },
    ],
  },
  {
    id: 'eu-luxembourg-sarl',
    style: 'EU Luxembourg: S.à r.l. with a French form name in parentheses in the descriptive phrase',
    text: `This Facility Agreement is entered into by and between Valmoret Holdings S.à r.l., a private limited liability company (société à responsabilité limitée) incorporated under the laws of the Grand Duchy of Luxembourg (the "Borrower"), and Estuary Credit Partners LLP, a limited liability partnership registered in England and Wales (the "Lender").`,
    parties: [
      { name: 'Valmoret Holdings S.à r.l.', terms: ['Borrower'], role: 'Borrower', jurisdiction: 'LU' },
      { name: 'Estuary Credit Partners LLP', terms: ['Lender'], role: 'Lender', jurisdiction: 'GB' },
    ],
  },
  {
    id: 'eu-switzerland-ag',
    style: 'EU/CH: Swiss AG under the laws of Switzerland, paren-less "referred to as"',
    text: `This Agreement is made between Bergli Präzision AG, a stock corporation under the laws of Switzerland (referred to as "Bergli"), and Talvik Instruments GmbH, a company organised under the laws of Austria (referred to as "Talvik").`,
    parties: [
      { name: 'Bergli Präzision AG', terms: ['Bergli'], role: null, jurisdiction: 'CH' },
      { name: 'Talvik Instruments GmbH', terms: ['Talvik'], role: null, jurisdiction: 'AT' },
    ],
  },
  {
    id: 'au-acn-unquoted',
    style: 'Australian: ACN after the name, "of" address, defined terms in parentheses without quotes',
    text: `THIS AGREEMENT is made on 3 February 2025

BETWEEN

Wattle Creek Mining Pty Ltd ACN 004 085 616 of Level 5, 120 Collins Street, Melbourne VIC 3000 (Wattle Creek)

AND

Bunyip Haulage Pty Limited ACN 123 456 780 of 8 Port Road, Adelaide SA 5000 (Contractor)`,
    parties: [
      { name: 'Wattle Creek Mining Pty Ltd', terms: ['Wattle Creek'], role: null, identifiers: [{ scheme: 'au_acn', value: '004085616' }] },
      { name: 'Bunyip Haulage Pty Limited', terms: ['Contractor'], role: 'Contractor', identifiers: [{ scheme: 'au_acn', value: '123456780' }] },
    ],
  },
  {
    id: 'au-trustee-abn',
    style: 'Australian: company as trustee with ACN and ABN; state of incorporation',
    text: `This Deed is made between Billabirra Ridge Investments Pty Limited ACN 123 456 780 as trustee for the Billabirra Ridge Family Trust ABN 51 824 753 556 ("Trustee") and Kookaburra Freight Pty Ltd (ACN 004 085 616), a company incorporated in New South Wales ("Kookaburra").`,
    parties: [
      {
        name: 'Billabirra Ridge Investments Pty Limited',
        terms: ['Trustee'],
        role: 'Trustee',
        identifiers: [
          { scheme: 'au_acn', value: '123456780' },
          { scheme: 'au_abn', value: '51824753556' },
        ],
      },
      {
        name: 'Kookaburra Freight Pty Ltd',
        terms: ['Kookaburra'],
        role: null,
        jurisdiction: 'AU-NSW',
        identifiers: [{ scheme: 'au_acn', value: '004085616' }],
      },
    ],
  },
  {
    id: 'jp-kabushiki-kaisha',
    style: 'Japanese company described in English: Kabushiki Kaisha under the laws of Japan',
    text: `This Joint Development Agreement is entered into as of April 1, 2025 by and between Tsubame Seiki Kabushiki Kaisha, a corporation organized under the laws of Japan, having its principal office at 2-3-4 Nihonbashi, Chuo-ku, Tokyo ("Tsubame"), and Hollin Ridge Devices, Inc., a Delaware corporation ("Hollin Ridge").`,
    parties: [
      { name: 'Tsubame Seiki Kabushiki Kaisha', terms: ['Tsubame'], role: null, jurisdiction: 'JP', address: '2-3-4 Nihonbashi' },
      { name: 'Hollin Ridge Devices, Inc.', terms: ['Hollin Ridge'], role: null, jurisdiction: 'US-DE' },
    ],
  },
  {
    id: 'jp-co-ltd-corporate-number',
    style: 'Japanese company described in English: Co., Ltd., a Japanese corporation, corporate number',
    text: `This Purchase Agreement is made between Mizukane Denki Co., Ltd., a Japanese corporation (corporate number 4010001234567) (the "Manufacturer"), and Ferncastle Audio Limited, a company incorporated in England and Wales (the "Purchaser").`,
    parties: [
      {
        name: 'Mizukane Denki Co., Ltd.',
        terms: ['Manufacturer'],
        role: 'Manufacturer',
        jurisdiction: 'JP',
        identifiers: [{ scheme: 'other', value: '4010001234567' }],
      },
      { name: 'Ferncastle Audio Limited', terms: ['Purchaser'], role: 'Purchaser', jurisdiction: 'GB' },
    ],
  },
  {
    id: 'jp-signature-kk',
    style: 'Japanese company signature block (K.K.) with a representative director',
    text: `IN WITNESS WHEREOF, the parties have executed this Agreement in duplicate.

Tsukinose Shoji K.K.

By: ________________________
Name: Haruto Mori
Title: Representative Director`,
    parties: [{ name: 'Tsukinose Shoji K.K.', terms: [] }],
    notParties: ['Haruto Mori'],
    signers: [{ name: 'Haruto Mori', title: 'Representative Director', signsFor: 'Tsukinose Shoji K.K.' }],
  },
  {
    id: 'fr-ci-apres',
    style: "French: ENTRE LES SOUSSIGNÉS, « ci-après », RCS de ... sous le numéro (the issue's example number, fails Luhn)",
    text: `ENTRE LES SOUSSIGNÉS :

La société Lumière Atlantique SAS, société par actions simplifiée au capital de 50 000 euros, immatriculée au RCS de Nantes sous le numéro 533 214 907, dont le siège social est situé 12 quai de la Fosse, 44000 Nantes (ci-après « le Prestataire »),

ET

La société Boréal Conseil SARL, société à responsabilité limitée immatriculée au RCS de Lyon sous le numéro 412 876 302 (ci-après « le Client »),`,
    parties: [
      { name: 'Lumière Atlantique SAS', terms: ['Prestataire'], role: 'Prestataire', identifiers: [{ scheme: 'fr_siren', value: '533214907', problem: true }] },
      { name: 'Boréal Conseil SARL', terms: ['Client'], role: 'Client', identifiers: [{ scheme: 'fr_siren', value: '412876302' }] },
    ],
  },
  {
    id: 'de-im-folgenden',
    style: 'German: Zwischen ... und, „im Folgenden“ outside parentheses, Amtsgericht and HRB',
    text: `Zwischen

der Holzner Feinmechanik GmbH, Industriestraße 4, 80939 München, eingetragen im Handelsregister des Amtsgerichts München unter HRB 20931,

– im Folgenden „Auftraggeber“ –

und

der Lindqvist Software GmbH, Hafenstraße 12, 20457 Hamburg, eingetragen im Handelsregister des Amtsgerichts Hamburg unter HRB 154321,

– im Folgenden „Auftragnehmer“ –`,
    parties: [
      {
        name: 'Holzner Feinmechanik GmbH',
        terms: ['Auftraggeber'],
        role: 'Auftraggeber',
        identifiers: [{ scheme: 'de_register', value: 'muenchen HRB 20931' }],
      },
      {
        name: 'Lindqvist Software GmbH',
        terms: ['Auftragnehmer'],
        role: 'Auftragnehmer',
        identifiers: [{ scheme: 'de_register', value: 'hamburg HRB 154321' }],
      },
    ],
  },
  {
    id: 'es-en-adelante',
    style: 'Spanish: De una parte / De otra parte, (en adelante, el "X")',
    text: `De una parte, Olivarejo del Sur, S.L., con domicilio social en Calle Mayor 5, 41001 Sevilla (en adelante, el "Proveedor").

De otra parte, Bodegas Quintavel, S.A., con domicilio en Avenida de la Paz 20, 28001 Madrid (en adelante, el "Distribuidor").`,
    parties: [
      { name: 'Olivarejo del Sur, S.L.', terms: ['Proveedor'], role: 'Proveedor', address: 'Calle Mayor 5' },
      { name: 'Bodegas Quintavel, S.A.', terms: ['Distribuidor'], role: 'Distribuidor' },
    ],
  },
  {
    id: 'it-di-seguito',
    style: 'Italian: TRA ... E, (di seguito "il X"), partita IVA',
    text: `TRA

Fornaci Brenta S.p.A., con sede legale in Via Roma 10, 35100 Padova (di seguito "il Fornitore")

E

Cantina Ferravelli S.r.l., con sede in Corso Italia 8, 10121 Torino (di seguito "il Cliente")`,
    parties: [
      { name: 'Fornaci Brenta S.p.A.', terms: ['Fornitore'], role: 'Fornitore', address: 'Via Roma 10' },
      { name: 'Cantina Ferravelli S.r.l.', terms: ['Cliente'], role: 'Cliente' },
    ],
  },
  {
    id: 'us-stockholders-unnamed',
    style: 'US investment: the Company, unnamed stockholders as a collective term, a fund with L.P.',
    text: `This Investors' Rights Agreement is made by and among Cobblethorn Health Partners, Inc., a Delaware corporation (the "Company"), the stockholders listed on Schedule A (each a "Stockholder" and collectively the "Stockholders"), and Ridgevane Ventures Fund II, L.P. (the "Lead Investor").`,
    parties: [
      { name: 'Cobblethorn Health Partners, Inc.', terms: ['Company'], role: 'Company', jurisdiction: 'US-DE' },
      { name: 'Ridgevane Ventures Fund II, L.P.', terms: ['Lead Investor'], role: 'Lead Investor' },
    ],
    collective: [
      { term: 'Stockholder', parties: [] },
      { term: 'Stockholders', parties: [] },
    ],
  },
  {
    id: 'us-employment-person',
    style: 'US employment: an individual employee with no descriptive phrase',
    text: `This Employment Agreement is made between Ardent Lab Instruments, LLC, a Minnesota limited liability company (the "Employer"), and Ishani Thevarajan (the "Employee").`,
    parties: [
      { name: 'Ardent Lab Instruments, LLC', terms: ['Employer'], role: 'Employer', jurisdiction: 'US-MN' },
      { name: 'Ishani Thevarajan', terms: ['Employee'], role: 'Employee' },
    ],
  },
  {
    id: 'us-mutual-nda',
    style: 'US mutual NDA: "entered into by", each a "Disclosing Party" outside parentheses',
    text: `This Mutual Nondisclosure Agreement is entered into by Finchley Aerospace Corp. ("Finchley") and Corvid Materials, Inc. ("Corvid"), each a "Disclosing Party" and a "Receiving Party" as the case may be.`,
    parties: [
      { name: 'Finchley Aerospace Corp.', terms: ['Finchley'], role: null },
      { name: 'Corvid Materials, Inc.', terms: ['Corvid'], role: null },
    ],
    collective: [
      { term: 'Disclosing Party', parties: ['Finchley Aerospace Corp.', 'Corvid Materials, Inc.'] },
      { term: 'Receiving Party', parties: ['Finchley Aerospace Corp.', 'Corvid Materials, Inc.'] },
    ],
  },
  {
    id: 'us-whereas-recital-territory',
    style: 'US recitals: a party defined in a WHEREAS clause; a country defined as Territory is not a party',
    text: `WHEREAS, Greenhollow Seeds Inc., a Vermont corporation ("Greenhollow"), develops specialty seed varieties; and

WHEREAS, Greenhollow wishes to appoint a distributor for Canada (the "Territory"); and

WHEREAS, Northfield Agri Supply Ltd., a company incorporated under the laws of Canada ("Northfield"), wishes to act as such distributor.`,
    parties: [
      { name: 'Greenhollow Seeds Inc.', terms: ['Greenhollow'], role: null, jurisdiction: 'US-VT' },
      { name: 'Northfield Agri Supply Ltd.', terms: ['Northfield'], role: null, jurisdiction: 'CA' },
    ],
    notParties: ['Territory'],
  },
  {
    id: 'uk-hard-wrapped',
    style:
      'UK plain text hard-wrapped at 70 columns: names broken across lines, (hereinafter referred to as the "X") inside parentheses, party and collective term in one parenthesis',
    text: `THIS AGREEMENT is made on 4 June 2024 by and between Greystoke
Harbour Services Limited, a company incorporated in England and Wales
(hereinafter referred to as the "Operator"), and Ilfracombe Marine
Holdings plc (the "Owner"; and together with the Operator, the "Parties").

1. DEFINITIONS
"Business Day" means a day other than a Saturday.
The Operator shall provide the services to the Owner (the "Services").`,
    parties: [
      { name: 'Greystoke Harbour Services Limited', terms: ['Operator'], role: 'Operator', jurisdiction: 'GB' },
      { name: 'Ilfracombe Marine Holdings plc', terms: ['Owner'], role: 'Owner' },
    ],
    collective: [{ term: 'Parties', parties: ['Greystoke Harbour Services Limited', 'Ilfracombe Marine Holdings plc'] }],
    notParties: ['Services'],
  },
  {
    id: 'asia-party-a-b',
    style: 'English-language contract in the Asian "Party A (Seller):" label style, with address lines',
    text: `SALES CONTRACT

Contract No.: QX-2024-118

Party A (Seller): Qingxi Mountain Tea Co., Ltd.
Address: 8 Tea Garden Road, Qingxi, China

Party B (Buyer): Harrowby Fine Foods Limited
Address: 14 Market Place, York YO1 8AA, United Kingdom

Notices: Harrowby Fine Foods Limited, attention of the company secretary.`,
    parties: [
      { name: 'Qingxi Mountain Tea Co., Ltd.', terms: ['Seller', 'Party A'], role: 'Seller' },
      { name: 'Harrowby Fine Foods Limited', terms: ['Buyer', 'Party B'], role: 'Buyer' },
    ],
  },
  {
    id: 'us-signature-descriptive-line',
    style: 'US signature block: label line, entity line, descriptive line, By:/Name:/Its:',
    text: `IN WITNESS WHEREOF, the parties have executed this Agreement as of the date first above written.

LICENSEE:

NORTHWIND ORCHARD SUPPLY, LLC,
a Michigan limited liability company

By: ______________________
Name: Colette Ambrose
Its: Manager`,
    parties: [{ name: 'NORTHWIND ORCHARD SUPPLY, LLC', terms: ['LICENSEE'], role: 'LICENSEE', jurisdiction: 'US-MI' }],
    notParties: ['Colette Ambrose'],
    signers: [{ name: 'Colette Ambrose', title: 'Manager' }],
  },
  {
    id: 'us-commas-inside-quotes',
    style: 'US: commas inside curly quotes (“Orchard,” “we,” or “us”), company number in parentheses, "hereinafter called", collective in parentheses',
    text: `This Services Agreement is entered into on May 2, 2024 by and among Orchard Lane Capital, Inc. (“Orchard,” “we,” or “us”), Tidewhistle Analytics LLC (Company No. 12345678) ("Tidewhistle") and Quillon Systems GmbH, hereinafter called the “Contractor” (hereinafter collectively referred to as the "Parties" and individually as a "Party").`,
    parties: [
      { name: 'Orchard Lane Capital, Inc.', terms: ['Orchard', 'we', 'us'], role: null },
      { name: 'Tidewhistle Analytics LLC', terms: ['Tidewhistle'], role: null, identifiers: [{ scheme: 'gb_company', value: '12345678' }] },
      { name: 'Quillon Systems GmbH', terms: ['Contractor'], role: 'Contractor' },
    ],
    collective: [
      { term: 'Parties', parties: ['Orchard Lane Capital, Inc.', 'Tidewhistle Analytics LLC', 'Quillon Systems GmbH'] },
      { term: 'Party', parties: ['Orchard Lane Capital, Inc.', 'Tidewhistle Analytics LLC', 'Quillon Systems GmbH'] },
    ],
  },
  {
    id: 'fr-ci-apres-denommee',
    style: 'French: Entre : / Et :, « Ci-après dénommée » on its own line, D\'une part / D\'autre part, a private individual with "Monsieur"',
    text: `CONTRAT DE PRESTATION DE SERVICES

Entre :

Atelier Verdier SARL, au capital de 8 000 euros, dont le siège social est situé 3 rue des Tanneurs, 69002 Lyon, immatriculée au RCS de Lyon sous le numéro 412 876 302, représentée par Mme Claire Verdier, gérante,

Ci-après dénommée « le Prestataire »,

D'une part,

Et :

Monsieur Julien Marchetti, demeurant 12 avenue Vermandel, 75016 Paris,

Ci-après dénommé « le Client »,

D'autre part.`,
    parties: [
      {
        name: 'Atelier Verdier SARL',
        terms: ['Prestataire'],
        role: 'Prestataire',
        identifiers: [{ scheme: 'fr_siren', value: '412876302' }],
        address: '3 rue des Tanneurs',
      },
      { name: 'Julien Marchetti', terms: ['Client'], role: 'Client', kind: 'person' },
    ],
    notParties: [],
  },
  {
    id: 'uk-executed-as-deed',
    style: 'UK deed execution: "EXECUTED as a deed by X acting by a director in the presence of a witness"',
    text: `EXECUTED as a deed by ROSEWELL PROPERTY LIMITED acting by a director in the presence of a witness

Director ........................

Witness name: Tom Ebbsfleet
Witness address: 2 Canal Walk, Leicester LE1 1AA`,
    parties: [{ name: 'ROSEWELL PROPERTY LIMITED', terms: [] }],
  },
  {
    id: 'uk-made-between-colon-list',
    style: 'UK: "This Agreement is made on … between:" then (1)/(2) items without defined terms, then RECITALS',
    text: `This Agreement is made on 1 July 2024 between:

(1) Caldermoor Seeds Limited, a company incorporated in Scotland with company number SC601234, of 7 Mill Lane, Perth PH1 5AA; and

(2) Bexley Greenhouses LLP, a limited liability partnership registered in England and Wales under number OC398765.

RECITALS

(A) The parties wish to cooperate (the "Project").`,
    parties: [
      { name: 'Caldermoor Seeds Limited', terms: [], jurisdiction: 'GB', identifiers: [{ scheme: 'gb_company', value: 'SC601234' }] },
      { name: 'Bexley Greenhouses LLP', terms: [], jurisdiction: 'GB', identifiers: [{ scheme: 'gb_company', value: 'OC398765' }] },
    ],
    notParties: ['Project'],
  },
];
