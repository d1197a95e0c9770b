/**
 * Reads a contract's parties: preamble, parties clause, recitals and signature blocks.
 * Each party carries its defined terms, role, and what the descriptive phrase says (jurisdiction,
 * legal form, identifiers, address, aliases). Terms bind only inside this one contract.
 */
import { findEarlierAgreements } from './find-earlier-agreements.ts';
import { analyseCached as analyseName } from './analyse-cached.ts';
import { isDocumentReference, normaliseTokens, type NameAnalysis } from '../analyse/index.ts';
import { normaliseIdentifier } from '../identifiers/index.ts';
import { checkContractText } from './check-contract-text.ts';
import { cleanTerm, termKey } from './clean-term.ts';
import { descriptionAliases } from './description-aliases.ts';
import { extractAddress } from './extract-address.ts';
import { extractIdentifiers } from './extract-identifiers.ts';
import { extractJurisdiction } from './extract-jurisdiction.ts';
import { findDefinitions } from './find-definitions.ts';
import type { Definition, FoundTerm } from './find-definitions.ts';
import { findSignatureBlocks } from './find-signature-blocks.ts';
import { findSigners } from './find-signers.ts';
import { findExclusions } from './find-exclusions.ts';
import { matchExclusions } from './match-exclusions.ts';
import { mergeSigners } from './merge-signers.ts';
import { joinsTwoEntities } from './is-plausible-name.ts';
import { locateNameAt } from './locate-name.ts';
import { nameStarts } from './name-starts.ts';
import { findPartyItems } from './find-party-items.ts';
import { findPlaceMentions } from './find-place-mentions.ts';
import { findLabelledParties } from './find-labelled-parties.ts';
import { NON_PARTY_TERMS } from './non-party-terms.ts';
import { pickRole } from './pick-role.ts';
import { sameEntityName } from './same-entity-name.ts';
import type { ContractIdentifier, ContractParty, ContractSigner, ParsedContract, ParseOptions } from './types.ts';
import { Collector, MAX_COLLECTIVE_TERMS, MAX_PARTIES, MAX_TERMS_PER_PARTY, TRAILING_WINDOW, type Draft } from './collector.ts';
import { collectiveMembers } from './collective-members.ts';

function isPartyTerm(t: FoundTerm): boolean {
  return !t.collective && !t.thisMarker && !NON_PARTY_TERMS.has(t.text.toLowerCase());
}

/**
 * A term the name analysis rules out as the document, a part of it, or a place ("Order Form", "Territory"). A
 * defined term in capitals ("each a "SOW"") is checked as a document too: the analysis reads a lone short acronym
 * as an organisation's, but a term defined with "each" is the contract's own word.
 */
function namesAThing(t: FoundTerm): boolean {
  const reason = analyseName(t.text).partyReason;
  return reason === 'document' || reason === 'place' || isDocumentReference(normaliseTokens(t.text));
}

/** A descriptive phrase that follows the definition: `("Qorv"), a company incorporated in …;` */
function trailingDescription(text: string, from: number, nextStart: number): string {
  let i = from;
  while (i < text.length && (text[i] === ' ' || text[i] === ',')) i++;
  const lower = text.slice(i, i + 20).toLowerCase();
  if (!/^(?:a |an |is a |is an |incorporated|registered|company|with |whose |having |organi[sz]ed|eingetragen|immatricul|société|une |un )/u.test(lower))
    return '';
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
  // "(each, an "Order Form")": a set of documents or places is no collective of parties.
  const collective = def.terms.filter((t) => t.collective && !namesAThing(t));
  for (const t of def.terms) if (!isPartyTerm(t) && (!t.collective || namesAThing(t))) c.noteNotParty(t.text);
  let members: Draft[] | null = null;
  if (partyTerms.length > 0) {
    const inner = text.slice(def.start + 1, def.end - 1);
    const extra = `(${inner}) ${trailingDescription(text, def.end, nextStart)}`;
    let added: Draft | null = null;
    const starts = nameStarts(text, prevEnd, def.start, c.inClause);
    const first = locateNameAt(text, (starts[0] as { at: number }).at, def.start, false);
    // A term defined for "Qorv Ltd and Beta Ltd" names the pair: no single party, and no later name either.
    const forAPair = first !== null && joinsTwoEntities(text.slice(first.nameStart, first.nameEnd), (t) => analyseName(t));
    for (const start of forAPair ? [] : starts) {
      const located = locateNameAt(text, start.at, def.start, start.partyCue);
      added =
        located === null
          ? null
          : c.addParty(
              located,
              partyTerms.map((t) => t.text),
              extra,
            );
      if (added !== null) {
        c.inClause = start.partyCue;
        break;
      }
    }
    if (added === null) for (const t of partyTerms) c.noteNotParty(t.text);
    else if (collective.length > 0) members = [...c.drafts];
  } else if (collective.length > 0 && c.collectives.length < MAX_COLLECTIVE_TERMS) {
    members = collectiveMembers(c, prevEnd, def.start);
  }
  for (const t of collective) {
    if (c.collectives.length >= MAX_COLLECTIVE_TERMS) c.overflowCollectives++;
    else c.collectives.push({ term: t.text, members });
  }
}

