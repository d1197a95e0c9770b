/**
 * Reads a contract's parties: preamble, parties clause, recitals and signature blocks.
 * Each party carries its defined terms, role, and what the descriptive phrase says (jurisdiction,
 * legal form, identifiers, address, aliases). Terms bind only inside this one contract.
 */
import { analyseName } from '../analyse/index.ts';
import type { NameAnalysis } from '../analyse/types.ts';
import { normaliseIdentifier } from '../identifiers/index.ts';
import { checkContractText } from './checkContractText.ts';
import { termKey } from './cleanTerm.ts';
import { extractAddress } from './extractAddress.ts';
import { extractIdentifiers } from './extractIdentifiers.ts';
import { extractJurisdiction } from './extractJurisdiction.ts';
import { findDefinitions } from './findDefinitions.ts';
import type { Definition, FoundTerm } from './findDefinitions.ts';
import { findSignatureBlocks } from './findSignatureBlocks.ts';
import { readsAsName } from './isPlausibleName.ts';
import { locateName, locateNameAt } from './locateName.ts';
import type { LocatedName } from './locateName.ts';
import { NON_PARTY_TERMS } from './nonPartyTerms.ts';
import { pickRole } from './pickRole.ts';
import { sameEntityName } from './sameEntityName.ts';
import type { ContractIdentifier, ContractParty, ParsedContract, ParseOptions } from './types.ts';

/** Descriptive text kept per party: enough for any phrase seen in practice, bounded for 1 MB inputs. */
const MAX_DESCRIPTION = 800;
/** How far after a definition a trailing descriptive phrase may run ("…("Acme"), a company incorporated…"). */
const TRAILING_WINDOW = 400;

interface Draft {
  name: string;
  /** Name plus alias phrases, for the analysis. */
  fullName: string;
  terms: string[];
  label?: string;
  descriptions: string[];
  analysis: NameAnalysis;
}

interface CollectiveDraft {
  term: string;
  /** Indices of drafts covered; null: every party of the contract. */
  members: number[] | null;
}

class Collector {
  readonly drafts: Draft[] = [];
  readonly collectives: CollectiveDraft[] = [];
  readonly notParties: string[] = [];

  constructor(readonly text: string) {}

  /** Adds a located name as a party (or merges it into the same entity seen before); -1 when implausible. */
  addParty(located: LocatedName, terms: string[], extraDescription: string, label?: string): number {
    const name = this.text.slice(located.nameStart, located.nameEnd);
    const fullName = this.text.slice(located.nameStart, located.fullEnd);
    const analysis = analyseName(fullName);
    if (!readsAsName(name, analysis)) return -1;
    const description = `${this.text.slice(located.descStart, Math.min(located.descEnd, located.descStart + MAX_DESCRIPTION))} ${extraDescription}`.trim();
    if (!located.partyCue && !hasSupport(analysis, description)) return -1;
    const existing = this.drafts.findIndex((d) => sameEntityName(d.analysis, analysis));
    if (existing >= 0) {
      const d = this.drafts[existing] as Draft;
      for (const t of terms) if (!d.terms.includes(t)) d.terms.push(t);
      if (description.length > 0) d.descriptions.push(description);
      if (d.label === undefined && label !== undefined) d.label = label;
      return existing;
    }
    const draft: Draft = { name, fullName, terms: [...terms], descriptions: description.length > 0 ? [description] : [], analysis };
    if (label !== undefined) draft.label = label;
    this.drafts.push(draft);
    return this.drafts.length - 1;
  }

  noteNotParty(s: string): void {
    const t = s.trim();
    if (t.length > 0 && !this.notParties.includes(t)) this.notParties.push(t);
  }
}

/** Support for a name found outside a parties clause: a legal form, a person, or a descriptive phrase. */
function hasSupport(analysis: NameAnalysis, description: string): boolean {
  if (analysis.legalForm !== null || analysis.kind === 'person') return true;
  if (description.length === 0) return false;
  const j = extractJurisdiction(description);
  return j !== undefined || extractIdentifiers(description, j).length > 0 || extractAddress(description) !== undefined;
}

function isPartyTerm(t: FoundTerm): boolean {
  return !t.collective && !t.thisMarker && !NON_PARTY_TERMS.has(t.text.toLowerCase());
}

/** A descriptive phrase that follows the definition: `("Acme"), a company incorporated in …;` */
function trailingDescription(text: string, from: number, nextStart: number): string {
  let i = from;
  while (i < text.length && (text[i] === ' ' || text[i] === ',')) i++;
  const lower = text.slice(i, i + 20).toLowerCase();
  if (!/^(?:a |an |incorporated|registered|company|with |whose |having |organi[sz]ed|eingetragen|immatricul|société|une |un )/u.test(lower)) return '';
  let end = Math.min(nextStart, text.length, i + TRAILING_WINDOW);
  const semi = text.indexOf(';', i);
  if (semi >= 0 && semi < end) end = semi;
  const blank = text.indexOf('\n\n', i);
  if (blank >= 0 && blank < end) end = blank;
  return text.slice(i, end);
}

