/**
 * Issue 16 items 4, 5 and 7 in the corpus: signature shapes (conformed "/s/" signatures, "Signed for and on behalf
 * of X by Y", "Y, duly authorised", "acting through its director Y", witness and notary lines), express
 * exclusions ("X, which is not a party hereto") and natural persons (an individual contractor by given name and
 * surname, a sole trader "X Y d/b/a Z", a person with a title), and the two signer shapes that run through them:
 * a "By: / Name: / Title:" block and "represented by [its officer] Y" in the preamble. Every passage, company, person, address and number
 * is invented; the shapes are the drafting conventions of US, UK and translated continental contracts (common
 * practice). SHAPES_OF names the shapes each passage shows, so that the test can count three per shape.
 */
import type { CorpusCase } from './contracts.ts';

export const SIGNER_SHAPES: CorpusCase[] = [
  {
    id: 'us-signers-conformed-witness',
    style: 'US: conformed "/s/" signature with the name and a bare title below, By: /s/ with Name:/Title:, a witness line',
    text: `IN WITNESS WHEREOF, the parties have executed this Agreement as of the date first written above.

TALLOWMERE BIOSCIENCES, INC.

/s/ Quentin Aldous
Quentin Aldous
Chief Executive Officer

GRISWOLD PAPER MILLS LLC

By: /s/ Renata Okafor
Name: Renata Okafor
Title: Managing Member

Witness: Corbin Yates`,
    parties: [
      { name: 'TALLOWMERE BIOSCIENCES, INC.', terms: [] },
      { name: 'GRISWOLD PAPER MILLS LLC', terms: [] },
    ],
    notParties: ['Quentin Aldous', 'Renata Okafor', 'Corbin Yates'],
    signers: [
      { name: 'Quentin Aldous', title: 'Chief Executive Officer', capacity: 'signatory', signsFor: 'TALLOWMERE BIOSCIENCES, INC.' },
      { name: 'Renata Okafor', title: 'Managing Member', capacity: 'signatory', signsFor: 'GRISWOLD PAPER MILLS LLC' },
      { name: 'Corbin Yates', capacity: 'witness' },
    ],
  },
  {
    id: 'uk-signers-on-behalf-witness',
    style:
      'UK: "Signed for and on behalf of X by Y, Managing Director"; "Signed by Y, duly authorised for and on behalf of X in the presence of:"; name of witness',
    text: `Signed for and on behalf of BRAMWELL CARTOGRAPHY LIMITED by Oswin Tarrant, Managing Director

......................................

Signed by Philippa Strand, duly authorised for and on behalf of HEXHAM LOOM LTD in the presence of:

Witness signature: ......................
Name of witness: Theda Kornblum
Address of witness: 9 Orchard Row, Durham DH1 3AB`,
    parties: [
      { name: 'BRAMWELL CARTOGRAPHY LIMITED', terms: [] },
      { name: 'HEXHAM LOOM LTD', terms: [] },
    ],
    notParties: ['Oswin Tarrant', 'Philippa Strand', 'Theda Kornblum'],
    signers: [
      { name: 'Oswin Tarrant', title: 'Managing Director', capacity: 'signatory', signsFor: 'BRAMWELL CARTOGRAPHY LIMITED' },
      { name: 'Philippa Strand', capacity: 'signatory' },
      { name: 'Theda Kornblum', capacity: 'witness' },
    ],
  },
  {
    id: 'eu-signers-acting-through-duly-authorised',
    style:
      'EU in English (German/French drafting): "acting through its managing director Y", "represented by Mrs Y, Président", "For X: Y, duly authorised", "In the presence of:"',
    text: `This Framework Supply Agreement is concluded between

Vellmark Präzisionsteile GmbH, registered in the commercial register of the local court of Munich under HRB 123456, acting through its managing director Anselm Voigt (hereinafter the "Supplier"),

and

Lavandière de Gascogne SAS, represented by Mrs Odile Marchal, Président (hereinafter the "Purchaser").

For Vellmark Präzisionsteile GmbH: Anselm Voigt, duly authorised

For Lavandière de Gascogne SAS: Odile Marchal, duly authorised

In the presence of: Theda Kornblum`,
    parties: [
      { name: 'Vellmark Präzisionsteile GmbH', terms: ['Supplier'], role: 'Supplier' },
      { name: 'Lavandière de Gascogne SAS', terms: ['Purchaser'], role: 'Purchaser' },
    ],
    notParties: ['Anselm Voigt', 'Odile Marchal', 'Theda Kornblum'],
    signers: [
      { name: 'Anselm Voigt', title: 'managing director', capacity: 'signatory' },
      { name: 'Odile Marchal', title: 'Président', capacity: 'signatory' },
      { name: 'Theda Kornblum', capacity: 'witness' },
    ],
  },
  {
    id: 'us-notary-exclusion',
    style:
      'US guaranty: "X, which is not a party hereto"; By:/Name:/Title:; notarial acknowledgment ("Before me, Y, a Notary Public … personally appeared Z"; name over "Notary Public")',
    text: `This Guaranty (this "Guaranty") is made as of May 2, 2024 between Corliss Freight Holdings, Inc., a Texas corporation (the "Guarantor"), and Amberlane Equipment Leasing LLC, a Delaware limited liability company (the "Lender"). Dunmore Realty Partners LLC, which is not a party hereto, owns the premises.

CORLISS FREIGHT HOLDINGS, INC.

By: ______________________
Name: Harlan Beeche
Title: Treasurer

Signed on behalf of AMBERLANE EQUIPMENT LEASING LLC by Renata Okafor, Vice President

Before me, Hester Galloway, a Notary Public in and for said State, personally appeared Harlan Beeche, known to me to be the person whose name is subscribed above.

______________________
Hester Galloway
Notary Public`,
    parties: [
      { name: 'Corliss Freight Holdings, Inc.', terms: ['Guarantor'], role: 'Guarantor' },
      { name: 'Amberlane Equipment Leasing LLC', terms: ['Lender'], role: 'Lender' },
    ],
    notParties: ['Harlan Beeche', 'Renata Okafor', 'Hester Galloway'],
    signers: [
      { name: 'Harlan Beeche', title: 'Treasurer', capacity: 'signatory', signsFor: 'CORLISS FREIGHT HOLDINGS, INC.' },
      { name: 'Renata Okafor', title: 'Vice President', capacity: 'signatory', signsFor: 'AMBERLANE EQUIPMENT LEASING LLC' },
      { name: 'Hester Galloway', title: 'Notary Public', capacity: 'notary' },
    ],
    mentioned: ['Dunmore Realty Partners LLC'],
  },
  {
    id: 'uk-exclusion-guarantor-notary',
    style: 'UK deed: "X (the "Guarantor") is not a party to this Deed"; "/s/" in a conformed copy; "Notary Public:" line',
    text: `THIS DEED is dated 4 March 2024

PARTIES

(1) Ashcombe Joinery Limited, a company incorporated and registered in England and Wales with company number 07123456 (the "Tenant"); and

(2) Pennock Estates LLP, a limited liability partnership registered in England and Wales with number OC401234 (the "Landlord").

Kittering Holdings plc (the "Guarantor") is not a party to this Deed but acknowledges its terms.

Conformed copy

ASHCOMBE JOINERY LIMITED

/s/ Nell Arbuthnot
Director

Notary Public: Ambrose Tilling`,
    parties: [
      { name: 'Ashcombe Joinery Limited', terms: ['Tenant'], role: 'Tenant', jurisdiction: 'GB' },
      { name: 'Pennock Estates LLP', terms: ['Landlord'], role: 'Landlord', jurisdiction: 'GB' },
    ],
    notParties: ['Guarantor', 'Nell Arbuthnot', 'Ambrose Tilling'],
    signers: [
      { name: 'Nell Arbuthnot', title: 'Director', capacity: 'signatory', signsFor: 'ASHCOMBE JOINERY LIMITED' },
      { name: 'Ambrose Tilling', capacity: 'notary' },
    ],
    mentioned: ['Kittering Holdings plc'],
  },
  {
    id: 'eu-exclusion-not-being-party',
    style: 'EU in English (Dutch/German drafting): "X, not being a party to this Agreement"; "/s/" signature; notary label with "Maître"',
    text: `This Agreement is concluded between Brunnhof Logistik GmbH, Bremen (hereinafter "Brunnhof"), and Zeeland Koelvracht B.V., Rotterdam (hereinafter "Zeeland"). Valkenburg Verzekeringen N.V., not being a party to this Agreement, shall receive a copy of it.

For Brunnhof Logistik GmbH
/s/ Anselm Voigt, Geschäftsführer

Signed for and on behalf of ZEELAND KOELVRACHT B.V. by Pieter Haverkamp, Directeur

Notary: Maître Solène Garnier`,
    parties: [
      { name: 'Brunnhof Logistik GmbH', terms: ['Brunnhof'] },
      { name: 'Zeeland Koelvracht B.V.', terms: ['Zeeland'] },
    ],
    notParties: ['Anselm Voigt', 'Pieter Haverkamp', 'Solène Garnier'],
    signers: [
      { name: 'Anselm Voigt', title: 'Geschäftsführer', capacity: 'signatory' },
      { name: 'Pieter Haverkamp', title: 'Directeur', capacity: 'signatory', signsFor: 'ZEELAND KOELVRACHT B.V.' },
      { name: 'Solène Garnier', capacity: 'notary' },
    ],
    mentioned: ['Valkenburg Verzekeringen N.V.'],
  },
  {
    id: 'us-individual-contractor-titled-signer',
    style: 'US: an individual contractor named by given name and surname alone; a signer with "Dr." on the Name: line; "acting through its President, Y"',
    text: `This Independent Contractor Agreement (the "Agreement") is entered into as of August 1, 2024 by and between Fernhill Media Group, Inc., a California corporation acting through its President, Dorian Vale (the "Company"), and Maren Holloway (the "Contractor").

FERNHILL MEDIA GROUP, INC.

By: ______________________
Name: Dr. Lucien Abernathy
Title: Chief Operating Officer`,
    parties: [
      { name: 'Fernhill Media Group, Inc.', terms: ['Company'], role: 'Company', kind: 'organisation' },
      { name: 'Maren Holloway', terms: ['Contractor'], role: 'Contractor', kind: 'person' },
    ],
    notParties: ['Agreement', 'Dorian Vale', 'Lucien Abernathy'],
    signers: [
      { name: 'Dorian Vale', title: 'President', capacity: 'signatory' },
      { name: 'Lucien Abernathy', title: 'Chief Operating Officer', capacity: 'signatory', signsFor: 'FERNHILL MEDIA GROUP, INC.' },
    ],
  },
  {
    id: 'us-sole-trader-dba',
    style: 'US: a sole trader with a title "Dr. X Y d/b/a Z Studio", an individual; "By: Y, duly authorized officer"',
    text: `This Design Services Agreement (this "Agreement") is made as of September 3, 2024 between Pelican Bay Outfitters LLC, an Oregon limited liability company ("Client"), and Dr. Gareth Pembury d/b/a Pembury Design Studio, an individual residing at 41 Larch Street, Eugene, OR 97401 ("Designer").

PELICAN BAY OUTFITTERS LLC

By: Corbin Yates, duly authorized officer`,
    parties: [
      { name: 'Pelican Bay Outfitters LLC', terms: ['Client'], role: 'Client' },
      { name: 'Dr. Gareth Pembury', terms: ['Designer'], role: 'Designer', kind: 'person', aliases: [{ kind: 'trade', name: 'Pembury Design Studio' }] },
    ],
    notParties: ['Agreement', 'Corbin Yates'],
    signers: [{ name: 'Corbin Yates', capacity: 'signatory', signsFor: 'PELICAN BAY OUTFITTERS LLC' }],
  },
  {
    id: 'uk-sole-trader-trading-as',
    style: 'UK: (1)/(2) list, a sole trader with a title "Ms X Y trading as Z", "acting by its director Y"',
    text: `This Agreement is made on 12 June 2024 between:

(1) Hollis Print Finishing Limited, a company registered in England and Wales with company number 09234567, acting by its director Philippa Strand ("Hollis"); and

(2) Ms Nell Arbuthnot trading as Arbuthnot Signs, of 3 Tanner's Yard, Ludlow SY8 1AB (the "Supplier").`,
    parties: [
      { name: 'Hollis Print Finishing Limited', terms: ['Hollis'], jurisdiction: 'GB' },
      { name: 'Nell Arbuthnot', terms: ['Supplier'], role: 'Supplier', kind: 'person', aliases: [{ kind: 'trade', name: 'Arbuthnot Signs' }] },
    ],
    notParties: ['Philippa Strand'],
    signers: [{ name: 'Philippa Strand', title: 'director', capacity: 'signatory' }],
  },
  {
    id: 'eu-person-titled-represented',
    style: 'EU in English (French drafting): a person with "Ms" trading under another name as a party; "represented by Mr Y, its manager"',
    text: `Between the undersigned:

Atelier Brossard SARL, with registered office at 12 rue des Tanneurs, 69002 Lyon, represented by Mr Lucien Brossard, its manager (hereinafter the "Client"),

and

Ms Amélie Verdier, trading as Verdier Traductions, residing at 5 chemin des Vignes, 84000 Avignon (hereinafter the "Translator").`,
    parties: [
      { name: 'Atelier Brossard SARL', terms: ['Client'], role: 'Client' },
      { name: 'Amélie Verdier', terms: ['Translator'], role: 'Translator', kind: 'person', aliases: [{ kind: 'trade', name: 'Verdier Traductions' }] },
    ],
    notParties: ['Lucien Brossard'],
    signers: [{ name: 'Lucien Brossard', title: 'manager', capacity: 'signatory' }],
  },
  {
    id: 'uk-individual-consultant',
    style: 'UK: an individual consultant named by given name and surname alone, no descriptive phrase',
    text: `This Consultancy Agreement is made on 2 September 2024 between Ravensholt Surveys Limited, a company registered in England and Wales with company number 10345678 (the "Company"), and Harriet Quillan (the "Consultant").`,
    parties: [
      { name: 'Ravensholt Surveys Limited', terms: ['Company'], role: 'Company', jurisdiction: 'GB' },
      { name: 'Harriet Quillan', terms: ['Consultant'], role: 'Consultant', kind: 'person' },
    ],
  },
  {
    id: 'eu-individual-freelancer',
    style: 'EU in English (Dutch drafting): an individual freelancer named by given name and surname alone, "hereinafter"',
    text: `This Freelance Agreement is concluded between Vanterpool Ontwerp B.V., Utrecht (hereinafter "Vanterpool"), and Lena Marwitz (hereinafter the "Freelancer").`,
    parties: [
      { name: 'Vanterpool Ontwerp B.V.', terms: ['Vanterpool'] },
      { name: 'Lena Marwitz', terms: ['Freelancer'], role: 'Freelancer', kind: 'person' },
    ],
  },
  {
    id: 'uk-by-name-title-represented',
    style: 'UK: (1)/(2) list, an LLP "represented by its designated member Y"; execution blocks "By: / Name: / Title:" under each party',
    text: `This Equipment Hire Agreement is dated 14 October 2024 and is made between:

(1) Fenwick Marlowe LLP, a limited liability partnership registered in England and Wales with number OC412345, represented by its designated member Ivo Brannagh (the "Owner"); and

(2) Cressbrook Staging Limited, a company registered in England and Wales with company number 11234567 (the "Hirer").

FENWICK MARLOWE LLP

By: ______________________
Name: Ivo Brannagh
Title: Designated Member

CRESSBROOK STAGING LIMITED

By: ______________________
Name: Cressida Holt
Title: Director`,
    parties: [
      { name: 'Fenwick Marlowe LLP', terms: ['Owner'], role: 'Owner', jurisdiction: 'GB' },
      { name: 'Cressbrook Staging Limited', terms: ['Hirer'], role: 'Hirer', jurisdiction: 'GB' },
    ],
    notParties: ['Ivo Brannagh', 'Cressida Holt'],
    signers: [
      { name: 'Ivo Brannagh', title: 'Designated Member', capacity: 'signatory', signsFor: 'FENWICK MARLOWE LLP' },
      { name: 'Cressida Holt', title: 'Director', capacity: 'signatory', signsFor: 'CRESSBROOK STAGING LIMITED' },
    ],
  },
  {
    id: 'us-represented-by-officer',
    style: 'US: "a Nevada corporation, represented by its Secretary, Mr. Y"; the same for the other party with "Ms."; one signature block By:/Name:/Title:',
    text: `This Roofing Services Agreement (this "Agreement") is entered into as of April 7, 2025 by and between Kestrel Ridge Roofing, Inc., a Nevada corporation, represented by its Secretary, Mr. Wendell Ashby (the "Contractor"), and Saguaro Flats Apartments LLC, an Arizona limited liability company, represented by its Manager, Ms. Lorna Pike (the "Owner").

KESTREL RIDGE ROOFING, INC.

By: ______________________
Name: Wendell Ashby
Title: Secretary`,
    parties: [
      { name: 'Kestrel Ridge Roofing, Inc.', terms: ['Contractor'], role: 'Contractor' },
      { name: 'Saguaro Flats Apartments LLC', terms: ['Owner'], role: 'Owner' },
    ],
    notParties: ['Agreement', 'Wendell Ashby', 'Lorna Pike'],
    signers: [
      { name: 'Wendell Ashby', title: 'Secretary', capacity: 'signatory', signsFor: 'KESTREL RIDGE ROOFING, INC.' },
      { name: 'Lorna Pike', title: 'Manager', capacity: 'signatory' },
    ],
  },
  {
    id: 'eu-by-name-title-represented',
    style:
      'EU in English (Nordic/Italian drafting): "represented by its CEO Y" in the preamble; "For X" with "By: / Name: / Title:" lines carrying titles in the original language',
    text: `This Distribution Agreement is entered into between Hallvik Maskin AB, a company organised under the laws of Sweden, represented by its CEO Sigrid Lundqvist (hereinafter the "Principal"), and Ferrucci Meccanica S.r.l., a company organised under the laws of Italy, represented by its Amministratore Unico Dario Ferrucci (hereinafter the "Distributor").

For Hallvik Maskin AB
By: ______________________
Name: Sigrid Lundqvist
Title: Verkställande direktör

For Ferrucci Meccanica S.r.l.
By: ______________________
Name: Dario Ferrucci
Title: Amministratore Unico`,
    parties: [
      { name: 'Hallvik Maskin AB', terms: ['Principal'], role: 'Principal' },
      { name: 'Ferrucci Meccanica S.r.l.', terms: ['Distributor'], role: 'Distributor' },
    ],
    notParties: ['Sigrid Lundqvist', 'Dario Ferrucci'],
    signers: [
      { name: 'Sigrid Lundqvist', title: 'Verkställande direktör', capacity: 'signatory', signsFor: 'Hallvik Maskin AB' },
      { name: 'Dario Ferrucci', title: 'Amministratore Unico', capacity: 'signatory', signsFor: 'Ferrucci Meccanica S.r.l.' },
    ],
  },
];

