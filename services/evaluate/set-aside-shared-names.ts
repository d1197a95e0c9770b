/**
 * The scoring protocol of the LEI name data (datasets README): rows whose (case-folded name, country) is held by two
 * or more entities are set aside, since no resolver that sees only names and countries can separate them.
 */
import type { LabelledRow } from './load-labelled-csv.ts';

export function setAsideSharedNames(rows: readonly LabelledRow[]): { kept: LabelledRow[]; setAside: number } {
  const keyOf = (row: LabelledRow): string => `${row.name.toLowerCase()}\u0000${row.country ?? ''}`;
  const holders = new Map<string, Set<string>>();
  for (const row of rows) {
    const key = keyOf(row);
    let ids = holders.get(key);
    if (!ids) holders.set(key, (ids = new Set()));
    ids.add(row.id);
  }
  const kept = rows.filter((row) => (holders.get(keyOf(row))?.size ?? 0) < 2);
  return { kept, setAside: rows.length - kept.length };
}