function handleDefinition(c: Collector, def: Definition, prevEnd: number, nextStart: number): void {
  const { text } = c;
  const partyTerms = def.terms.filter(isPartyTerm);
  const collective = def.terms.filter((t) => t.collective);
  for (const t of def.terms) if (!t.collective && !isPartyTerm(t)) c.noteNotParty(t.text);
  let members: number[] = [];
  if (partyTerms.length > 0) {
    const located = locateName(text, prevEnd, def.start);
    const inner = text.slice(def.start + 1, def.end - 1);
    const idx = located === null ? -1 : c.addParty(located, partyTerms.map((t) => t.text), `(${inner}) ${trailingDescription(text, def.end, nextStart)}`);
    if (idx < 0) for (const t of partyTerms) c.noteNotParty(t.text);
    else members = c.drafts.map((_, k) => k);
  } else if (collective.length > 0) {
    members = namesBefore(c, prevEnd, def.start);
    if (members.length === 0) members = c.drafts.map((_, k) => k);
  }
  for (const t of collective) c.collectives.push({ term: t.text, members: members.length > 0 ? members : null });
}

/** Parties listed before a collective definition: "Alder Fund I LP and Alder Fund II LP (each a "Fund")". */
function namesBefore(c: Collector, from: number, to: number): number[] {
  const found: number[] = [];
  const first = locateName(c.text, from, to);
  let pos = first === null ? to : first.nameStart;
  for (let guard = 0; pos < to && guard < 50; guard++) {
    const loc = locateNameAt(c.text, pos, to, first?.partyCue ?? false, true);
    if (loc === null) break;
    const idx = c.addParty(loc, [], '');
    if (idx >= 0 && !found.includes(idx)) found.push(idx);
    pos = nextSeparator(c.text, Math.max(loc.nameEnd, loc.fullEnd), to);
  }
  return found;
}

function nextSeparator(text: string, from: number, to: number): number {
  for (let i = from; i < to; i++) {
    if (text[i] === ',' || text[i] === ';') return i + 1;
    if (text.startsWith(' and ', i)) return i + 5;
  }
  return to;
}

function finishIdentifiers(raw: ContractIdentifier[], jurisdiction: string | undefined): ContractIdentifier[] {
  return raw.map((id) => {
    const options = jurisdiction === undefined ? {} : { defaultCountry: jurisdiction };
    const r = normaliseIdentifier(id, options);
    if (r.ok) return r.identifier.label === undefined ? { scheme: r.identifier.scheme, value: r.identifier.value } : { ...r.identifier };
    return { ...id, problem: r.reason };
  });
}

function finishParty(d: Draft, ownEntities: NameAnalysis[]): ContractParty {
  const description = d.descriptions.join(' ');
  let jurisdiction = extractJurisdiction(description);
  const jurisdictions = d.analysis.legalForm?.jurisdictions ?? [];
  if (jurisdiction === undefined && jurisdictions.length === 1) jurisdiction = jurisdictions[0];
  const analysis = jurisdiction === undefined ? d.analysis : analyseName(d.fullName, { country: jurisdiction });
  const party: ContractParty = {
    name: d.name,
    role: pickRole(d.terms, d.analysis, d.label),
    terms: d.terms,
    ownEntity: ownEntities.some((o) => sameEntityName(o, d.analysis)),
    identifiers: finishIdentifiers(extractIdentifiers(description, jurisdiction), jurisdiction),
    aliases: analysis.aliases,
    related: analysis.related,
    kind: analysis.kind,
  };
  if (jurisdiction !== undefined) party.jurisdiction = jurisdiction;
  if (analysis.legalForm !== null) party.legalForm = analysis.legalForm;
  const address = extractAddress(description);
  if (address !== undefined) party.address = address;
  return party;
}

export function parseParties(text: string, options: ParseOptions = {}): ParsedContract {
  const problem = checkContractText(text);
  if (problem !== null) return { parties: [], collectiveTerms: [], notParties: [], reason: problem };
  const c = new Collector(text);
  const defs = findDefinitions(text);
  let prevEnd = 0;
  for (let k = 0; k < defs.length; k++) {
    const def = defs[k] as Definition;
    handleDefinition(c, def, prevEnd, defs[k + 1]?.start ?? text.length);
    prevEnd = def.end;
  }
  for (const sig of findSignatureBlocks(text)) {
    c.addParty(sig.located, [], '', sig.label);
    for (const n of sig.notParties) c.noteNotParty(n);
  }
  const own = (options.ownEntities ?? []).filter((n) => typeof n === 'string' && n.trim().length > 0).map((n) => analyseName(n));
  const parties = c.drafts.map((d) => finishParty(d, own));
  const boundKeys = new Set(parties.flatMap((p) => [...p.terms, p.name].map(termKey)));
  const collectiveTerms = parties.length === 0 ? [] : c.collectives.map((k) => ({
    term: k.term,
    parties: (k.members ?? parties.map((_, i) => i)).map((i) => (parties[i] as ContractParty).name),
  }));
  const notParties = c.notParties.filter((n) => !boundKeys.has(termKey(n)));
  const result: ParsedContract = { parties, collectiveTerms, notParties };
  if (parties.length === 0) {
    result.reason = { code: 'no_parties_found', message: 'no party was recognised: no parties clause, defined party term or signature block' };
  }
  return result;
}
