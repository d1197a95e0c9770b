/**
 * Canonical-value rules: which of a counterparty's names is its canonical name. Applied after every change to
 * its names (documented in docs/register.md; keep the two in step).
 *
 *  0. A name a person set with `rename` stays until a person renames again (counterparty.name_locked_by).
 *  1. A confirmed name wins: confirmed by a person or by a strong identifier sent with it (confirmed_by set).
 *     Among several: legal names before others, then the rules below.
 *  2. Otherwise the most frequent full legal name with its legal form: names of kind legal or observed that carry
 *     a legal form, the one seen most often.
 *  3. Otherwise (and to break ties) the longest name; former names only when there is nothing else.
 *  Final tie-break: the lowest name id (the oldest), so the choice never depends on read order.
 */

export interface NameCandidate {
  id: number;
  name: string;
  kind: string;
  legal_form: string | null;
  seen_count: number;
  confirmed_by: string | null;
}

function compareBy(a: NameCandidate, b: NameCandidate): number {
  // Higher is better for every criterion below; the first difference decides.
  const criteria: Array<(n: NameCandidate) => number> = [
    (n) => (n.confirmed_by ? 1 : 0),
    (n) => (n.confirmed_by && n.kind === 'legal' ? 1 : 0),
    (n) => ((n.kind === 'legal' || n.kind === 'observed') && n.legal_form ? 1 : 0),
    (n) => ((n.kind === 'legal' || n.kind === 'observed') && n.legal_form ? n.seen_count : 0),
    (n) => [...n.name].length,
    (n) => -n.id,
  ];
  for (const criterion of criteria) {
    const d = criterion(b) - criterion(a);
    if (d !== 0) return d;
  }
  return 0;
}

export function chooseCanonicalName(names: readonly NameCandidate[]): NameCandidate | undefined {
  const current = names.filter((n) => n.kind !== 'former');
  const pool = current.length > 0 ? current : [...names];
  return [...pool].sort(compareBy)[0];
}
