/**
 * Issue 16, a second adversarial look: new invented passages for items 1–9 in shapes the first corpus did not
 * hold (Scots law and the Court of Session, "On the one hand, X … hereinafter the "Data Controller"", "(each a
 * "SOW")", UK deed execution "acting by a director in the presence of:", "Director:" lines, electronic-signature
 * stamps, "Name:" over "Position:" without "By:", "For the Seller, Mr Y, Chairman", "Notary Public, State of
 * Ohio", Australian "Name of director (print)", "(which is not a party …)", "not a contracting party", "given by X
 * to Y", "a sole proprietor doing business as Z", "operating under the trade name", own entities with legal forms
 * written out in full). Every company, person, address and number is invented; no real contract text is copied.
 * What a careful reader writes down for each passage (the drafting conventions) is common practice.
 */
import type { CorpusCase } from './contracts.ts';

export const SECOND_LOOK_SHAPES: CorpusCase[] = [
  // Item 1: places.
  {
    id: 'uk-places-scots-law-court-of-session',
    style: 'UK: Scots law, the Court of Session, "the laws of Scotland"',
    text: `THIS AGREEMENT is made on 3 April 2025 BETWEEN:

(1) Harrowgate Kilnworks Limited, a company incorporated in Scotland with company number SC701234 ("Harrowgate"); and
(2) Tolworth Glazing plc, a company incorporated in England and Wales with company number 05512345 (the "Glazier").

21. This Agreement shall be governed by the laws of Scotland and each party submits to the exclusive jurisdiction of the Court of Session in Edinburgh. Nothing in this clause limits the right of either party to bring proceedings in Northern Ireland.`,
    parties: [
      { name: 'Harrowgate Kilnworks Limited', terms: ['Harrowgate'], role: null, jurisdiction: 'GB' },
      { name: 'Tolworth Glazing plc', terms: ['Glazier'], role: 'Glazier', jurisdiction: 'GB' },
    ],
    notParties: ['Scotland'],
  },
  {
    id: 'us-places-commonwealth-county',
    style: 'US: laws of the Commonwealth of Pennsylvania; courts of the State of Texas; the District of Columbia',
    text: `This Equipment Lease (this "Lease") is entered into as of June 9, 2025 by and between Marchbank Hydraulics Corp., a Pennsylvania corporation ("Lessor"), and Quintrell Ag Services LLC, a Texas limited liability company ("Lessee").

Section 18. Governing Law. This Lease shall be governed by the laws of the Commonwealth of Pennsylvania. Each party consents to venue in the state and federal courts sitting in Travis County, State of Texas, or in the District of Columbia.`,
    parties: [
      { name: 'Marchbank Hydraulics Corp.', terms: ['Lessor'], role: 'Lessor', jurisdiction: 'US-PA' },
      { name: 'Quintrell Ag Services LLC', terms: ['Lessee'], role: 'Lessee', jurisdiction: 'US-TX' },
    ],
    notParties: ['Lease', 'the Commonwealth of Pennsylvania'],
  },
  {
    id: 'eu-places-federal-republic-canton',
    style: 'translated (German/Swiss drafting in English): law of the Federal Republic of Germany, place of jurisdiction, the Canton of Zurich',
    text: `Agreement

between

Sternhagen Messtechnik GmbH, Am Wehr 7, 79098 Freiburg (hereinafter "Sternhagen")

and

Albisrieden Präzision AG, Hardstrasse 20, 8005 Zürich (hereinafter "Albisrieden")

§ 12 Applicable law and place of jurisdiction. This Agreement is governed by the law of the Federal Republic of Germany. The exclusive place of jurisdiction is Freiburg im Breisgau; Albisrieden may also be sued at the courts of the Canton of Zurich.`,
    parties: [
      { name: 'Sternhagen Messtechnik GmbH', terms: ['Sternhagen'], role: null },
      { name: 'Albisrieden Präzision AG', terms: ['Albisrieden'], role: null },
    ],
    notParties: ['the Federal Republic of Germany'],
  },
  {
    id: 'us-places-defined-province',
    style: 'US/Canadian: a place defined in quotes ("Ontario") and "the Province of Quebec" in a venue clause',
    text: `This Distribution Agreement (this "Agreement") is made as of July 1, 2025 between Larkspur Tool Works Inc., an Ontario corporation ("Larkspur"), and Bellcourt Supply Ltd., a British Columbia company ("Distributor"). Distributor shall sell the Products only in the Province of Quebec (the "Territory"). This Agreement is governed by the laws of the Province of Ontario ("Ontario").`,
    parties: [
      { name: 'Larkspur Tool Works Inc.', terms: ['Larkspur'], role: null, jurisdiction: 'CA-ON' },
      { name: 'Bellcourt Supply Ltd.', terms: ['Distributor'], role: 'Distributor', jurisdiction: 'CA-BC' },
    ],
    notParties: ['Agreement', 'Territory', 'Ontario'],
  },
  // Item 2: the document and its parts.
  {
    id: 'uk-document-deed-annex-sow',
    style: 'UK: this Deed, each Statement of Work ("SOW"), the Deliverables, Annex 3, the Term',
    text: `THIS DEED OF VARIATION (this "Deed") is dated 2 May 2025 and made between Ormsby Fenwick Architects LLP, a limited liability partnership registered in England and Wales with number OC398765 ("Ormsby"), and Caddington Survey Services Limited, a company registered in England and Wales with company number 09876543 ("Caddington").

Caddington shall deliver the items described in each statement of work (each a "SOW") and in Annex 3 (the "Deliverables") for a period of two years (the "Term").`,
    parties: [
      { name: 'Ormsby Fenwick Architects LLP', terms: ['Ormsby'], role: null, jurisdiction: 'GB' },
      { name: 'Caddington Survey Services Limited', terms: ['Caddington'], role: null, jurisdiction: 'GB' },
    ],
    notParties: ['Deed', 'SOW', 'Deliverables', 'Term'],
  },
  {
    id: 'us-document-msa-licensed-software',
    style: 'US: the "MSA", the "Licensed Software", the "Documentation", the "Subscription Term", "Exhibit B"',
    text: `This Master Subscription Agreement (the "MSA") is entered into as of January 6, 2025 (the "Effective Date") by and between Tarbell Quay Software, Inc., a Delaware corporation ("Tarbell"), and Wickford Dental Group, PLLC, a New York professional limited liability company ("Customer"). Tarbell grants Customer access to the software listed in Exhibit B (the "Licensed Software") and its user manuals (the "Documentation") for twelve months (the "Subscription Term").`,
    parties: [
      { name: 'Tarbell Quay Software, Inc.', terms: ['Tarbell'], role: null, jurisdiction: 'US-DE' },
      { name: 'Wickford Dental Group, PLLC', terms: ['Customer'], role: 'Customer', jurisdiction: 'US-NY' },
    ],
    notParties: ['MSA', 'Effective Date', 'Licensed Software', 'Documentation', 'Subscription Term'],
  },
  {
    id: 'eu-document-framework-individual-contracts',
    style: 'translated (German drafting in English): the Framework Agreement, Individual Contracts, the Contract Goods, hereinafter',
    text: `Framework Agreement (hereinafter the "Framework Agreement")

between

Rabenau Kunststofftechnik GmbH, Lindenweg 3, 35390 Gießen (hereinafter the "Supplier")

and

Oberwil Medizintechnik AG, Bahnhofstrasse 9, 4104 Oberwil (hereinafter the "Customer")

Orders placed under this Framework Agreement (hereinafter "Individual Contracts") concern the goods listed in Annex 2 (hereinafter the "Contract Goods").`,
    parties: [
      { name: 'Rabenau Kunststofftechnik GmbH', terms: ['Supplier'], role: 'Supplier' },
      { name: 'Oberwil Medizintechnik AG', terms: ['Customer'], role: 'Customer' },
    ],
    notParties: ['Framework Agreement', 'Individual Contracts', 'Contract Goods'],
  },
  // Item 3: roles no party holds, and roles bound to one.
  {
    id: 'uk-roles-joint-controller-unbound',
    style: 'UK: parties bound as Discloser/Recipient; "Joint Controller" and "Supervisory Authority" bind no party',
    text: `THIS AGREEMENT is made on 10 March 2025 BETWEEN:

(1) Fellowes Granary Foods Limited (company number 07654321) (the "Discloser"); and
(2) Penhallow Analytics Ltd (company number 12233445) (the "Recipient").

Where the Recipient and a third party jointly determine the purposes of processing, that third party (a "Joint Controller") shall be named in Annex 1, and any regulator (the "Supervisory Authority") shall be notified.`,
    parties: [
      { name: 'Fellowes Granary Foods Limited', terms: ['Discloser'], role: 'Discloser' },
      { name: 'Penhallow Analytics Ltd', terms: ['Recipient'], role: 'Recipient' },
    ],
    notParties: ['Joint Controller', 'Supervisory Authority'],
  },
  {
    id: 'us-roles-escrow-agent-unbound',
    style: 'US: a role defined for "an escrow agent reasonably acceptable" and an "Auditor" that no party holds',
    text: `This Source Code Escrow Agreement (this "Agreement") is made as of April 14, 2025 by and between Grantly Arcwise, Inc., a Washington corporation ("Developer"), and Hobart Mercantile Bank, N.A., a national banking association ("Licensee"). The parties shall appoint an escrow agent reasonably acceptable to both (the "Escrow Agent"). Licensee may engage an independent accounting firm (the "Auditor").`,
    parties: [
      { name: 'Grantly Arcwise, Inc.', terms: ['Developer'], role: 'Developer', jurisdiction: 'US-WA' },
      { name: 'Hobart Mercantile Bank, N.A.', terms: ['Licensee'], role: 'Licensee' },
    ],
    notParties: ['Agreement', 'Escrow Agent', 'Auditor'],
  },
  {
    id: 'eu-roles-processor-sub-processor-translated',
    style: 'translated (Spanish drafting in English): "the Data Controller"/"the Data Processor" bound; "the Sub-processor" a role of no party',
    text: `IN Madrid, on 12 May 2025

GATHERED

On the one hand, Alcorcón Datos Clínicos, S.L., with registered office in Madrid, Calle del Prado 14, and tax identification number B12345674, hereinafter the "Data Controller".

On the other hand, Peñarroya Cloud Services, S.A., with registered office in Valencia, Avenida del Puerto 88, hereinafter the "Data Processor".

Fifth. The Data Processor may only engage another processor (hereinafter the "Sub-processor") with the prior written authorisation of the Data Controller.`,
    parties: [
      { name: 'Alcorcón Datos Clínicos, S.L.', terms: ['Data Controller'], role: 'Data Controller' },
      { name: 'Peñarroya Cloud Services, S.A.', terms: ['Data Processor'], role: 'Data Processor' },
    ],
    notParties: ['Sub-processor'],
  },
  // Item 4: signature blocks.
  {
    id: 'uk-signers-deed-director-witness-occupation',
    style: 'UK deed: "Executed as a deed by X acting by a director in the presence of:", witness name, address and occupation',
    text: `EXECUTED as a DEED by MARLOWE TIDEWORKS LIMITED acting by a director in the presence of:

Director: Ingrid Sallow

Witness signature: ......................
Witness name: Petronella Quist
Witness address: 14 Ferry Lane, Whitby YO21 3AB
Witness occupation: Solicitor

EXECUTED as a DEED by CASTLEFORD WHARF HOLDINGS LTD acting by Barnaby Oakes, a director, in the presence of:

Witness name: Rosalind Emery`,
    parties: [
      { name: 'MARLOWE TIDEWORKS LIMITED', terms: [] },
      { name: 'CASTLEFORD WHARF HOLDINGS LTD', terms: [] },
    ],
    notParties: ['Ingrid Sallow', 'Petronella Quist', 'Barnaby Oakes', 'Rosalind Emery'],
    signers: [
      { name: 'Ingrid Sallow', title: 'Director', capacity: 'signatory' },
      { name: 'Petronella Quist', capacity: 'witness' },
      { name: 'Barnaby Oakes', capacity: 'signatory' },
      { name: 'Rosalind Emery', capacity: 'witness' },
    ],
  },
  {
    id: 'us-signers-its-print-name-electronic',
    style: 'US: "By:/Print Name:/Its:" block; an electronic-signature stamp "Electronically signed by:" with a hash line; "Date:"',
    text: `IN WITNESS WHEREOF, the parties have caused this Agreement to be executed by their duly authorized representatives.

KINGSLEY ORCHARD FARMS, LLC

By: ______________________
Print Name: Wendell Stroud
Its: Manager

HALVERSON CANNERY CORP.

Electronically signed by:
Marguerite Pell
4F1A9C22D7B84E0

Name: Marguerite Pell
Title: Chief Financial Officer
Date: 6/12/2025`,
    parties: [
      { name: 'KINGSLEY ORCHARD FARMS, LLC', terms: [] },
      { name: 'HALVERSON CANNERY CORP.', terms: [] },
    ],
    notParties: ['Wendell Stroud', 'Marguerite Pell'],
    signers: [
      { name: 'Wendell Stroud', title: 'Manager', capacity: 'signatory', signsFor: 'KINGSLEY ORCHARD FARMS, LLC' },
      { name: 'Marguerite Pell', title: 'Chief Financial Officer', capacity: 'signatory', signsFor: 'HALVERSON CANNERY CORP.' },
    ],
  },
  {
    id: 'us-signers-notarial-jurat',
    style: 'US: jurat "Subscribed and sworn to before me … by Y"; "Notary Public, State of Ohio"; "My commission expires"',
    text: `This Affidavit of Title is given by Brimley Creek Homes, Inc., an Ohio corporation (the "Seller"), to Thornbury Title Agency LLC (the "Title Company").

BRIMLEY CREEK HOMES, INC.

By: /s/ Desmond Larue
Desmond Larue, President

STATE OF OHIO
COUNTY OF FRANKLIN

Subscribed and sworn to before me this 4th day of June, 2025, by Desmond Larue.

/s/ Winifred Oakhurst
Winifred Oakhurst
Notary Public, State of Ohio
My commission expires: March 1, 2028`,
    parties: [
      { name: 'Brimley Creek Homes, Inc.', terms: ['Seller'], role: 'Seller', jurisdiction: 'US-OH' },
      { name: 'Thornbury Title Agency LLC', terms: ['Title Company'] },
    ],
    notParties: ['Desmond Larue', 'Winifred Oakhurst'],
    signers: [
      { name: 'Desmond Larue', title: 'President', capacity: 'signatory' },
      { name: 'Winifred Oakhurst', capacity: 'notary' },
    ],
  },
  {
    id: 'eu-signers-for-the-client-position-place-date',
    style: 'translated (Austrian drafting in English): "For the Client:", "Name:", "Position:", "Place, date:"; electronic signature line',
    text: `Service Agreement between Grünbach Holzbau GmbH, Wiener Straße 12, 4020 Linz (hereinafter the "Client") and Mayrhofer Statik KG, Hauptplatz 3, 8010 Graz (hereinafter the "Contractor").

Place, date: Linz, 2 June 2025

For the Client:
______________________
Name: Leopold Aichinger
Position: Managing Director

For the Contractor:
Electronically signed by Theresia Mayrhofer on 2 June 2025 at 14:05 CEST
Position: General Partner`,
    parties: [
      { name: 'Grünbach Holzbau GmbH', terms: ['Client'], role: 'Client' },
      { name: 'Mayrhofer Statik KG', terms: ['Contractor'], role: 'Contractor' },
    ],
    notParties: ['Leopold Aichinger', 'Theresia Mayrhofer'],
    signers: [
      { name: 'Leopold Aichinger', title: 'Managing Director', capacity: 'signatory' },
      { name: 'Theresia Mayrhofer', capacity: 'signatory' },
    ],
  },
  {
    id: 'eu-signers-done-at-for-the-seller',
    style: 'translated (French drafting in English): "Done at Lyon … in two originals", "For the Seller, Mr Y, Chairman", "Read and approved"',
    text: `Sale Agreement between Fromagerie Vautrin SAS, 4 quai Perrache, 69002 Lyon (hereinafter the "Seller"), and Conserverie Lamballe SARL, 9 rue du Port, 22400 Lamballe (hereinafter the "Buyer").

Done at Lyon, on 5 May 2025, in two originals.

For the Seller, Mr Baptiste Vautrin, Chairman
Read and approved

For the Buyer, Ms Gwenaëlle Le Goff, Manager
Read and approved`,
    parties: [
      { name: 'Fromagerie Vautrin SAS', terms: ['Seller'], role: 'Seller' },
      { name: 'Conserverie Lamballe SARL', terms: ['Buyer'], role: 'Buyer' },
    ],
    notParties: ['Baptiste Vautrin', 'Gwenaëlle Le Goff'],
    signers: [
      { name: 'Baptiste Vautrin', title: 'Chairman', capacity: 'signatory' },
      { name: 'Gwenaëlle Le Goff', title: 'Manager', capacity: 'signatory' },
    ],
  },
  {
    id: 'uk-signers-australian-s127',
    style: 'Australian: "Executed by X ACN … in accordance with section 127", "Name of director (print)", "Name of director/company secretary"',
    text: `Executed by KESTREL VANE PTY LTD ACN 123 456 780 in accordance with section 127 of the Corporations Act 2001 (Cth):

______________________
Signature of director
Hamish Dunleavy
Name of director (print)

______________________
Signature of director/company secretary
Bronte Ferrier
Name of director/company secretary (print)`,
    parties: [{ name: 'KESTREL VANE PTY LTD', terms: [] }],
    notParties: ['Hamish Dunleavy', 'Bronte Ferrier'],
    signers: [
      { name: 'Hamish Dunleavy', capacity: 'signatory' },
      { name: 'Bronte Ferrier', capacity: 'signatory' },
    ],
  },
  {
    id: 'us-signers-corporate-general-partner',
    style: 'US: a limited partnership signing "By: X GmbH, its general partner" over "By:/Name:/Title:"; "Y, as escrow agent, which is not a party hereto"',
    text: `This Agreement is made as of May 6, 2025 between Quillfarrow Textiles Inc., a Delaware corporation ("Quillfarrow"), and Marchetti Orchard Partners, L.P., a Delaware limited partnership ("Marchetti").

Acknowledged by Harwood Escrow Services LLC, as escrow agent, which is not a party hereto.

MARCHETTI ORCHARD PARTNERS, L.P.
By: Tessaly Holdings GmbH, its general partner
By: ______________________
Name: Ruben Okonjo
Title: Authorized Signatory`,
    parties: [
      { name: 'Quillfarrow Textiles Inc.', terms: ['Quillfarrow'], role: null, jurisdiction: 'US-DE' },
      { name: 'Marchetti Orchard Partners, L.P.', terms: ['Marchetti'], role: null, jurisdiction: 'US-DE' },
    ],
    notParties: ['Ruben Okonjo'],
    signers: [{ name: 'Ruben Okonjo', title: 'Authorized Signatory', capacity: 'signatory' }],
    mentioned: ['Harwood Escrow Services LLC'],
  },
  {
    id: 'uk-signers-attorney-witness-signature',
    style: 'UK: "SIGNED by X as attorney for Y under a power of attorney … in the presence of:", "Witness signature:", "Name:"',
    text: `THIS AGREEMENT is made on 9 May 2025 BETWEEN Pendleford Looms Limited (company number 06677889) ("Pendleford") and Bracewell Dyeworks Ltd (company number 07788990) ("Bracewell").

SIGNED by ALISTAIR PENROSE as attorney for PENDLEFORD LOOMS LIMITED under a power of attorney dated 1 May 2025 in the presence of:
Witness signature: ______________________
Name: Dorothea Wilks`,
    parties: [
      { name: 'Pendleford Looms Limited', terms: ['Pendleford'], role: null },
      { name: 'Bracewell Dyeworks Ltd', terms: ['Bracewell'], role: null },
    ],
    notParties: ['ALISTAIR PENROSE', 'Dorothea Wilks'],
    signers: [
      { name: 'ALISTAIR PENROSE', capacity: 'signatory' },
      { name: 'Dorothea Wilks', capacity: 'witness' },
    ],
  },
  // Item 5: express exclusions.
  {
    id: 'us-exclusion-third-party-beneficiary',
    style: 'US: "X (which is not a party to this Agreement but is an intended third-party beneficiary of Section 7)"',
    text: `This Services Agreement (this "Agreement") is entered into as of March 3, 2025 between Ostler Peak Logistics, Inc., a Colorado corporation ("Ostler"), and Vantreece Cold Chain LLC, a Utah limited liability company ("Provider"). Fellbrook Capital Partners LP (which is not a party to this Agreement but is an intended third-party beneficiary of Section 7) may enforce Section 7 directly.`,
    parties: [
      { name: 'Ostler Peak Logistics, Inc.', terms: ['Ostler'], role: null, jurisdiction: 'US-CO' },
      { name: 'Vantreece Cold Chain LLC', terms: ['Provider'], role: 'Provider', jurisdiction: 'US-UT' },
    ],
    notParties: ['Agreement'],
    mentioned: ['Fellbrook Capital Partners LP'],
  },
  {
    id: 'eu-exclusion-who-is-not-party',
    style: 'translated (Czech/German drafting in English): "X, who is not a party to this contract"; "not a contracting party"',
    text: `Contract for Work concluded between Moravec Strojírny s.r.o., with its registered office at Průmyslová 8, Brno (hereinafter the "Orderer"), and Kallenbach Anlagenbau GmbH, Dresden (hereinafter the "Contractor"). Nothing in this contract confers any right on Ostrava Leasing a.s., who is not a party to this contract. Hartwig Sicherheitstechnik GmbH is not a contracting party.`,
    parties: [
      { name: 'Moravec Strojírny s.r.o.', terms: ['Orderer'], role: 'Orderer' },
      { name: 'Kallenbach Anlagenbau GmbH', terms: ['Contractor'], role: 'Contractor' },
    ],
    mentioned: ['Ostrava Leasing a.s.', 'Hartwig Sicherheitstechnik GmbH'],
  },
  {
    id: 'uk-exclusion-defined-parent-not-party',
    style: 'UK: a parent defined with a term in the parties clause, then "the Parent is not a party to this Agreement"',
    text: `THIS AGREEMENT is made on 7 July 2025 BETWEEN Saltmarsh Boatbuilders Limited (company number 04567891) ("Saltmarsh") and Pyecombe Rigging Ltd (company number 11987654) ("Pyecombe"). Saltmarsh is a subsidiary of Alderwick Marine Group plc (the "Parent"). The Parent, which is not a party to this Agreement, shall have no liability under it.`,
    parties: [
      { name: 'Saltmarsh Boatbuilders Limited', terms: ['Saltmarsh'], role: null },
      { name: 'Pyecombe Rigging Ltd', terms: ['Pyecombe'], role: null },
    ],
    notParties: ['Parent'],
    mentioned: ['Alderwick Marine Group plc'],
  },
  // Item 7: people.
  {
    id: 'us-person-plain-individual-by-and-between',
    style: 'US: a person by given name and surname alone as the second party, "an individual", signature "/s/ Name"',
    text: `This Consulting Agreement (this "Agreement") is made as of February 2, 2025 by and between Lockridge Bioassay, Inc., a Delaware corporation (the "Company"), and Tobias Wrenfield, an individual (the "Consultant").

LOCKRIDGE BIOASSAY, INC.
By: /s/ Imogen Castellane
Name: Imogen Castellane
Title: Chief Executive Officer

CONSULTANT
/s/ Tobias Wrenfield
Tobias Wrenfield`,
    parties: [
      { name: 'Lockridge Bioassay, Inc.', terms: ['Company'], role: 'Company', kind: 'organisation' },
      { name: 'Tobias Wrenfield', terms: ['Consultant'], role: 'Consultant', kind: 'person' },
    ],
    notParties: ['Imogen Castellane'],
    signers: [{ name: 'Imogen Castellane', title: 'Chief Executive Officer', capacity: 'signatory' }],
  },
  {
    id: 'uk-person-prof-dr-t-a',
    style: 'UK: "Professor X Y t/a Z" as a party; "Mr" individual party without descriptive phrase',
    text: `THIS AGREEMENT is made on 4 August 2025 BETWEEN:

(1) Kimbolton Heritage Trust Limited (company number 03456789) (the "Trust");
(2) Professor Ottilie Varga t/a Varga Conservation Studio, of 2 Mill Close, Bath BA1 2QR (the "Conservator"); and
(3) Mr Rupert Ellingham (the "Surveyor").`,
    parties: [
      { name: 'Kimbolton Heritage Trust Limited', terms: ['Trust'], role: null },
      {
        name: 'Professor Ottilie Varga',
        terms: ['Conservator'],
        role: 'Conservator',
        kind: 'person',
        aliases: [{ kind: 'trade', name: 'Varga Conservation Studio' }],
      },
      { name: 'Rupert Ellingham', terms: ['Surveyor'], role: 'Surveyor', kind: 'person' },
    ],
  },
  {
    id: 'us-person-dba-llc-style-trade-name',
    style: 'US: a sole proprietor "X Y, a sole proprietor doing business as Z Landscaping"',
    text: `This Landscaping Services Agreement is entered into as of May 1, 2025 between Windmere Village Homeowners Association, Inc., a Florida not-for-profit corporation ("Association"), and Ramon Quesada, a sole proprietor doing business as Quesada Green Landscaping ("Contractor").`,
    parties: [
      { name: 'Windmere Village Homeowners Association, Inc.', terms: ['Association'], role: null, jurisdiction: 'US-FL' },
      { name: 'Ramon Quesada', terms: ['Contractor'], role: 'Contractor', kind: 'person', aliases: [{ kind: 'trade', name: 'Quesada Green Landscaping' }] },
    ],
    resolves: [{ mention: 'Quesada Green Landscaping', party: 'Ramon Quesada', alias: 'trade' }],
  },
  {
    id: 'eu-person-frau-einzelunternehmerin',
    style: 'translated (German drafting in English): "Ms Dr. X Y, sole trader, trading as Z" and "Mr X Y, born on …"',
    text: `Contract between Ottersberg Brauerei GmbH, Brauhausweg 2, 28870 Ottersberg (hereinafter "Ottersberg"), Ms Dr. Wiebke Hansen, sole trader, trading as Hansen Etikettendesign, Kiel (hereinafter the "Designer"), and Mr Jannik Oltmanns, born on 3 March 1988, residing in Bremen (hereinafter the "Photographer").`,
    parties: [
      { name: 'Ottersberg Brauerei GmbH', terms: ['Ottersberg'], role: null },
      { name: 'Dr. Wiebke Hansen', terms: ['Designer'], role: 'Designer', kind: 'person', aliases: [{ kind: 'trade', name: 'Hansen Etikettendesign' }] },
      { name: 'Jannik Oltmanns', terms: ['Photographer'], role: 'Photographer', kind: 'person' },
    ],
  },
  // Item 8: former and trade names.
  {
    id: 'uk-former-name-changed-from',
    style: 'UK: "(formerly called X)" and a later mention of the former name; "(registered under the name X until …)"',
    text: `THIS AGREEMENT is made on 2 June 2025 BETWEEN Ferncastle Logistics Limited (formerly called Ferncastle Cold Storage Ltd), a company incorporated in England and Wales with company number 06543210 ("Ferncastle"), and Brockhurst Dairies Limited (company number 07123450) ("Brockhurst").

The invoices issued by Ferncastle Cold Storage Ltd before the date of this Agreement remain payable.`,
    parties: [
      { name: 'Ferncastle Logistics Limited', terms: ['Ferncastle'], role: null, aliases: [{ kind: 'former', name: 'Ferncastle Cold Storage Ltd' }] },
      { name: 'Brockhurst Dairies Limited', terms: ['Brockhurst'], role: null },
    ],
    resolves: [{ mention: 'Ferncastle Cold Storage Ltd', party: 'Ferncastle Logistics Limited', alias: 'former' }],
  },
  {
    id: 'us-former-fka-after-comma',
    style: 'US: "X, Inc., f/k/a Y Corp., a Nevada corporation" with a later mention of "Y Corp."',
    text: `This Amended Supply Agreement is entered into as of March 10, 2025 by and between Dalbury Nutrition, Inc., f/k/a Dalbury Vitamin Corp., a Nevada corporation ("Dalbury"), and Kessick Packaging LLC, an Ohio limited liability company ("Kessick"). All purchase orders issued by Dalbury Vitamin Corp. remain in force.`,
    parties: [
      { name: 'Dalbury Nutrition, Inc.', terms: ['Dalbury'], role: null, jurisdiction: 'US-NV', aliases: [{ kind: 'former', name: 'Dalbury Vitamin Corp.' }] },
      { name: 'Kessick Packaging LLC', terms: ['Kessick'], role: null, jurisdiction: 'US-OH' },
    ],
    resolves: [{ mention: 'Dalbury Vitamin Corp.', party: 'Dalbury Nutrition, Inc.', alias: 'former' }],
  },
  {
    id: 'eu-former-formerly-trading-name-translated',
    style: 'translated (Italian drafting in English): "X S.r.l. (formerly Y S.r.l.)" and "Z S.p.A., operating under the trade name W"',
    text: `BETWEEN

Lanzavecchia Tessuti S.r.l. (formerly Lanzavecchia Filati S.r.l.), with registered office in Biella, hereinafter "Lanzavecchia";

AND

Morandotti Moda S.p.A., operating under the trade name Casa Morandotti, with registered office in Milan, hereinafter "Morandotti".

Any order placed with Lanzavecchia Filati S.r.l. or with Casa Morandotti before this date remains valid.`,
    parties: [
      { name: 'Lanzavecchia Tessuti S.r.l.', terms: ['Lanzavecchia'], role: null, aliases: [{ kind: 'former', name: 'Lanzavecchia Filati S.r.l.' }] },
      { name: 'Morandotti Moda S.p.A.', terms: ['Morandotti'], role: null, aliases: [{ kind: 'trade', name: 'Casa Morandotti' }] },
    ],
    resolves: [
      { mention: 'Lanzavecchia Filati S.r.l.', party: 'Lanzavecchia Tessuti S.r.l.', alias: 'former' },
      { mention: 'Casa Morandotti', party: 'Morandotti Moda S.p.A.', alias: 'trade' },
    ],
  },
  // Item 9: earlier agreements.
  {
    id: 'uk-earlier-variation-meaning-given',
    style: 'UK: a variation letter "Words defined in the Agreement dated … between X and Y (the "Agreement") have the same meanings"',
    text: `THIS VARIATION AGREEMENT is made on 1 September 2025 BETWEEN Whitlow Ceramics Limited (company number 05432109) ("Whitlow") and Penhallow Data plc (company number 04321098) ("Penhallow").

1. Words and expressions defined in the services agreement dated 4 June 2021 between Whitlow Ceramics Limited and Penhallow Data plc (the "Agreement") have the same meanings in this Variation Agreement.`,
    parties: [
      { name: 'Whitlow Ceramics Limited', terms: ['Whitlow'], role: null },
      { name: 'Penhallow Data plc', terms: ['Penhallow'], role: null },
    ],
    notParties: ['Agreement'],
    earlier: [{ title: 'services agreement', date: '2021-06-04', parties: ['Whitlow Ceramics Limited', 'Penhallow Data plc'] }],
  },
  {
    id: 'us-earlier-amendment-contract-number',
    style: 'US: "Amendment No. 2 to Master Services Agreement No. MSA-2021-0457"; "capitalized terms used herein without definition"',
    text: `AMENDMENT NO. 2 TO MASTER SERVICES AGREEMENT NO. MSA-2021-0457

This Amendment No. 2 (this "Amendment") is entered into as of August 1, 2025 by and between Corvallis Freightways, Inc., an Oregon corporation ("Corvallis"), and Indigo Ridge Systems LLC, a Delaware limited liability company ("Vendor"). Capitalized terms used herein without definition have the meanings ascribed to them in the Master Services Agreement No. MSA-2021-0457 dated March 15, 2021 between the parties (the "Agreement").`,
    parties: [
      { name: 'Corvallis Freightways, Inc.', terms: ['Corvallis'], role: null, jurisdiction: 'US-OR' },
      { name: 'Indigo Ridge Systems LLC', terms: ['Vendor'], role: 'Vendor', jurisdiction: 'US-DE' },
    ],
    notParties: ['Amendment', 'Agreement'],
    earlier: [{ title: 'Master Services Agreement', date: '2021-03-15', reference: 'MSA-2021-0457', parties: [] }],
  },
  {
    id: 'eu-earlier-addendum-translated',
    style:
      'translated (Dutch drafting in English): "Addendum to the cooperation agreement of 1 February 2022 with reference 2022/017; terms as defined in that agreement"',
    text: `Addendum no. 1

The undersigned, Brouwershaven Techniek B.V., Middelburg (hereinafter "Brouwershaven"), and Zwartewaal Installaties B.V., Rotterdam (hereinafter "Zwartewaal"), agree to amend the cooperation agreement of 1 February 2022 with reference 2022/017. Terms with a capital letter have the meaning given to them in that agreement.`,
    parties: [
      { name: 'Brouwershaven Techniek B.V.', terms: ['Brouwershaven'], role: null },
      { name: 'Zwartewaal Installaties B.V.', terms: ['Zwartewaal'], role: null },
    ],
    earlier: [{ title: 'cooperation agreement', date: '2022-02-01', reference: '2022/017', parties: [] }],
  },
  // Item 6: our own entities in other forms (parsed with the declared own entities).
  {
    id: 'us-own-co-ltd-vs-kk',
    style: 'US: own entity written "Orvanel Japan Co., Ltd." against the declared "Orvanel Japan K.K."',
    text: `This Reseller Agreement (this "Agreement") is made as of May 5, 2025 between Orvanel Japan Co., Ltd., a Japanese corporation ("Orvanel"), and Sawtooth Retail Inc., an Idaho corporation ("Reseller").`,
    ownEntities: ['Orvanel Japan K.K.'],
    parties: [
      { name: 'Orvanel Japan Co., Ltd.', terms: ['Orvanel'], ownEntity: true },
      { name: 'Sawtooth Retail Inc.', terms: ['Reseller'], ownEntity: false },
    ],
  },
  {
    id: 'uk-own-limited-vs-ltd-and-gmbh-long',
    style: 'UK: "Orvanel UK Ltd" against "Orvanel UK Limited"; "Orvanel Deutschland Gesellschaft mit beschränkter Haftung" against "Orvanel Deutschland GmbH"',
    text: `THIS AGREEMENT is made BETWEEN (1) Orvanel UK Ltd (company number 08765432) ("Orvanel UK"), (2) Orvanel Deutschland Gesellschaft mit beschränkter Haftung ("Orvanel DE") and (3) Pellingham Freight Limited ("Pellingham").`,
    ownEntities: ['Orvanel UK Limited', 'Orvanel Deutschland GmbH'],
    parties: [
      { name: 'Orvanel UK Ltd', terms: ['Orvanel UK'], ownEntity: true },
      { name: 'Orvanel Deutschland Gesellschaft mit beschränkter Haftung', terms: ['Orvanel DE'], ownEntity: true },
      { name: 'Pellingham Freight Limited', terms: ['Pellingham'], ownEntity: false },
    ],
  },
  {
    id: 'eu-own-translated-form',
    style:
      'translated: "Orvanel Italia S.r.l." against "Orvanel Italia Srl"; "Orvanel España, Sociedad de Responsabilidad Limitada" against "Orvanel España S.L."; "Orvanel Polska Spółka z o.o." vs "Orvanel Polska sp. z o.o."',
    text: `Agreement between Orvanel Italia Srl, Milan (hereinafter "Orvanel Italia"), Orvanel España, Sociedad de Responsabilidad Limitada, Madrid (hereinafter "Orvanel España"), Orvanel Polska spółka z ograniczoną odpowiedzialnością, Warsaw (hereinafter "Orvanel Polska") and Brisighella Trasporti S.p.A., Ravenna (hereinafter the "Carrier").`,
    ownEntities: ['Orvanel Italia S.r.l.', 'Orvanel España S.L.', 'Orvanel Polska sp. z o.o.'],
    parties: [
      { name: 'Orvanel Italia Srl', terms: ['Orvanel Italia'], ownEntity: true },
      { name: 'Orvanel España, Sociedad de Responsabilidad Limitada', terms: ['Orvanel España'], ownEntity: true },
      { name: 'Orvanel Polska spółka z ograniczoną odpowiedzialnością', terms: ['Orvanel Polska'], ownEntity: true },
      { name: 'Brisighella Trasporti S.p.A.', terms: ['Carrier'], ownEntity: false },
    ],
  },
];
