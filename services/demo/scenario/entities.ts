/** Our invented group's own entities and the invented counterparties, with identifiers and contacts. */
import type { Random } from '../../../resolvers/prng.ts';
import type { Identifier } from '../../../resolvers/vocabulary.ts';
import { ENDINGS, GIVEN_NAMES, INDUSTRIES, LEGAL_FORMS, SYLLABLES, countryOf } from '../name-parts.ts';
import { pickJurisdiction } from '../invent-organisation.ts';
import * as ids from './identifiers.ts';
import type { Address, OwnEntity, Person, ScenarioCounterparty } from './types.ts';

export const GROUP_NAME = 'Orvanel';

const CITIES: Readonly<Record<string, ReadonlyArray<readonly [string, string]>>> = {
  'US-DE': [
    ['Wilmington', 'DE 19801'],
    ['Dover', 'DE 19901'],
    ['Newark', 'DE 19711'],
  ],
  'US-CA': [
    ['San Jose', 'CA 95113'],
    ['Sacramento', 'CA 95814'],
    ['Oakland', 'CA 94612'],
  ],
  'US-NY': [
    ['Albany', 'NY 12207'],
    ['Buffalo', 'NY 14202'],
    ['Rochester', 'NY 14604'],
  ],
  'US-TX': [
    ['Austin', 'TX 78701'],
    ['Houston', 'TX 77002'],
    ['Dallas', 'TX 75201'],
  ],
  GB: [
    ['Leeds', 'LS1 4AP'],
    ['Bristol', 'BS1 5TR'],
    ['Manchester', 'M2 3WQ'],
    ['London', 'EC2A 4NE'],
  ],
  DE: [
    ['Hamburg', '20095'],
    ['Köln', '50667'],
    ['Stuttgart', '70173'],
    ['München', '80331'],
  ],
  FR: [
    ['Lyon', '69002'],
    ['Nantes', '44000'],
    ['Lille', '59000'],
    ['Paris', '75009'],
  ],
  NL: [
    ['Utrecht', '3511 AB'],
    ['Eindhoven', '5611 AZ'],
    ['Rotterdam', '3011 AD'],
  ],
  JP: [
    ['Osaka', '530-0001'],
    ['Nagoya', '450-0002'],
    ['Tokyo', '100-0005'],
  ],
  AU: [
    ['Brisbane', 'QLD 4000'],
    ['Perth', 'WA 6000'],
    ['Melbourne', 'VIC 3000'],
  ],
  SE: [
    ['Göteborg', '411 03'],
    ['Malmö', '211 20'],
    ['Uppsala', '753 20'],
  ],
  IT: [
    ['Torino', '10121'],
    ['Bologna', '40121'],
    ['Milano', '20121'],
  ],
  ES: [
    ['Valencia', '46002'],
    ['Zaragoza', '50001'],
    ['Sevilla', '41001'],
  ],
};

const STREET_WORDS: Readonly<Record<string, readonly string[]>> = {
  US: ['Avenue', 'Street', 'Boulevard', 'Parkway'],
  GB: ['Road', 'Street', 'Lane', 'Wharf'],
  AU: ['Street', 'Road', 'Parade'],
  DE: ['straße', 'weg', 'allee'],
  FR: ['rue', 'avenue', 'quai'],
  NL: ['straat', 'laan', 'kade'],
  SE: ['gatan', 'vägen'],
  IT: ['via', 'corso'],
  ES: ['calle', 'avenida'],
  JP: ['chome'],
};

export function coinedWord(rnd: Random): string {
  const w = rnd.pick(SYLLABLES) + rnd.pick(SYLLABLES) + rnd.pick(ENDINGS);
  return w[0]!.toUpperCase() + w.slice(1);
}

function surname(rnd: Random): string {
  const w = rnd.pick(SYLLABLES) + rnd.pick(['by', 'dale', 'ford', 'wick', 'holm', 'stead', 'ley', 'mere', 'berg', 'sson']);
  return w[0]!.toUpperCase() + w.slice(1);
}

export function personName(rnd: Random): string {
  return `${rnd.pick(GIVEN_NAMES)} ${surname(rnd)}`;
}

const TITLES = [
  'Chief Executive Officer',
  'Director',
  'Managing Director',
  'General Counsel',
  'Head of Procurement',
  'Chief Financial Officer',
  'Vice President, Operations',
  'Company Secretary',
];

