/**
 * Contract texts written from templates in several drafting styles. Every text is invented; the names in
 * the parties clause are recorded exactly as written so that tests can find them verbatim.
 */
import type { Random } from '../../../resolvers/prng.ts';
import type { Identifier } from '../../../resolvers/vocabulary.ts';
import { countryOf } from '../name-parts.ts';
import { formatAddress } from './contacts.ts';
import {
  DRAFTING_STYLES,
  type ContractParty,
  type DraftingStyle,
  type OwnEntity,
  type Person,
  type ScenarioContract,
  type ScenarioCounterparty,
} from './types.ts';

export const CONTRACT_SOURCE = 'clm';

/** Contract kinds: title, our role, their role. */
const KINDS: ReadonlyArray<readonly [string, string, string]> = [
  ['Master Services Agreement', 'Customer', 'Supplier'],
  ['Software Licence Agreement', 'Licensee', 'Licensor'],
  ['Supply Agreement', 'Buyer', 'Seller'],
  ['Consulting Agreement', 'Client', 'Consultant'],
  ['Distribution Agreement', 'Principal', 'Distributor'],
  ['Data Processing Agreement', 'Controller', 'Processor'],
  ['Lease Agreement', 'Tenant', 'Landlord'],
  ['Non-Disclosure Agreement', 'Company', 'Recipient'],
  ['Maintenance Agreement', 'Customer', 'Contractor'],
];

/** Roles that a contract may leave undefined: an extraction that returns one is an unbound term. */
export const ALL_ROLES: readonly string[] = [...new Set(KINDS.flatMap(([, a, b]) => [a, b])), 'Guarantor', 'Vendor', 'Service Provider'];

const US_STATES: Readonly<Record<string, string>> = { 'US-DE': 'Delaware', 'US-CA': 'California', 'US-NY': 'New York', 'US-TX': 'Texas' };
const COUNTRY_NAMES: Readonly<Record<string, string>> = {
  GB: 'England and Wales',
  DE: 'Germany',
  FR: 'France',
  NL: 'the Netherlands',
  JP: 'Japan',
  AU: 'Australia',
  SE: 'Sweden',
  IT: 'Italy',
  ES: 'Spain',
  US: 'the United States',
};

export interface PartyInput {
  ref: ContractParty['ref'];
  legalName: string;
  jurisdiction: string;
  legalForm?: string;
  isPerson: boolean;
  identifiers: Identifier[];
  addressText: string;
  tradeName?: string;
  formerName?: string;
  signer: Person;
}

export function partyFromOwn(e: OwnEntity, rnd: Random): PartyInput {
  return {
    ref: { kind: 'own_entity', id: e.id },
    legalName: e.legalName,
    jurisdiction: e.jurisdiction,
    legalForm: e.legalForm,
    isPerson: false,
    identifiers: e.identifiers,
    addressText: formatAddress(e.address),
    signer: rnd.pick(e.signers),
  };
}

export function partyFromCounterparty(c: ScenarioCounterparty, rnd: Random): PartyInput {
  return {
    ref: { kind: 'counterparty', id: c.id },
    legalName: c.legalName,
    jurisdiction: c.jurisdiction,
    legalForm: c.legalForm,
    isPerson: c.kind === 'person',
    identifiers: c.identifiers,
    addressText: formatAddress(c.address),
    tradeName: c.names.find((n) => n.kind === 'trade')?.name,
    formerName: c.names.find((n) => n.kind === 'former')?.name,
    signer: rnd.pick(c.signers),
  };
}

/** "a Delaware corporation", "a company incorporated under the laws of Japan", "an individual". */
function describe(p: PartyInput, rnd: Random): string {
  if (p.isPerson) return `an individual residing at ${p.addressText}`;
  const state = US_STATES[p.jurisdiction];
  if (state) {
    const kind = p.legalForm === 'LLC' ? 'limited liability company' : p.legalForm === 'L.P.' ? 'limited partnership' : 'corporation';
    return `a ${state} ${kind} with offices at ${p.addressText}`;
  }
  const c = countryOf(p.jurisdiction);
  // Companies House numbers starting "SC" belong to companies registered in Scotland.
  const scottish = p.identifiers.some((i) => i.scheme === 'gb_company' && i.value.startsWith('SC'));
  const place =
    c === 'GB'
      ? `incorporated and registered in ${scottish ? 'Scotland' : 'England and Wales'}`
      : `a company incorporated under the laws of ${COUNTRY_NAMES[c]}`;
  const reg = registrationPhrase(p.identifiers, c);
  return `${place}${reg ? ` ${reg}` : ''}${rnd.chance(0.5) ? `, whose registered office is at ${p.addressText}` : ''}`;
}

