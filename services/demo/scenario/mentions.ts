/**
 * Party mentions as people and extraction models write them, each with its ground truth: name variants
 * of the parties (legal-form variants, capitals, missing punctuation, typos, partial and informal names,
 * abbreviations, trade and former names), defined terms and pronouns bound in the contract, and the
 * usual extraction mistakes (signer names, collective terms, terms the contract never defines, places).
 */
import type { Random } from '../../../resolvers/prng.ts';
import type { MentionInput } from '../../../resolvers/vocabulary.ts';
import { corrupt } from '../corrupt.ts';
import { renderName, type NameParts } from '../render-name.ts';
import { LEGAL_FORMS, countryOf } from '../name-parts.ts';
import { ALL_ROLES, GOVERNING_LAW } from './contracts.ts';
import type { ContractParty, MentionStyle, MentionTruth, OwnEntity, ScenarioContract, ScenarioCounterparty, ScenarioMention } from './types.ts';

export const MENTION_SOURCE = 'extraction';

interface Lookup {
  counterparties: ReadonlyMap<string, ScenarioCounterparty>;
  ownEntities: ReadonlyMap<string, OwnEntity>;
}

/** Splits "Brackenridge Fabrication, Inc." into its words and its legal form (with the form's family). */
export function splitLegalName(name: string, legalForm: string | undefined, jurisdiction: string): NameParts {
  if (!legalForm) return { base: name };
  const family = LEGAL_FORMS[countryOf(jurisdiction)]?.find((f) => f.canonical.toLowerCase() === legalForm.toLowerCase());
  const lower = name.toLowerCase();
  const form = legalForm.toLowerCase();
  if (!lower.endsWith(` ${form}`)) return { base: name };
  let base = name.slice(0, name.length - form.length - 1);
  const comma = base.endsWith(',');
  if (comma) base = base.slice(0, -1);
  return { base, form: name.slice(name.length - form.length), family, comma };
}

const ORG_STYLES: ReadonlyArray<readonly [MentionStyle, number]> = [
  ['exact', 0.24],
  ['legal_form_variant', 0.12],
  ['case', 0.08],
  ['missing_punctuation', 0.07],
  ['typo', 0.1],
  ['partial', 0.07],
  ['informal', 0.07],
  ['abbreviation', 0.05],
  ['trade_name', 0.05],
  ['former_name', 0.05],
  ['defined_term', 0.1],
];

const OWN_STYLES: ReadonlyArray<readonly [MentionStyle, number]> = [
  ['exact', 0.4],
  ['case', 0.15],
  ['legal_form_variant', 0.15],
  ['defined_term', 0.2],
  ['informal', 0.1],
];

const PERSON_STYLES: ReadonlyArray<readonly [MentionStyle, number]> = [
  ['exact', 0.5],
  ['case', 0.15],
  ['typo', 0.15],
  ['defined_term', 0.2],
];

function pickWeighted<T>(items: ReadonlyArray<readonly [T, number]>, rnd: Random): T {
  const total = items.reduce((a, [, w]) => a + w, 0);
  let x = rnd.next() * total;
  for (const [item, w] of items) {
    x -= w;
    if (x < 0) return item;
  }
  return items[items.length - 1]![0];
}

/** The text of one party mention in a style, or null when the style does not apply to this party. */
function variantText(style: MentionStyle, party: ContractParty, info: PartyInfo, rnd: Random): string | null {
  const parts = splitLegalName(party.nameInText, info.legalForm, info.jurisdiction);
  const via = (kind: Parameters<typeof corrupt>[0]): string | null => {
    const out = corrupt(kind, parts, rnd);
    return out ? renderName(out) : null;
  };
  switch (style) {
    case 'exact':
      return party.nameInText;
    case 'legal_form_variant':
      return via('legal_form');
    case 'case':
      return via('case');
    case 'missing_punctuation': {
      const stripped = party.nameInText.replaceAll('.', '').replaceAll(',', '');
      return stripped === party.nameInText ? null : stripped;
    }
    case 'typo':
      return via(rnd.pick(['keyboard_typo', 'keyboard_typo', 'ocr', 'phonetic'] as const));
    case 'partial':
      return parts.base.includes(' ') ? via('token_drop') : null;
    case 'informal': {
      if (info.isPerson) return null;
      const first = parts.base.split(' ')[0]!;
      return rnd.chance(0.5) || !parts.form ? first : parts.base;
    }
    case 'abbreviation':
      return via('abbreviation');
    case 'trade_name':
      return info.tradeName ?? null;
    case 'former_name':
      return info.formerName ?? null;
    case 'defined_term': {
      const term = party.terms.find((t) => !['we', 'us', 'our', 'you'].includes(t)) ?? party.role;
      return rnd.chance(0.6) && /^[A-Z][a-z]/.test(term) ? `the ${term}` : term;
    }
    default:
      return null;
  }
}