/** The new shapes each passage shows: the test asks for three passages per shape, in US, UK and EU styles. */
export const SHAPES_OF: Readonly<Record<string, readonly string[]>> = {
  'us-signers-conformed-witness': ['conformed', 'witness', 'by-name-title'],
  'uk-signers-on-behalf-witness': ['on-behalf-by', 'duly-authorised', 'witness'],
  'eu-signers-acting-through-duly-authorised': ['acting-through', 'duly-authorised', 'witness', 'represented-by'],
  'us-notary-exclusion': ['exclusion', 'notary', 'by-name-title', 'on-behalf-by'],
  'uk-exclusion-guarantor-notary': ['exclusion', 'conformed', 'notary'],
  'eu-exclusion-not-being-party': ['exclusion', 'conformed', 'notary', 'on-behalf-by'],
  'us-individual-contractor-titled-signer': ['individual', 'acting-through', 'by-name-title'],
  'us-sole-trader-dba': ['sole-trader', 'titled-person', 'duly-authorised'],
  'uk-sole-trader-trading-as': ['sole-trader', 'titled-person', 'acting-through'],
  'eu-person-titled-represented': ['titled-person', 'sole-trader', 'represented-by'],
  'uk-individual-consultant': ['individual'],
  'eu-individual-freelancer': ['individual'],
  'uk-by-name-title-represented': ['by-name-title', 'represented-by'],
  'us-represented-by-officer': ['represented-by', 'by-name-title'],
  'eu-by-name-title-represented': ['by-name-title', 'represented-by'],
};
