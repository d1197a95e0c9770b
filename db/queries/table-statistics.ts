/**
 * The planner's statistics and the tables' sizes: refreshed after a bulk load (as autovacuum would in service) and
 * read for the benches' storage figures. Table names come from the caller's fixed lists, passed as identifiers.
 */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';

/** VACUUM ANALYZE of the whole database: visibility maps set (index-only scans) and statistics fresh. Not in a transaction. */
export async function vacuumAnalyze(db: Queryable): Promise<void> {
  await sql`VACUUM ANALYZE`.execute(db);
}

/** ANALYZE of one table, or of the whole database when none is named. */
export async function analyze(db: Queryable, table?: string): Promise<void> {
  await (table === undefined ? sql`ANALYZE` : sql`ANALYZE ${sql.table(table)}`).execute(db);
}

export interface TableSize {
  table: string;
  /** Table, indexes and TOAST. */
  bytes: number;
  /** Table and TOAST, without indexes. */
  tableBytes: number;
  indexBytes: number;
  rows: number;
}

/** Each table's size on disk and row count (PostgreSQL: the size functions are the server's). */
export async function tableSizes(db: Queryable, tables: readonly string[]): Promise<TableSize[]> {
  const sizes: TableSize[] = [];
  for (const table of tables) {
    const result = await sql<{ total: string; heap: string; idx: string; rows: string }>`
      SELECT pg_total_relation_size(${table}::regclass) AS total, pg_table_size(${table}::regclass) AS heap,
        pg_indexes_size(${table}::regclass) AS idx, (SELECT count(*) FROM ${sql.table(table)}) AS rows`.execute(db);
    const r = result.rows[0]!;
    sizes.push({ table, bytes: Number(r.total), tableBytes: Number(r.heap), indexBytes: Number(r.idx), rows: Number(r.rows) });
  }
  return sizes;
}
