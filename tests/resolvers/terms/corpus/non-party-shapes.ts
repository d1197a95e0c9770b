/**
 * Issue 16 items 1–3: passages where places, the document and its parts, and unbound roles stand where a party
 * could, three per shape, in British, US and translated (continental European drafting put into English) styles.
 * Every company, person, address and number is invented; no real contract text is copied. What a careful reader
 * writes down for each passage (the drafting conventions) is common practice.
 */
import type { CorpusCase } from './contracts.ts';

export const NON_PARTY_SHAPES: CorpusCase[] = [
  // Places and jurisdictions.
  {
    id: 'uk-places-governing-law',
    style: 'UK: governing law and courts of England and Wales; a party incorporated in Scotland',
    text: `THIS AGREEMENT is dated 14 March 2025 and is made BETWEEN:

(1) Quenby Harrowgate Limited, a company incorporated in Scotland with company number SC612345 ("Quenby"); and
(2) Tamsley Orchard Supplies Ltd, a company incorporated in England and Wales with company number 10293847 (the "Supplier").

19. This Agreement and any dispute arising out of it shall be governed by the laws of England and Wales, and the courts of England and Wales shall have exclusive jurisdiction.`,
    parties: [
      { name: 'Quenby Harrowgate Limited', terms: ['Quenby'], role: null, jurisdiction: 'GB' },
      { name: 'Tamsley Orchard Supplies Ltd', terms: ['Supplier'], role: 'Supplier', jurisdiction: 'GB' },
    ],
    notParties: ['England and Wales'],
  },
  {
    id: 'us-places-state-venue',
    style: 'US: governed by the laws of the State of New York; venue in the courts of the Commonwealth of Massachusetts',
    text: `This Supply Agreement (this "Agreement") is entered into as of April 2, 2025 by and between Corlett Brandywine Foods, Inc., a Delaware corporation ("Buyer"), and Ashgrove Pellman LLC, a Massachusetts limited liability company ("Seller").

Section 14.2 Governing Law; Venue. This Agreement shall be governed by and construed in accordance with the laws of the State of New York, without regard to its conflict of laws principles. Any action shall be brought in the courts of the Commonwealth of Massachusetts.`,
    parties: [
      { name: 'Corlett Brandywine Foods, Inc.', terms: ['Buyer'], role: 'Buyer', jurisdiction: 'US-DE' },
      { name: 'Ashgrove Pellman LLC', terms: ['Seller'], role: 'Seller', jurisdiction: 'US-MA' },
    ],
    notParties: ['Agreement', 'the State of New York', 'the Commonwealth of Massachusetts'],
  },
  {
    id: 'eu-places-translated-law',
    style: 'translated (Dutch drafting in English): the law of the Netherlands; the competent court of Noord-Holland',
    text: `The undersigned:

1. Vennekamp Logistiek B.V., a private company with limited liability under Dutch law, having its registered office in Haarlem, hereinafter referred to as "Vennekamp";

2. Oostwoud Koeltechniek B.V., a private company with limited liability under Dutch law, having its registered office in Zaandam, hereinafter referred to as "Oostwoud";

Article 11. This agreement is subject to the laws of the Netherlands. Disputes shall be submitted to the courts of Noord-Holland.`,
    parties: [
      { name: 'Vennekamp Logistiek B.V.', terms: ['Vennekamp'], role: null },
      { name: 'Oostwoud Koeltechniek B.V.', terms: ['Oostwoud'], role: null },
    ],
    notParties: ['the Netherlands', 'Noord-Holland'],
  },
  // The document and its parts.
  {
    id: 'uk-document-parts',
    style: 'UK: the Contract, the Commencement Date, the Services in Schedule 2, the Territory',
    text: `THIS CONTRACT (the "Contract") is made on 1 June 2025 BETWEEN Hollinbrook Print Works Limited (company number 08811223) whose registered office is at 12 Tanner Row, York YO1 6JB (the "Customer") AND Pevensey Lane Couriers Ltd (company number 07766554) whose registered office is at 3 Mill Yard, Hull HU1 2AA (the "Provider").

The Provider shall perform the services set out in Schedule 2 (the "Services") from 1 July 2025 (the "Commencement Date") throughout the United Kingdom (the "Territory").`,
    parties: [
      { name: 'Hollinbrook Print Works Limited', terms: ['Customer'], role: 'Customer' },
      { name: 'Pevensey Lane Couriers Ltd', terms: ['Provider'], role: 'Provider' },
    ],
    notParties: ['Contract', 'Services', 'Commencement Date', 'Territory'],
  },
  {
    id: 'us-document-order-form',
    style: 'US: this Agreement, the Order Form, Exhibit A, the Effective Date',
    text: `This Subscription Agreement (this "Agreement"), together with each order form executed hereunder (each, an "Order Form"), is entered into as of May 19, 2025 (the "Effective Date") by and between Wexcombe Signal Systems, Inc., a California corporation ("Wexcombe"), and Delancey Rue Partners LLC, an Illinois limited liability company ("Subscriber"). The fees are set out in Exhibit A (the "Fees").`,
    parties: [
      { name: 'Wexcombe Signal Systems, Inc.', terms: ['Wexcombe'], role: null, jurisdiction: 'US-CA' },
      { name: 'Delancey Rue Partners LLC', terms: ['Subscriber'], role: 'Subscriber', jurisdiction: 'US-IL' },
    ],
    notParties: ['Agreement', 'Order Form', 'Effective Date', 'Fees'],
  },
  {
    id: 'eu-document-translated',
    style: 'translated (German drafting in English): the Contract, the Contractual Products, Annex 1',
    text: `Contract for the Supply of Goods

between

Kesselbrink Armaturen GmbH, Industriestraße 4, 33602 Bielefeld, registered in the commercial register of the local court of Bielefeld under HRB 41234
- hereinafter referred to as "Kesselbrink" -

and

Lindqvist Ventil AB, a company incorporated in Sweden, corporate identity number 556677-8899
- hereinafter referred to as "Lindqvist" -

Preamble. The products listed in Annex 1 (hereinafter the "Contractual Products") are supplied under this contract (hereinafter the "Contract").`,
    parties: [
      { name: 'Kesselbrink Armaturen GmbH', terms: ['Kesselbrink'], role: null },
      { name: 'Lindqvist Ventil AB', terms: ['Lindqvist'], role: null },
    ],
    notParties: ['Contract'],
  },
  // Roles the contract does not bind to a party (data-protection roles among them).
  {
    id: 'uk-dpa-roles',
    style: 'UK data processing agreement: Controller and Processor bound; Sub-processor a role no party holds',
    text: `THIS DATA PROCESSING AGREEMENT is made on 3 February 2025 BETWEEN:

(1) Ravensholt Lettings Limited, a company incorporated in England and Wales (company number 11223344) (the "Controller"); and
(2) Culverhay Hosting Ltd, a company incorporated in England and Wales (company number 12345670) (the "Processor").

The Processor may appoint another processor (a "Sub-processor") only with the prior written consent of the Controller.`,
    parties: [
      { name: 'Ravensholt Lettings Limited', terms: ['Controller'], role: 'Controller' },
      { name: 'Culverhay Hosting Ltd', terms: ['Processor'], role: 'Processor' },
    ],
    notParties: ['Sub-processor'],
  },
  {
    id: 'us-roles-unbound',
    style: 'US: a Service Provider and Customer bound; "Subcontractor" and "Data Subject" defined for no party',
    text: `This Master Services Agreement (this "Agreement") is made as of March 3, 2025 between Brightwater Ledger Corp., a Nevada corporation ("Service Provider"), and Halloway Crest Clinics, P.C., a Texas professional corporation ("Customer"). Service Provider may engage a third party approved by Customer (a "Subcontractor"). Any individual whose personal data is processed (a "Data Subject") may exercise the rights set out in Section 9.`,
    parties: [
      { name: 'Brightwater Ledger Corp.', terms: ['Service Provider'], role: 'Service Provider', jurisdiction: 'US-NV' },
      { name: 'Halloway Crest Clinics, P.C.', terms: ['Customer'], role: 'Customer', jurisdiction: 'US-TX' },
    ],
    notParties: ['Agreement', 'Subcontractor', 'Data Subject'],
  },
  {
    id: 'eu-dpa-translated-roles',
    style: 'translated (French drafting in English): the data exporter and data importer bound; "Sub-processor" unbound',
    text: `BETWEEN THE UNDERSIGNED:

Maison Verdurier SAS, a simplified joint-stock company with a share capital of EUR 40,000, whose registered office is at 8 rue des Tanneurs, 69002 Lyon, registered with the Lyon Trade and Companies Register under number 812 345 678, hereinafter referred to as the "Data Exporter",

AND:

Pradelle Informatique SARL, a limited liability company whose registered office is at 21 avenue Jean Moulin, 31000 Toulouse, hereinafter referred to as the "Data Importer",

Article 5. The Data Importer shall not entrust the processing to any other processor (hereinafter a "Sub-processor") without the written authorisation of the Data Exporter.`,
    parties: [
      { name: 'Maison Verdurier SAS', terms: ['Data Exporter'], role: 'Data Exporter' },
      { name: 'Pradelle Informatique SARL', terms: ['Data Importer'], role: 'Data Importer' },
    ],
    notParties: ['Sub-processor'],
  },
];
