/**
 * The parties a contract system already knows (name, role, defined term) against the parties read from the
 * contract's text: which given party is which parsed one (sameEntityName on the two analyses, the rule that merges
 * a preamble's name with its signature block's), and where they disagree: a given party the text does not name, a
 * party of the text that was not given, or a role or defined term that differs. Pure; the caller analyses names.
 */
import type { NameAnalysis } from '../analyse/index.ts';
import { cleanTerm, termKey } from './clean-term.ts';
import { sameEntityName } from './same-entity-name.ts';

export interface GivenPartyFacts {
  name: string;
  role?: string;
  definedTerm?: string;
}

export interface ParsedPartyFacts {
  position: number;
  name: string;
  role: string | null;
  terms: readonly string[];
}

export interface PartyDisagreement {
  /** Index of the given party in the request. */
  given: number;
  position: number;
  field: 'role' | 'definedTerm';
  givenValue: string;
  /** What the text says (null: nothing). */
  parsedValue: string | null;
}

export interface PartyReconciliation {
  matched: Array<{ given: number; position: number }>;
  /** Given parties the text does not name (by index in the request). */
  givenNotInText: number[];
  /** Parties read from the text that were not given (by position). */
  parsedNotGiven: number[];
  disagreements: PartyDisagreement[];
}

const fold = (text: string): string => text.normalize('NFKC').trim().toLowerCase().replace(/\s+/g, ' ');
/** A term as written by a person: the article may stand outside the quotes (the "Buyer"). */
const termOf = (text: string): string => termKey(cleanTerm(text));

export function reconcileGivenParties(
  given: readonly GivenPartyFacts[],
  parsed: readonly ParsedPartyFacts[],
  analyse: (name: string) => NameAnalysis,
): PartyReconciliation {
  const out: PartyReconciliation = { matched: [], givenNotInText: [], parsedNotGiven: [], disagreements: [] };
  const parsedAnalyses = parsed.map((p) => analyse(p.name));
  const taken = new Set<number>();
  given.forEach((g, gi) => {
    const a = analyse(g.name);
    const at = parsed.findIndex((_, pi) => !taken.has(pi) && sameEntityName(a, parsedAnalyses[pi]!));
    if (at < 0) {
      out.givenNotInText.push(gi);
      return;
    }
    taken.add(at);
    const p = parsed[at]!;
    out.matched.push({ given: gi, position: p.position });
    if (g.role !== undefined && (p.role === null || fold(g.role) !== fold(p.role))) {
      out.disagreements.push({ given: gi, position: p.position, field: 'role', givenValue: g.role, parsedValue: p.role });
    }
    if (g.definedTerm !== undefined && !p.terms.some((t) => termOf(t) === termOf(g.definedTerm!))) {
      out.disagreements.push({
        given: gi,
        position: p.position,
        field: 'definedTerm',
        givenValue: g.definedTerm,
        parsedValue: p.terms.length > 0 ? p.terms.join(', ') : null,
      });
    }
  });
  parsed.forEach((p, pi) => {
    if (!taken.has(pi)) out.parsedNotGiven.push(p.position);
  });
  return out;
}
