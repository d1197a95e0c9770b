/**
 * The counts of an ingest run, one per outcome, and the rule that they add up: every row read is accounted for by
 * exactly one outcome (see run-ingest.ts).
 */

export const COUNT_KEYS = ['linked', 'review', 'new', 'own_entity', 'not_a_party', 'unbound_term', 'collective_term', 'already_ingested', 'rejected'] as const;
export type CountKey = (typeof COUNT_KEYS)[number];
export type IngestCounts = Record<CountKey, number> & { read: number; [other: string]: number };

export function emptyCounts(): IngestCounts {
  const counts = { read: 0 } as IngestCounts;
  for (const key of COUNT_KEYS) counts[key] = 0;
  return counts;
}

export function unaccounted(counts: IngestCounts): number {
  let sum = 0;
  for (const [key, value] of Object.entries(counts)) if (key !== 'read') sum += value;
  return counts.read - sum;
}
