/**
 * Whether a stored contract is the earlier agreement an amendment or side letter refers to (findEarlierAgreements),
 * precision first: a wrong answer would bind "the Supplier" to another contract's supplier.
 *
 *   reference  the reference number the statement gives is the contract's external id, or stands as a whole token in
 *              its title or opening; and no party the statement names, nor the amendment's own parties, contradict it;
 *   title      the title the statement gives stands in the contract's title or heading, the date it gives (when it
 *              gives one) is written in the contract's opening, and at least one party agrees: a party the statement
 *              names, or else a party of the amendment itself, is a party of the contract (sameEntityName). A
 *              statement that names no party ("between us") in a text whose parties were not found needs the date.
 *
 * Pure: the caller brings the candidates (services/register) and keeps the one answer only when exactly one agrees.
 */
import { analyseCached } from './analyse-cached.ts';
import type { AgreementReference } from './find-earlier-agreements.ts';
import { datesIn } from './read-date.ts';
import { sameEntityName } from './same-entity-name.ts';
import type { ParsedContract } from './types.ts';

export interface EarlierCandidate {
  /** Its id in the source system that sent it. */
  externalId: string;
  title: string | null;
  /** The opening of its text. */
  head: string;
  parsed: ParsedContract;
}

function isAlphanumeric(ch: string | undefined): boolean {
  return ch !== undefined && /[\p{L}\p{N}]/u.test(ch);
}

/** Whether `token` stands in `text` as a whole (ignoring case): "MSA-2024-017", never inside "XMSA-2024-0170". */
export function containsToken(text: string, token: string): boolean {
  const lower = text.toLowerCase();
  const t = token.toLowerCase();
  for (let at = lower.indexOf(t); at >= 0; at = lower.indexOf(t, at + 1)) {
    if (!isAlphanumeric(lower[at - 1]) && !isAlphanumeric(lower[at + t.length])) return true;
  }
  return false;
}

/** The reference number is the contract's external id, or a whole token of its title or opening. */
function carriesReference(reference: string, c: EarlierCandidate): boolean {
  return c.externalId.toLowerCase() === reference.toLowerCase() || containsToken(c.title ?? '', reference) || containsToken(c.head, reference);
}

export type EarlierMatch = { agrees: true; how: 'reference' | 'title_and_date' | 'title_and_parties' } | { agrees: false; why: string };

function sharesParty(names: readonly string[], parsed: ParsedContract): boolean {
  return names.some((n) => {
    const a = analyseCached(n);
    return parsed.parties.some((p) => sameEntityName(analyseCached(p.name), a) || p.aliases.some((x) => sameEntityName(analyseCached(x.name), a)));
  });
}

export function matchEarlierAgreement(ref: AgreementReference, amendment: ParsedContract, candidate: EarlierCandidate): EarlierMatch {
  const named = ref.parties;
  if (named.length > 0 && !sharesParty(named, candidate.parsed)) return { agrees: false, why: 'none of the parties the statement names is a party of it' };
  const own = amendment.parties.map((p) => p.name);
  // An amendment's own parties are parties of the agreement it amends: none in common contradicts even a number.
  if (own.length > 0 && candidate.parsed.parties.length > 0 && !sharesParty(own, candidate.parsed))
    return { agrees: false, why: 'no party of this contract is a party of it' };
  if (ref.reference !== undefined && carriesReference(ref.reference, candidate)) return { agrees: true, how: 'reference' };
  if (ref.title === undefined) return { agrees: false, why: 'the statement gives no title and its reference is not found' };
  const title = ref.title.toLowerCase();
  if (!(candidate.title ?? '').toLowerCase().includes(title) && !candidate.head.slice(0, 300).toLowerCase().includes(title)) {
    return { agrees: false, why: `its title is not "${ref.title}"` };
  }
  const dated = ref.date !== undefined && datesIn(candidate.head).includes(ref.date);
  if (ref.date !== undefined && !dated) return { agrees: false, why: `its opening does not give the date ${ref.date}` };
  if (named.length > 0 || (own.length > 0 && sharesParty(own, candidate.parsed))) return { agrees: true, how: 'title_and_parties' };
  if (own.length === 0 && dated) return { agrees: true, how: 'title_and_date' };
  return { agrees: false, why: 'no party of this contract is a party of it' };
}