export function signers(rnd: Random, n: number): Person[] {
  return Array.from({ length: n }, () => ({ name: personName(rnd), title: rnd.pick(TITLES) }));
}

export function address(rnd: Random, jurisdiction: string): Address {
  const country = countryOf(jurisdiction);
  const [city, postal] = rnd.pick(CITIES[jurisdiction] ?? CITIES[country]!);
  const word = rnd.pick(STREET_WORDS[country] ?? ['Street']);
  const coined = coinedWord(rnd);
  const no = String(1 + rnd.int(240));
  let street: string;
  if (country === 'DE' || country === 'NL' || country === 'SE') street = `${coined}${word} ${no}`;
  else if (country === 'FR' || country === 'IT' || country === 'ES') street = `${no} ${word} ${coined}`;
  else if (country === 'JP') street = `${1 + rnd.int(9)}-${1 + rnd.int(20)}-${1 + rnd.int(30)} ${coined}`;
  else street = `${no} ${coined} ${word}`;
  return { street, city, postalCode: postal, country };
}

export function formatAddress(a: Address): string {
  if (a.country === 'US') return `${a.street}, ${a.city}, ${a.postalCode}`;
  if (['GB', 'AU', 'JP'].includes(a.country)) return `${a.street}, ${a.city} ${a.postalCode}`;
  return `${a.street}, ${a.postalCode} ${a.city}`;
}

/** Phone numbers; where a country reserves numbers for fiction (US 555-01xx, UK 020 7946 0xxx, AU 0491 570 xxx) they are used. */
export function phone(rnd: Random, jurisdiction: string): string {
  const c = countryOf(jurisdiction);
  const d = (n: number): string => ids.digits(rnd, n);
  switch (c) {
    case 'US':
      return `+1 ${rnd.pick(['302', '408', '518', '512', '212', '713'])} 555 01${d(2)}`;
    case 'GB':
      return `+44 20 7946 0${d(3)}`;
    case 'AU':
      return `+61 491 570 ${rnd.pick(['006', '156', '157', '158', '159', '110', '313', '737', '938'])}`;
    case 'DE':
      return `+49 40 ${d(7)}`;
    case 'FR':
      return `+33 1 ${d(2)} ${d(2)} ${d(2)} ${d(2)}`;
    case 'NL':
      return `+31 20 ${d(3)} ${d(4)}`;
    case 'JP':
      return `+81 6 ${d(4)} ${d(4)}`;
    case 'SE':
      return `+46 31 ${d(3)} ${d(2)} ${d(2)}`;
    case 'IT':
      return `+39 011 ${d(7)}`;
    default:
      return `+34 96 ${d(3)} ${d(4)}`;
  }
}

/** Registration and tax identifiers usual for a company of that jurisdiction and form. */
export function companyIdentifiers(rnd: Random, jurisdiction: string, legalForm: string): Identifier[] {
  const c = countryOf(jurisdiction);
  const out: Identifier[] = [];
  switch (c) {
    case 'US':
      if (rnd.chance(0.7)) out.push({ scheme: 'us_ein', value: ids.usEin(rnd) });
      break;
    case 'GB':
      out.push({ scheme: 'gb_company', value: ids.gbCompanyNumber(rnd) });
      if (rnd.chance(0.7)) out.push({ scheme: 'vat', value: ids.gbVat(rnd) });
      break;
    case 'DE': {
      const reg = ids.deRegister(rnd, legalForm.includes('KG'));
      out.push({ scheme: 'de_register', value: `${reg.court} ${reg.type} ${reg.number}` });
      if (rnd.chance(0.7)) out.push({ scheme: 'vat', value: ids.deVat(rnd) });
      break;
    }
    case 'FR': {
      const siren = ids.frSiren(rnd);
      out.push({ scheme: 'fr_siren', value: siren });
      if (rnd.chance(0.7)) out.push({ scheme: 'vat', value: ids.frVat(siren) });
      break;
    }
    case 'NL':
      out.push({ scheme: 'nl_kvk', value: ids.nlKvk(rnd) });
      if (rnd.chance(0.6)) out.push({ scheme: 'vat', value: ids.nlVat(rnd) });
      break;
    case 'AU': {
      const acn = ids.auAcn(rnd);
      out.push({ scheme: 'au_acn', value: acn });
      if (rnd.chance(0.8)) out.push({ scheme: 'au_abn', value: ids.auAbnFromAcn(acn) });
      break;
    }
    case 'SE': {
      const org = ids.seOrg(rnd);
      out.push({ scheme: 'se_org', value: org });
      if (rnd.chance(0.6)) out.push({ scheme: 'vat', value: ids.seVat(org) });
      break;
    }
    case 'IT':
      if (rnd.chance(0.8)) out.push({ scheme: 'vat', value: ids.itVat(rnd) });
      break;
    case 'JP':
      if (rnd.chance(0.8)) out.push({ scheme: 'other', label: 'jp_corporate_number', value: ids.jpCorporateNumber(rnd) });
      break;
    default:
      break;
  }
  if (rnd.chance(0.15)) out.push({ scheme: 'lei', value: ids.lei(rnd) });
  return out;
}