function registrationPhrase(identifiers: Identifier[], country: string): string {
  const get = (s: string): string | undefined => identifiers.find((i) => i.scheme === s)?.value;
  const gb = get('gb_company');
  if (gb) return `with company number ${gb}`;
  const de = get('de_register');
  if (de) return `registered in the commercial register of the ${de.replace(/ (HR[AB]) /, ' under $1 ')}`;
  const siren = get('fr_siren');
  if (siren) return `registered with the RCS under number ${siren.slice(0, 3)} ${siren.slice(3, 6)} ${siren.slice(6)}`;
  const acn = get('au_acn');
  if (acn) return `(ACN ${acn.slice(0, 3)} ${acn.slice(3, 6)} ${acn.slice(6)})`;
  const se = get('se_org');
  if (se) return `with organisation number ${se}`;
  const kvk = get('nl_kvk');
  if (kvk) return `registered with the Dutch Chamber of Commerce under number ${kvk}`;
  const jp = identifiers.find((i) => i.label === 'jp_corporate_number')?.value;
  if (jp && country === 'JP') return `with corporate number ${jp}`;
  const vat = get('vat');
  if (vat) return `with VAT number ${vat}`;
  return '';
}

/** The name as the parties clause writes it, with its d/b/a or f/k/a when the party has one. */
function nameWithAliases(p: PartyInput, upper: boolean, rnd: Random): { written: string; name: string } {
  const name = upper ? p.legalName.toUpperCase() : p.legalName;
  if (p.tradeName && rnd.chance(0.8)) return { written: `${name} d/b/a ${p.tradeName}`, name };
  if (p.formerName && rnd.chance(0.8)) return { written: `${name} (f/k/a ${p.formerName})`, name };
  return { written: name, name };
}

function q(term: string): string {
  return `"${term}"`;
}

function acronymOf(name: string): string | undefined {
  const words = name.split(/[\s,]+/).filter((w) => /^[A-Z][a-z]/.test(w));
  return words.length >= 2
    ? words
        .slice(0, 3)
        .map((w) => w[0])
        .join('')
    : undefined;
}

export interface ContractDraft {
  externalId: string;
  date: Date;
  own: PartyInput;
  others: PartyInput[];
  kind?: number;
}

function formatDate(d: Date, style: DraftingStyle): string {
  const months = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];
  const m = months[d.getUTCMonth()]!;
  return style === 'uk_numbered' || style === 'between_and' ? `${d.getUTCDate()} ${m} ${d.getUTCFullYear()}` : `${m} ${d.getUTCDate()}, ${d.getUTCFullYear()}`;
}

/** Writes one contract in a style; returns the text and the parties as written. */
export function writeContract(draft: ContractDraft, rnd: Random, style: DraftingStyle = rnd.pick(DRAFTING_STYLES)): ScenarioContract {
  const [title, ownRole, theirRole] = KINDS[draft.kind ?? rnd.int(KINDS.length)]!;
  const dateText = formatDate(draft.date, style);
  const upper = style === 'uk_numbered' || (style === 'between_and' && rnd.chance(0.5));
  const parties: ContractParty[] = [];
  const clauses: string[] = [];
  const all = [draft.own, ...draft.others];
  all.forEach((p, i) => {
    const role = i === 0 ? ownRole : i === 1 ? theirRole : 'Guarantor';
    const { written, name } = nameWithAliases(p, upper && !p.isPerson, rnd);
    const terms = [role];
    let termText = `the ${q(role)}`;
    if (style === 'defined_pronouns') {
      if (i === 0) {
        const short = p.legalName.split(' ')[0]!;
        terms.splice(0, 1, short, 'we', 'us', 'our');
        termText = `${q(short)}, ${q('we')}, ${q('us')} or ${q('our')}`;
      } else if (i === 1) {
        terms.push('you');
        termText = `the ${q(role)} or ${q('you')}`;
      }
    } else if (i === 1 && !p.isPerson && rnd.chance(0.25)) {
      const acronym = acronymOf(p.legalName);
      if (acronym) {
        terms.unshift(acronym);
        termText = `${q(acronym)} or the ${q(role)}`;
      }
    }
    parties.push({ ref: p.ref, nameInText: name, role, terms, signer: p.signer });
    const desc = describe(p, rnd);
    switch (style) {
      case 'by_and_between':
      case 'defined_pronouns':
        clauses.push(`${written}, ${desc} (${termText})`);
        break;
      case 'uk_numbered':
        clauses.push(`(${i + 1}) ${written} ${desc} (${termText})`);
        break;
      case 'between_and':
        clauses.push(`${written}, ${desc},\n(hereinafter referred to as ${termText.replace(/^the "([^"]*)"/, '"the $1"')})`);
        break;
      case 'hereinafter':
        clauses.push(`${written}, ${desc}, hereinafter ${termText}`);
        break;
      case 'numbered_list':
        clauses.push(`${i + 1}. ${written}, ${desc} (${termText})`);
        break;
    }
  });
  const roles = parties.map((p) => p.role);
  const preamble = preambleFor(style, title, dateText, clauses);
  const body = bodyFor(roles, rnd);
  const signatures = all.map((p, i) => signatureBlock(p, parties[i]!, upper, rnd)).join('\n\n');
  const text = `${preamble}\n\n${body}\n\nIN WITNESS WHEREOF, the Parties have executed this Agreement as of the Effective Date.\n\n${signatures}\n`;
  return {
    source: CONTRACT_SOURCE,
    externalId: draft.externalId,
    title,
    date: draft.date.toISOString().slice(0, 10),
    style,
    text,
    parties,
    collectiveTerms: ['Parties'],
  };
}