function finishIdentifiers(raw: ContractIdentifier[], jurisdiction: string | undefined): ContractIdentifier[] {
  return raw.map((id) => {
    const options = jurisdiction === undefined ? {} : { defaultCountry: jurisdiction };
    const r = normaliseIdentifier(id, options);
    if (r.ok) return r.identifier.label === undefined ? { scheme: r.identifier.scheme, value: r.identifier.value } : { ...r.identifier };
    return { ...id, problem: r.reason };
  });
}

/** The analysis narrowed by the jurisdiction; the plain analysis if the hint is refused. */
function analyseWithCountry(d: Draft, country: string): NameAnalysis {
  try {
    return analyseName(d.fullName, { country });
  } catch {
    return d.analysis;
  }
}

/** "an individual residing at …": the text says the party is a natural person. */
function saysIndividual(description: string): boolean {
  const lower = description.toLowerCase();
  return [
    'an individual',
    'a natural person',
    'residing at',
    'born on',
    'une personne physique',
    'demeurant',
    'natürliche person',
    'wohnhaft',
    'domiciliado en',
    'residente in',
  ].some((p) => lower.includes(p));
}

/**
 * A name the text breaks across lines (a hard-wrapped .txt, text extracted from a PDF) is one name: each line
 * break, with the spaces around it, reads as one space ("Brackenfold Coatings\nLimited"). Spaces within a line
 * are kept as written.
 */
export function oneLine(name: string): string {
  const lines = name.split(LINE_BREAK);
  if (lines.length === 1) return name;
  const last = lines.length - 1;
  // Spaces at a line's edges go with the break; a blank line inside the name adds nothing.
  const kept = lines.map((line, i) => (i > 0 ? line.trimStart() : line)).map((line, i) => (i < last ? line.trimEnd() : line));
  return kept.filter((line, i) => line !== '' || i === 0 || i === last).join(' ');
}
const LINE_BREAK = /\r\n|[\r\n\u2028\u2029\u0085]/u;

function finishParty(d: Draft, ownEntities: NameAnalysis[]): ContractParty {
  const description = d.descriptions.join(' ');
  let jurisdiction = extractJurisdiction(description);
  const jurisdictions = d.analysis.legalForm?.jurisdictions ?? [];
  if (jurisdiction === undefined && jurisdictions.length === 1) jurisdiction = jurisdictions[0];
  const analysis = jurisdiction === undefined ? d.analysis : analyseWithCountry(d, jurisdiction);
  const party: ContractParty = {
    name: oneLine(d.name),
    role: pickRole(d.terms, d.analysis, d.label),
    terms: d.terms,
    ownEntity: ownEntities.some((o) => sameEntityName(o, d.analysis)),
    identifiers: finishIdentifiers(extractIdentifiers(description, jurisdiction), jurisdiction),
    // Copies: analyses are memoised and shared.
    aliases: [...analysis.aliases, ...(analysis.aliases.length === 0 ? descriptionAliases(description) : [])].map((a) => ({ ...a, name: oneLine(a.name) })),
    related: analysis.related.map((r) => ({ ...r, name: oneLine(r.name) })),
    kind: analysis.kind === 'unknown' && (d.honorific || saysIndividual(description)) ? 'person' : analysis.kind,
  };
  if (jurisdiction !== undefined) party.jurisdiction = jurisdiction;
  if (analysis.legalForm !== null) {
    const lf = analysis.legalForm;
    party.legalForm = { ...lf, elfCodes: [...lf.elfCodes], jurisdictions: [...lf.jurisdictions] };
  }
  const address = extractAddress(description);
  if (address !== undefined) party.address = address;
  return party;
}

