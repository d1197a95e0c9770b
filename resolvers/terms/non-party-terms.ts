/**
 * Defined terms that name things, never parties (`this "Agreement"`, the "Effective Date", the "Territory").
 * A guard on top of the structural test: a term in this list is never bound to a party (common practice).
 * The document terms are resolvers/analyse's (the name analysis rules them out too); a contract also never binds
 * the collective "Affiliates" or "Subsidiaries" to one party.
 */
import { DOCUMENT_TERMS } from '../analyse/index.ts';

export const NON_PARTY_TERMS: ReadonlySet<string> = new Set([...DOCUMENT_TERMS, 'affiliates', 'affiliate', 'subsidiaries']);