function preambleFor(style: DraftingStyle, title: string, date: string, clauses: string[]): string {
  const collective = `each a ${q('Party')} and together the ${q('Parties')}`;
  switch (style) {
    case 'by_and_between':
    case 'defined_pronouns':
      return `${title.toUpperCase()}\n\nThis ${title} (this ${q('Agreement')}) is entered into as of ${date} (the ${q('Effective Date')}) by and between ${joinAnd(clauses)}, ${collective}.`;
    case 'uk_numbered':
      return `THIS ${title.toUpperCase()} is dated ${date} (the ${q('Effective Date')})\n\nPARTIES\n\n${clauses.join(';\n\n')},\n\n${collective}.`;
    case 'between_and':
      return `${title.toUpperCase()}\n\nThis Agreement is made on ${date} (the ${q('Effective Date')})\n\nBETWEEN:\n\n${clauses.join('\n\nAND:\n\n')}\n\n(${collective}).`;
    case 'hereinafter':
      return `${title}\n\n${joinAnd(clauses)}, (${collective}), agree as follows with effect from ${date} (the ${q('Effective Date')}):`;
    case 'numbered_list':
      return `${title}\n\nDate: ${date} (the ${q('Effective Date')})\n\nThe parties to this ${title} are:\n\n${clauses.join(';\n')}\n\n(${collective}).`;
  }
}

function joinAnd(items: string[]): string {
  return items.length <= 2 ? items.join(', and ') : `${items.slice(0, -1).join(', ')}, and ${items.at(-1)}`;
}

const GOVERNING_LAW = ['the State of New York', 'England and Wales', 'the State of Delaware', 'Germany', 'the Netherlands', 'New South Wales'];

function bodyFor(roles: string[], rnd: Random): string {
  const [a, b] = [roles[0]!, roles[1]!];
  const lines = [
    `1. Scope. The ${b} shall provide the goods and services described in Schedule 1 to the ${a} in accordance with this Agreement.`,
    `2. Fees. The ${a} shall pay the ${b} the fees set out in Schedule 2 within thirty (30) days of receipt of a valid invoice.`,
    `3. Confidentiality. Each Party shall keep the other Party's confidential information confidential and use it only for the purposes of this Agreement.`,
    `4. Term. This Agreement starts on the Effective Date and continues for ${1 + rnd.int(5)} years unless terminated earlier.`,
  ];
  if (roles[2]) lines.push(`5. Guarantee. The ${roles[2]} guarantees the due performance by the ${b} of its obligations under this Agreement.`);
  lines.push(`${lines.length + 1}. Governing law. This Agreement is governed by the laws of ${rnd.pick(GOVERNING_LAW)}.`);
  return lines.join('\n\n');
}

function signatureBlock(p: PartyInput, party: ContractParty, upper: boolean, rnd: Random): string {
  if (p.isPerson) return `${p.legalName}\n\nSignature: ______________________\nDate: ____________`;
  const entity = upper || rnd.chance(0.6) ? p.legalName.toUpperCase() : p.legalName;
  if (rnd.chance(0.25)) return `Signed for and on behalf of ${entity} by ${p.signer.name}, ${p.signer.title}\n\n______________________`;
  return `${entity}\n\nBy: ______________________\nName: ${p.signer.name}\nTitle: ${p.signer.title}`;
}

export { KINDS as CONTRACT_KINDS, GOVERNING_LAW };
export type { ContractParty };
