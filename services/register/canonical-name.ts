/**
 * Canonical-value rules: which of a counterparty's names is its canonical name. Applied after every change to
 * its names (documented in docs/register.md; keep the two in step).
 *
 *  0. A name a person set with `rename` stays until a person renames again (counterparty.name_locked_by).
 *  1. A confirmed name wins: confirmed by a person or by a strong identifier sent with it (confirmed_by set).
 *     Among several: legal names before others, then the rules below. A spelling confirmed by an identifier that is
 *     one letter from a spelling of the same counterparty seen more often ("Melselico Fire Proection, Inc." once,
 *     with the tax id, against "Melselico Fire Protection, Inc." 118 times) is a typo of it: the identifier
 *     confirmed the entity, not the spelling, so that name competes unconfirmed. A person's confirmation stands.
 *  2. Otherwise the most frequent full legal name with its legal form: names of kind legal or observed that carry
 *     a legal form, the one seen most often.
 *     Spellings that differ only in letter case are one name here: their sightings count together.
 *  3. Otherwise (and to break ties) the longest name; former names only when there is nothing else.
 *  4. Then the spelling with the best letter case: mixed case, then all capitals, then all lower case
 *     ("Frowilora Research B.V." before "FROWILORA RESEARCH B.V." before "frowilora research b.v."): capitals are
 *     how many source systems store or print names, and lower case is how people type in a hurry, neither how the
 *     company writes itself. So among case variants of one name, the mixed-case spelling wins even when another
 *     was seen more often; then the spelling seen most often.
 *  5. Final tie-break: the name that is canonical now stays; otherwise the lowest name id (the oldest), so the
 *     choice never depends on read order. Keeping the current name on a tie is what stops a name from being
 *     replaced by an equally ranked variant (a typo seen as often, "Inc." against "INC.") when a sighting is taken
 *     away and added back: a re-resolution or a partitioned writer re-creates name rows with new ids, and "the
 *     oldest" alone would then pick the variant.
 */
import { withinOneEdit } from '../../resolvers/compare/index.ts';

export interface NameCandidate {
  id: number;
  name: string;
  kind: string;
  legal_form: string | null;
  seen_count: number;
  confirmed_by: string | null;
}

const isFullLegal = (n: NameCandidate): boolean => (n.kind === 'legal' || n.kind === 'observed') && Boolean(n.legal_form);

/** The spelling with letter case ignored: case variants of one name share it. */
const caseKey = (name: string): string => name.normalize('NFC').toLowerCase();

/** True when the name has letters and every one of them is a capital ("QORV B.V."; not "3-4-5" nor "Qorv B.V."). */
export function isAllCapitals(name: string): boolean {
  return name.toUpperCase() === name && name.toLowerCase() !== name;
}

/** True when the name has letters and none of them is a capital ("qorv b.v."). */
export function isAllLowerCase(name: string): boolean {
  return name.toLowerCase() === name && name.toUpperCase() !== name;
}

/** 2 for mixed case, 1 for all capitals, 0 for all lower case (rule 4). */
export function letterCaseRank(name: string): number {
  if (isAllLowerCase(name)) return 0;
  return isAllCapitals(name) ? 1 : 2;
}

/** Sightings of each name added up over its spellings that differ only in letter case. */
function seenWithCaseVariants(pool: readonly NameCandidate[]): Map<string, number> {
  const seen = new Map<string, number>();
  for (const n of pool) seen.set(caseKey(n.name), (seen.get(caseKey(n.name)) ?? 0) + n.seen_count);
  return seen;
}

/** Rule 1's confirmation, or null: an identifier's confirmation of a typo of a more frequent spelling does not count. */
function confirmationOf(n: NameCandidate, pool: readonly NameCandidate[], seen: ReadonlyMap<string, number>): string | null {
  if (!n.confirmed_by?.startsWith('identifier:')) return n.confirmed_by;
  const key = caseKey(n.name);
  const own = seen.get(key) ?? 0;
  const typoOf = pool.some((o) => {
    const other = caseKey(o.name);
    return other !== key && (seen.get(other) ?? 0) > own && withinOneEdit(other, key);
  });
  return typoOf ? null : n.confirmed_by;
}

function compareBy(
  a: NameCandidate,
  b: NameCandidate,
  caseGroupSeen: ReadonlyMap<string, number>,
  current: string | null,
  confirmed: ReadonlyMap<number, string | null>,
): number {
  // Higher is better for every criterion below; the first difference decides.
  const criteria: Array<(n: NameCandidate) => number> = [
    (n) => (confirmed.get(n.id) ? 1 : 0),
    (n) => (confirmed.get(n.id) && n.kind === 'legal' ? 1 : 0),
    (n) => (isFullLegal(n) ? 1 : 0),
    (n) => (isFullLegal(n) ? (caseGroupSeen.get(caseKey(n.name)) ?? 0) : 0),
    (n) => [...n.name].length,
    (n) => letterCaseRank(n.name),
    (n) => (isFullLegal(n) ? n.seen_count : 0),
    (n) => (current !== null && n.name === current ? 1 : 0),
    (n) => -n.id,
  ];
  for (const criterion of criteria) {
    const d = criterion(b) - criterion(a);
    if (d !== 0) return d;
  }
  return 0;
}

/** The name the rules choose; `canonicalNow`: the counterparty's canonical name now (rule 5 keeps it on a tie). */
export function chooseCanonicalName(names: readonly NameCandidate[], canonicalNow: string | null = null): NameCandidate | undefined {
  const current = names.filter((n) => n.kind !== 'former');
  const pool = current.length > 0 ? current : [...names];
  // Rule 2 counts the sightings of full legal names; rule 1's typo test those of every name.
  const caseGroupSeen = seenWithCaseVariants(pool.filter(isFullLegal));
  const seen = seenWithCaseVariants(pool);
  const confirmed = new Map(pool.map((n) => [n.id, confirmationOf(n, pool, seen)]));
  return [...pool].sort((a, b) => compareBy(a, b, caseGroupSeen, canonicalNow, confirmed))[0];
}
