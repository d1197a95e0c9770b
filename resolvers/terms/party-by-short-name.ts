/**
 * The party a short form of its name stands for inside one contract: "Hanardham" or "Orvanel" for the contract's
 * only party whose name starts with those words ("Hanardham Logistics Ltd", "Orvanel Holdings plc"), or keeps its
 * first word and drops a middle one ("Indfenmore Components K.K." for "Indfenmore Rail Components K.K."). Drafters
 * and extraction tools shorten a party's name so (common practice). A short name two parties share, a person's
 * given name, or a name whose own legal form is not the party's ("Orvanel Ltd" for "Orvanel Holdings plc": as often
 * another company of the group) decides nothing.
 */
import type { NameAnalysis } from '../analyse/index.ts';
import { compareAcronym } from '../compare/index.ts';
import { analyseCached } from './analyse-cached.ts';
import type { ContractParty } from './types.ts';

/** Letters a short name has at least: shorter ones ("AB", "Co") are initials or words, not a name. */
const MIN_SHORT_NAME = 4;

export function partyByShortName(parties: readonly ContractParty[], mention: NameAnalysis): number {
  if (mention.partyStatus !== 'party' || mention.kind === 'person') return -1;
  const short = mention.tokens;
  if (short.length === 0 || short.join('').length < MIN_SHORT_NAME) return -1;
  let found = -1;
  for (let i = 0; i < parties.length; i++) {
    const p = parties[i] as ContractParty;
    if (p.kind === 'person') continue;
    const full = analyseCached(p.name);
    if (!shortens(short, full.tokens) || !sameFormOrNone(mention, full)) continue;
    if (found >= 0) return -1; // two parties are shortened so: the short name names neither
    found = i;
  }
  return found;
}

/** `short` keeps the first word of `full` and some of its other words, in order, and drops at least one. */
function shortens(short: readonly string[], full: readonly string[]): boolean {
  if (full.length <= short.length || short[0] !== full[0]) return false;
  let k = 1;
  for (let j = 1; j < full.length && k < short.length; j++) if (full[j] === short[k]) k++;
  return k === short.length;
}

/** No legal form on the short name, or the party's own family of form ("Indgarell S.L." / "Indgarell Coatings S.L."). */
function sameFormOrNone(mention: NameAnalysis, party: NameAnalysis): boolean {
  if (mention.legalForm === null) return true;
  return party.legalForm !== null && party.legalForm.family === mention.legalForm.family;
}

/** Letters of an acronym that may stand for a party: two to five ("KC", "MFP"). */
const ACRONYM_LETTERS = /^\p{L}{2,5}$/u;

/**
 * The party whose initials a one-word mention is, inside one contract: "KC AB" for "Kelnatette Ceramics AB",
 * "MFP, Inc." for "Melselico Fire Protection Inc" (resolvers/compare/compareAcronym). The same guards as a short
 * name: the party's own legal form or none, and exactly one party so abbreviated; an acronym alone in the register
 * is far weaker evidence (many firms share three letters), so this is for the contract's own parties only.
 */
export function partyByInitials(parties: readonly ContractParty[], mention: NameAnalysis): number {
  if (mention.partyStatus !== 'party' || mention.kind === 'person') return -1;
  if (mention.tokens.length !== 1 || !ACRONYM_LETTERS.test(mention.tokens[0] as string)) return -1;
  let found = -1;
  for (let i = 0; i < parties.length; i++) {
    const p = parties[i] as ContractParty;
    if (p.kind === 'person') continue;
    const full = analyseCached(p.name);
    if (full.tokens.length < 2 || !sameFormOrNone(mention, full)) continue;
    if (compareAcronym(mention.tokens, full.tokens).level === 'none') continue;
    if (found >= 0) return -1;
    found = i;
  }
  return found;
}
