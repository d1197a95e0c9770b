/** Helpers for query modules: ids as numbers on both backends (pg answers int8 as a string). */
import type { Kysely, Transaction } from 'kysely';
import type { Database } from '../types.ts';

export type Queryable = Kysely<Database> | Transaction<Database>;

export function id(value: unknown): number {
  return typeof value === 'number' ? value : Number(value);
}

export function idOrNull(value: unknown): number | null {
  return value === null || value === undefined ? null : id(value);
}

export function iso(value: unknown): string | null {
  if (value === null || value === undefined) return null;
  return value instanceof Date ? value.toISOString() : new Date(String(value)).toISOString();
}

/** Rows grouped by their counterparty id, each row turned into its view; input order is kept within a group. */
export function groupByCounterparty<R extends { counterparty_id: unknown }, V>(rows: readonly R[], view: (row: R) => V): Map<number, V[]> {
  const out = new Map<number, V[]>();
  for (const row of rows) {
    const key = id(row.counterparty_id);
    const list = out.get(key);
    if (list) list.push(view(row));
    else out.set(key, [view(row)]);
  }
  return out;
}
