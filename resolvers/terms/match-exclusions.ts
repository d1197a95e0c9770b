/**
 * Which parties an express exclusion takes out ("X, which is not a party hereto"): the party of that name, or the
 * party holding that term ("the Guarantor is not a party"). An exclusion naming no party found so far is still
 * recorded as a mention when it reads as an entity's name.
 */
import { analyseCached } from './analyse-cached.ts';
import { termKey } from './clean-term.ts';
import type { Exclusion } from './find-exclusions.ts';
import { sameEntityName } from './same-entity-name.ts';
import type { NameAnalysis } from '../analyse/index.ts';
import type { MentionedEntity } from './types.ts';

export interface ExcludableParty {
  name: string;
  terms: string[];
  analysis: NameAnalysis;
}

export interface ExclusionOutcome<P> {
  /** Parties to take out of the contract's party list. */
  excluded: P[];
  mentioned: MentionedEntity[];
}

export function matchExclusions<P extends ExcludableParty>(exclusions: readonly Exclusion[], parties: readonly P[]): ExclusionOutcome<P> {
  const excluded: P[] = [];
  const mentioned: MentionedEntity[] = [];
  for (const ex of exclusions) {
    const key = termKey(ex.name);
    const terms = new Set(ex.terms.map(termKey));
    const analysis = analyseCached(ex.name);
    const hit = parties.find((p) => p.terms.some((t) => termKey(t) === key || terms.has(termKey(t))) || sameEntityName(p.analysis, analysis));
    if (hit !== undefined) {
      if (!excluded.includes(hit)) {
        excluded.push(hit);
        mentioned.push({ name: hit.name, terms: [...hit.terms] });
      }
      continue;
    }
    // A name never defined as a party: recorded only when it reads as an entity (legal form or person), not as a role.
    if (analysis.partyStatus === 'party' && (analysis.legalForm !== null || analysis.kind === 'person') && !mentioned.some((m) => termKey(m.name) === key)) {
      mentioned.push({ name: ex.name, terms: [...ex.terms] });
    }
  }
  return { excluded, mentioned };
}