/** Our invented group: a GB top company and subsidiaries in six more jurisdictions. */
export function ownGroup(rnd: Random): OwnEntity[] {
  const plan: Array<[string, string, string]> = [
    ['GB', `${GROUP_NAME} Holdings plc`, 'plc'],
    ['US-DE', `${GROUP_NAME} Inc.`, 'Inc.'],
    ['DE', `${GROUP_NAME} Deutschland GmbH`, 'GmbH'],
    ['NL', `${GROUP_NAME} Europe B.V.`, 'B.V.'],
    ['FR', `${GROUP_NAME} France SAS`, 'SAS'],
    ['JP', `${GROUP_NAME} Japan K.K.`, 'K.K.'],
    ['AU', `${GROUP_NAME} Australia Pty Ltd`, 'Pty Ltd'],
  ];
  return plan.map(([jurisdiction, legalName, legalForm], i) => ({
    id: `own-${String(i + 1).padStart(2, '0')}`,
    legalName,
    jurisdiction,
    legalForm,
    identifiers: companyIdentifiers(rnd, jurisdiction, legalForm)
      .filter((x) => x.scheme !== 'lei')
      .concat(i === 0 ? [{ scheme: 'lei', value: ids.lei(rnd) }] : []),
    address: address(rnd, jurisdiction),
    parentId: i === 0 ? undefined : 'own-01',
    signers: signers(rnd, 2),
  }));
}

interface OrgDraft {
  core: string;
  words: string[];
  jurisdiction: string;
  form: string;
}

function draftOrganisation(rnd: Random, usedCores: Set<string>, jurisdiction = pickJurisdiction(rnd)): OrgDraft {
  let core = coinedWord(rnd);
  // No core that reads like our own group's name.
  while (usedCores.has(core) || core.toLowerCase().startsWith(GROUP_NAME.slice(0, 3).toLowerCase())) core = coinedWord(rnd);
  usedCores.add(core);
  const words = [core, rnd.pick(INDUSTRIES)];
  const families = LEGAL_FORMS[countryOf(jurisdiction)]!;
  const form = families[rnd.chance(0.75) ? 0 : rnd.int(families.length)]!.canonical;
  return { core, words, jurisdiction, form };
}

function legalNameOf(d: OrgDraft, rnd: Random): string {
  const comma = countryOf(d.jurisdiction) === 'US' && rnd.chance(0.5);
  return `${d.words.join(' ')}${comma ? ',' : ''} ${d.form}`;
}

export interface CounterpartyPlan {
  total: number;
  parentSubsidiaryPairs: number;
  lookalikePairs: number;
  tradeNames: number;
  formerNames: number;
  persons: number;
}

export const DEFAULT_COUNTERPARTY_PLAN: CounterpartyPlan = {
  total: 150,
  parentSubsidiaryPairs: 6,
  lookalikePairs: 6,
  tradeNames: 6,
  formerNames: 6,
  persons: 4,
};

