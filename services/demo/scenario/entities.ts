/** Our invented group's own entities and the invented counterparties, with identifiers and contacts. */
import type { Random } from '../../../resolvers/prng.ts';
import { INDUSTRIES, LEGAL_FORMS, countryOf } from '../name-parts.ts';
import { pickJurisdiction } from '../invent-organisation.ts';
import { companyIdentifiers } from './company-identifiers.ts';
import { address, coinedWord, personName, phone, signers } from './contacts.ts';
import * as ids from './identifiers.ts';
import type { OwnEntity, ScenarioCounterparty } from './types.ts';

export const GROUP_NAME = 'Orvanel';

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