interface PartyInfo {
  legalForm?: string;
  jurisdiction: string;
  isPerson: boolean;
  tradeName?: string;
  formerName?: string;
  truth: MentionTruth;
  country: string;
  identifiers: ScenarioCounterparty['identifiers'];
}

function infoOf(party: ContractParty, lookup: Lookup): PartyInfo {
  if (party.ref.kind === 'own_entity') {
    const e = lookup.ownEntities.get(party.ref.id)!;
    return {
      legalForm: e.legalForm,
      jurisdiction: e.jurisdiction,
      isPerson: false,
      truth: { kind: 'own_entity', ownEntityId: e.id },
      country: e.jurisdiction,
      identifiers: e.identifiers,
    };
  }
  const c = lookup.counterparties.get(party.ref.id)!;
  return {
    legalForm: c.legalForm,
    jurisdiction: c.jurisdiction,
    isPerson: c.kind === 'person',
    tradeName: c.names.find((n) => n.kind === 'trade')?.name,
    formerName: c.names.find((n) => n.kind === 'former')?.name,
    truth: { kind: 'counterparty', counterpartyId: c.id },
    country: c.jurisdiction,
    identifiers: c.identifiers,
  };
}

/** All mentions extracted from one contract. */
export function mentionsOfContract(contract: ScenarioContract, lookup: Lookup, rnd: Random): ScenarioMention[] {
  const out: ScenarioMention[] = [];
  const add = (text: string, truth: MentionTruth, style: MentionStyle, extra: Partial<MentionInput> = {}): void => {
    out.push({
      input: {
        source: MENTION_SOURCE,
        externalId: `${contract.externalId}/${out.length + 1}`,
        text,
        contract: { source: contract.source, externalId: contract.externalId },
        ...extra,
      },
      truth,
      style,
    });
  };
  for (const party of contract.parties) {
    const info = infoOf(party, lookup);
    const styles = party.ref.kind === 'own_entity' ? OWN_STYLES : info.isPerson ? PERSON_STYLES : ORG_STYLES;
    // Parties known by a trade or former name are often written under it.
    const alias = info.tradeName ? 'trade_name' : info.formerName ? 'former_name' : undefined;
    let style = alias && rnd.chance(0.35) ? alias : pickWeighted(styles, rnd);
    let text = variantText(style, party, info, rnd);
    if (text === null) {
      style = 'exact';
      text = party.nameInText;
    }
    const extra: Partial<MentionInput> = {};
    if (rnd.chance(0.6)) extra.role = party.role;
    if (style !== 'defined_term' && rnd.chance(0.25)) extra.country = info.country;
    const strong = info.identifiers.find((i) => i.scheme !== 'lei' && i.scheme !== 'other');
    if (style !== 'defined_term' && strong && rnd.chance(0.2)) extra.identifiers = [strong];
    add(text, info.truth, style, extra);
  }
  addExtraMentions(contract, lookup, rnd, add);
  return out;
}

type Add = (text: string, truth: MentionTruth, style: MentionStyle, extra?: Partial<MentionInput>) => void;

function addExtraMentions(contract: ScenarioContract, lookup: Lookup, rnd: Random, add: Add): void {
  // Defined pronouns, which bind to their party in this contract only.
  for (const party of contract.parties) {
    const pronouns = party.terms.filter((t) => ['we', 'us', 'our', 'you'].includes(t));
    if (pronouns.length > 0 && rnd.chance(0.7)) add(rnd.pick(pronouns), infoOf(party, lookup).truth, 'pronoun');
  }
  // A signer's name taken for a party (not for individuals: they sign for themselves).
  if (rnd.chance(0.3)) {
    const party = rnd.pick(contract.parties);
    if (party.signer && !infoOf(party, lookup).isPerson) add(party.signer.name, { kind: 'not_a_party', reason: 'signer' }, 'signer');
  }
  if (rnd.chance(0.08)) add(rnd.pick(['the Parties', 'Parties']), { kind: 'collective_term' }, 'collective_term');
  if (rnd.chance(0.08)) {
    const bound = new Set(contract.parties.flatMap((p) => p.terms));
    const unbound = ALL_ROLES.filter((r) => !bound.has(r));
    add(`the ${rnd.pick(unbound)}`, { kind: 'unbound_term' }, 'unbound_term');
  }
  if (rnd.chance(0.05)) {
    const place = GOVERNING_LAW.find((g) => contract.text.includes(`laws of ${g}`));
    if (place) add(place, { kind: 'not_a_party', reason: 'place' }, 'place');
  }
  if (rnd.chance(0.05)) add(rnd.pick(['the Effective Date', 'this Agreement']), { kind: 'not_a_party', reason: 'defined_non_party_term' }, 'non_party_term');
}
