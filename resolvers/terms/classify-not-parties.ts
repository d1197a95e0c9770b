/**
 * Sorts a contract's non-party names by why they were left out, so that a reviewer of `cpreg contract parse` sees
 * places, references to the document and unbound roles apart from the rest (signers' names, other terms). The
 * reason is the name analysis's own (resolvers/analyse partyReason), so the parse and the register agree.
 */
import { analyseCached } from './analyse-cached.ts';

export interface NotPartyGroups {
  /** Countries, subdivisions, governing-law and venue phrases ("the State of New York"). */
  places: string[];
  /** The document and its parts ("Agreement", "Effective Date", "Schedule 2"). */
  documents: string[];
  /** Roles and pronouns the contract does not bind to one party ("Customer", "Processor"). */
  roles: string[];
  /** Everything else: names of people who sign, terms of other kinds. */
  other: string[];
}

export function classifyNotParties(notParties: readonly string[]): NotPartyGroups {
  const groups: NotPartyGroups = { places: [], documents: [], roles: [], other: [] };
  for (const n of notParties) {
    const reason = analyseCached(n).partyReason;
    if (reason === 'place') groups.places.push(n);
    else if (reason === 'document') groups.documents.push(n);
    else if (reason === 'role_word' || reason === 'pronoun') groups.roles.push(n);
    else groups.other.push(n);
  }
  return groups;
}
