/**
 * Resolves one mention inside one parsed contract. A term bound in this contract resolves to its party;
 * a collective term to no single party; a term the contract does not bind is never matched against the
 * register; anything else goes on to matching. Only `parsed` is consulted, so contracts never leak.
 */
import { analyseName, type NameAnalysis } from '../analyse/index.ts';
import { analyseCached } from './analyse-cached.ts';
import { termKey } from './clean-term.ts';
import { sameEntityName } from './same-entity-name.ts';
import { partyByInitials, partyByShortName } from './party-by-short-name.ts';
import type { ContractParty, DeclaredName, InContractResolution, ParsedContract, PartyRef } from './types.ts';

function ref(parties: ContractParty[], index: number): PartyRef {
  const p = parties[index] as ContractParty;
  return { index, name: p.name, role: p.role, ownEntity: p.ownEntity };
}

/** Singular and plural spellings of a collective term: "Party" / "Parties", "Fund" / "Funds". */
function numberVariants(key: string): string[] {
  const out = [key];
  if (key.endsWith('ies')) out.push(`${key.slice(0, -3)}y`);
  else if (key.endsWith('s')) out.push(key.slice(0, -1));
  else if (key.endsWith('y')) out.push(`${key.slice(0, -1)}ies`, `${key}s`);
  else out.push(`${key}s`);
  return out;
}

export function resolveInContract(parsed: ParsedContract, mentionText: string): InContractResolution {
  const mention = typeof mentionText === 'string' ? mentionText : '';
  const analysis = analyseName(mention);
  const key = termKey(mention);
  const parties = parsed.parties;
  const bound: number[] = [];
  let boundTerm: string | undefined;
  parties.forEach((p, i) => {
    const t = p.terms.find((term) => termKey(term) === key);
    if (t !== undefined) {
      bound.push(i);
      boundTerm = t;
    }
  });
  if (key.length > 0 && bound.length === 1) {
    const party = ref(parties, bound[0] as number);
    const side = party.ownEntity ? 'one of our own entities' : 'a counterparty';
    return {
      status: 'bound',
      mention,
      party,
      term: boundTerm,
      analysis,
      explanation: `"${mention}" is the term this contract defines for ${party.name} (${side})`,
    };
  }
  if (bound.length > 1) {
    return {
      status: 'unbound_term',
      mention,
      term: boundTerm,
      analysis,
      explanation: `"${mention}" is defined for ${bound.length} different parties in this contract, so it binds none of them`,
    };
  }
  const collective = key.length === 0 ? undefined : parsed.collectiveTerms.find((c) => numberVariants(termKey(c.term)).includes(key));
  if (collective !== undefined) {
    const members = parties.map((_, i) => i).filter((i) => collective.parties.includes((parties[i] as ContractParty).name));
    return {
      status: 'collective_term',
      mention,
      term: collective.term,
      parties: members.map((i) => ref(parties, i)),
      analysis,
      explanation: `"${mention}" is a collective term of this contract: it refers to a set of parties, not one`,
    };
  }
  if (analysis.partyStatus === 'needs_binding') {
    return {
      status: 'unbound_term',
      mention,
      analysis,
      explanation: `"${mention}" needs a definition, and this contract does not bind it to a party: it is never matched against the register`,
    };
  }
  if (parsed.notParties.some((n) => termKey(n) === key) || analysis.partyStatus === 'not_a_party') {
    return {
      status: 'not_a_party',
      mention,
      analysis,
      explanation: `"${mention}" is not a party (${notPartyReason(parsed, key, analysis.partyStatus === 'not_a_party')})`,
    };
  }
  const mentioned = parsed.mentioned?.find((m) => termKey(m.name) === key);
  if (mentioned !== undefined) {
    return {
      status: 'match',
      mention,
      analysis,
      explanation: `"${mention}" is named in this contract, which says it is not a party to it; it goes on to matching as a mentioned entity, not as a party`,
    };
  }
  const same = parties.findIndex((p) => sameEntityName(analyseCached(p.name), analysis));
  // "Gareth Pembury d/b/a Pembury Design Studio", "Tollaby Logistics Limited (formerly Tollaby Cold Storage Ltd)": a
  // name the contract itself declares for a party (trade, a-k-a or former) is that party, never a second counterparty.
  const declared = same >= 0 ? undefined : declaredAlias(parties, analysis);
  if (declared !== undefined) {
    const party = ref(parties, declared.index);
    return { status: 'match', mention, party, alias: declared.alias, analysis, explanation: aliasExplanation(mention, party, declared.alias) };
  }
  if (same >= 0) {
    const party = ref(parties, same);
    return {
      status: 'match',
      mention,
      party,
      analysis,
      explanation: `"${mention}" names party ${party.name} of this contract; it goes on to matching against the register`,
    };
  }
  // "Orvanel" in a contract of "Orvanel Holdings plc": the one party whose name starts so, never a new counterparty.
  const short = partyByShortName(parties, analysis);
  if (short >= 0) {
    const party = ref(parties, short);
    return {
      status: 'match',
      mention,
      party,
      analysis,
      explanation: `"${mention}" is a short form of the name of party ${party.name}, the only party of this contract so named`,
    };
  }
  // "KC AB" in a contract of "Kelnatette Ceramics AB": the initials of one party's name.
  const initials = partyByInitials(parties, analysis);
  if (initials >= 0) {
    const party = ref(parties, initials);
    return {
      status: 'match',
      mention,
      party,
      analysis,
      explanation: `"${mention}" is the initials of party ${party.name}, the only party of this contract so abbreviated`,
    };
  }
  return { status: 'match', mention, analysis, explanation: `"${mention}" is not a term of this contract; it goes on to matching against the register` };
}

/** The one party whose declared other name (d/b/a, a/k/a, former name) the mention is; two such parties bind neither. */
function declaredAlias(parties: ContractParty[], analysis: NameAnalysis): { index: number; alias: DeclaredName } | undefined {
  let found: { index: number; alias: DeclaredName } | undefined;
  for (const [index, p] of parties.entries()) {
    const alias = p.aliases.find((a) => sameEntityName(analyseCached(a.name), analysis));
    if (alias === undefined) continue;
    if (found !== undefined && found.index !== index) return undefined;
    found = { index, alias: { kind: alias.kind, name: alias.name } };
  }
  return found;
}

function aliasExplanation(mention: string, party: PartyRef, alias: DeclaredName): string {
  if (alias.kind === 'former') {
    return `"${mention}" is the former name this contract declares for party ${party.name} (declared as "${alias.name}"): the same party under its earlier name, not another counterparty`;
  }
  return `"${mention}" is another name (d/b/a, t/a, a/k/a) of party ${party.name} in this contract: the same party, not another counterparty`;
}

/** Why the contract rules a mention out: a signer (and for whom), a term of an entity that is expressly no party, or another use. */
function notPartyReason(parsed: ParsedContract, key: string, byAnalysis: boolean): string {
  if (byAnalysis) return 'the name analysis rules it out';
  const signer = parsed.signers?.find((s) => termKey(s.name) === key);
  if (signer !== undefined) {
    const as = signer.capacity === 'signatory' ? `signs${signer.signsFor === undefined ? '' : ` for ${signer.signsFor}`}` : `is the ${signer.capacity}`;
    return `a person who ${as}${signer.title === undefined ? '' : ` as ${signer.title}`} in this contract`;
  }
  const of = parsed.mentioned?.find((m) => m.terms.some((t) => termKey(t) === key));
  if (of !== undefined) return `the term this contract defines for ${of.name}, which it says is not a party`;
  return 'this contract uses it for something else';
}