function bindLabel(c: Collector, d: Draft, label: string): void {
  const term = cleanTerm(label);
  const key = termKey(term);
  if (key.length === 0 || NON_PARTY_TERMS.has(key)) return;
  if (c.drafts.some((other) => other.terms.some((t) => termKey(t) === key))) return;
  c.addTerm(d, term);
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
  for (const item of findPartyItems(text, defs)) c.addParty(item, [], '');
  // Governing-law and venue places are listed as non-parties: a mention of them is never a counterparty.
  for (const place of findPlaceMentions(text)) c.noteNotParty(place);
  for (const labelled of findLabelledParties(text)) c.addParty(labelled.located, labelled.terms, '');
  const blockSigners: ContractSigner[][] = [];
  for (const sig of findSignatureBlocks(text)) {
    const d = c.addParty(sig.located, [], sig.description ?? '', sig.label);
    // "LICENSOR:" over a signature binds the term to that entity, unless the contract binds it to another party.
    if (d !== null && sig.label !== undefined) bindLabel(c, d, sig.label);
    blockSigners.push(sig.signers);
  }
  // Signers' names are non-party names; their titles are capacities, listed with the signer only.
  const signers = mergeSigners([...blockSigners, findSigners(text)]);
  for (const s of signers) c.noteNotParty(s.name);
  // "X, which is not a party hereto": X is mentioned, not a party; its terms bind no party of this contract.
  const { excluded, mentioned } = matchExclusions(findExclusions(text), c.drafts);
  for (const d of excluded) c.drafts.splice(c.drafts.indexOf(d), 1);
  for (const m of mentioned) for (const t of m.terms) c.noteNotParty(t);
  for (const k of c.collectives) if (k.members !== null) k.members = k.members.filter((d) => !excluded.includes(d));
  const own = (options.ownEntities ?? []).filter((n) => typeof n === 'string' && n.trim().length > 0).map((n) => analyseName(n));
  const drafts = [...c.drafts].sort((a, b) => a.position - b.position);
  const parties = drafts.map((d) => finishParty(d, own));
  const boundKeys = new Set(parties.flatMap((p) => [...p.terms, p.name].map(termKey)));
  const collectiveTerms =
    parties.length === 0
      ? []
      : c.collectives.map((k) => ({
          term: k.term,
          parties: [...(k.members ?? drafts)].sort((a, b) => a.position - b.position).map((d) => oneLine(d.name)),
        }));
  const notParties = c.notParties.map(oneLine).filter((n) => !boundKeys.has(termKey(n)));
  const result: ParsedContract = { parties, collectiveTerms, notParties, signers };
  if (mentioned.length > 0) result.mentioned = mentioned;
  // An amendment or side letter that uses an earlier agreement's defined terms: the register looks that one up.
  const earlier = findEarlierAgreements(text);
  if (earlier.length > 0) result.earlierAgreements = earlier;
  const warnings: string[] = [];
  if (c.overflow > 0) warnings.push(`${c.overflow} more party names were found beyond the limit of ${MAX_PARTIES} parties and are not reported`);
  if (c.overflowTerms > 0)
    warnings.push(`${c.overflowTerms} more defined terms were found beyond the limit of ${MAX_TERMS_PER_PARTY} per party and are not reported`);
  if (c.overflowCollectives > 0)
    warnings.push(`${c.overflowCollectives} more collective terms were found beyond the limit of ${MAX_COLLECTIVE_TERMS} and are not reported`);
  if (warnings.length > 0) result.warnings = warnings;
  if (parties.length === 0) {
    result.reason = { code: 'no_parties_found', message: 'no party was recognised: no parties clause, defined party term or signature block' };
  }
  return result;
}
