/**
 * The party a short form of its name stands for inside one contract: "Hanardham" or "Orvanel" for the contract's
 * only party whose name starts with those words ("Hanardham Logistics Ltd", "Orvanel Holdings plc"). Drafters and
 * extraction tools shorten a party's name to its first words (common practice); a short name two parties share,
 * a person's given name, or a name with its own legal form decides nothing.
 */
import type { NameAnalysis } from '../analyse/types.ts';
import { analyseCached } from './analyseCached.ts';
import type { ContractParty } from './types.ts';

/** Letters a short name has at least: shorter ones ("AB", "Co") are initials or words, not a name. */
const MIN_SHORT_NAME = 4;

export function partyByShortName(parties: readonly ContractParty[], mention: NameAnalysis): number {
  if (mention.partyStatus !== 'party' || mention.legalForm !== null || mention.kind === 'person') return -1;
  const short = mention.tokens;
  if (short.length === 0 || short.join('').length < MIN_SHORT_NAME) return -1;
  let found = -1;
  for (let i = 0; i < parties.length; i++) {
    const p = parties[i] as ContractParty;
    if (p.kind === 'person') continue;
    const full = analyseCached(p.name).tokens;
    if (full.length <= short.length || !short.every((t, k) => full[k] === t)) continue;
    if (found >= 0) return -1; // two parties start so: the short name names neither
    found = i;
  }
  return found;
}