/** The counterparties, in id order: plain companies, then subsidiaries of the first few, lookalikes, persons. */
export function inventCounterparties(rnd: Random, plan: CounterpartyPlan = DEFAULT_COUNTERPARTY_PLAN): ScenarioCounterparty[] {
  const used = new Set<string>();
  const out: ScenarioCounterparty[] = [];
  const nextId = (): string => `cp-${String(out.length + 1).padStart(3, '0')}`;
  const baseCount = plan.total - plan.parentSubsidiaryPairs - plan.lookalikePairs - plan.persons;
  const make = (d: OrgDraft): ScenarioCounterparty => {
    const legalName = legalNameOf(d, rnd);
    return {
      id: nextId(),
      kind: 'organisation',
      legalName,
      jurisdiction: d.jurisdiction,
      legalForm: d.form,
      names: [{ name: legalName, kind: 'legal' }],
      identifiers: companyIdentifiers(rnd, d.jurisdiction, d.form),
      address: address(rnd, d.jurisdiction),
      phone: phone(rnd, d.jurisdiction),
      emailDomain: `${d.core.toLowerCase()}.example`,
      iban: ids.iban(rnd, countryOf(d.jurisdiction)),
      signers: signers(rnd, 1 + rnd.int(2)),
    };
  };
  const drafts: OrgDraft[] = [];
  for (let i = 0; i < baseCount; i++) {
    const d = draftOrganisation(rnd, used);
    // The first parents are holding companies: their subsidiaries share the core word.
    if (i < plan.parentSubsidiaryPairs) d.words = [d.core, 'Holdings'];
    drafts.push(d);
    out.push(make(d));
  }
  // Trade names (d/b/a) on US companies, former names (f/k/a) on others.
  const us = out.filter((c, i) => i >= plan.parentSubsidiaryPairs + plan.lookalikePairs && c.jurisdiction.startsWith('US'));
  for (const c of us.slice(0, plan.tradeNames)) {
    c.names.push({ name: `${coinedWord(rnd)} ${rnd.pick(['Catering', 'Print & Design', 'Logistics', 'Supply', 'Studios'])}`, kind: 'trade' });
  }
  const others = out.filter((c, i) => i >= plan.parentSubsidiaryPairs + plan.lookalikePairs && c.names.length === 1);
  for (const c of others.slice(-plan.formerNames)) {
    const d = drafts[out.indexOf(c)]!;
    c.names.push({ name: `${coinedWord(rnd)} ${rnd.pick(INDUSTRIES)} ${d.form}`, kind: 'former' });
  }
  // Subsidiaries: same core word, another activity; in the parent's country at its address, or abroad.
  for (let i = 0; i < plan.parentSubsidiaryPairs; i++) {
    const parent = out[i]!;
    const pd = drafts[i]!;
    const abroad = rnd.chance(0.5);
    const jurisdiction = abroad ? pickJurisdiction(rnd) : parent.jurisdiction;
    const families = LEGAL_FORMS[countryOf(jurisdiction)]!;
    let activity = rnd.pick(INDUSTRIES);
    while (activity === 'Holdings') activity = rnd.pick(INDUSTRIES);
    const sub = make({ core: pd.core, words: [pd.core, activity], jurisdiction, form: families[0]!.canonical });
    sub.parentId = parent.id;
    sub.emailDomain = `${pd.core.toLowerCase()}-${countryOf(jurisdiction).toLowerCase()}.example`;
    if (!abroad) {
      // Same building and switchboard as the parent: the vendor master shows them as "same or affiliated".
      sub.address = { ...parent.address };
      sub.phone = parent.phone;
    }
    out.push(sub);
  }
  // Lookalikes: the same words with another legal form in the same country, or the same form family abroad.
  for (let i = 0; i < plan.lookalikePairs; i++) {
    const k = plan.parentSubsidiaryPairs + i;
    const original = out[k]!;
    const d = drafts[k]!;
    const families = LEGAL_FORMS[countryOf(d.jurisdiction)]!.filter((f) => f.canonical !== d.form);
    let jurisdiction = d.jurisdiction;
    let form: string;
    if (i % 2 === 0 && families.length > 0) form = rnd.pick(families).canonical;
    else {
      while (countryOf(jurisdiction) === countryOf(d.jurisdiction)) jurisdiction = pickJurisdiction(rnd);
      form = LEGAL_FORMS[countryOf(jurisdiction)]![0]!.canonical;
    }
    const twin = make({ core: d.core, words: d.words, jurisdiction, form });
    twin.emailDomain = `${d.core.toLowerCase()}-${countryOf(jurisdiction).toLowerCase()}.example`;
    twin.lookalikeOf = original.id;
    out.push(twin);
  }
  for (let i = 0; i < plan.persons; i++) {
    const jurisdiction = pickJurisdiction(rnd);
    const name = personName(rnd);
    out.push({
      id: nextId(),
      kind: 'person',
      legalName: name,
      jurisdiction,
      names: [{ name, kind: 'legal' }],
      identifiers: [],
      address: address(rnd, jurisdiction),
      phone: phone(rnd, jurisdiction),
      emailDomain: 'gmail.com',
      iban: ids.iban(rnd, countryOf(jurisdiction)),
      signers: [{ name, title: 'Consultant' }],
    });
  }
  return out;
}
