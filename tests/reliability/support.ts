/** Helpers shared by the reliability suites. */
import { sql, type Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';

/** Every table of the public schema, every row as JSON, in a stable order. */
export async function dumpAllTables(db: Kysely<Database>): Promise<Record<string, string[]>> {
  const tables = await sql<{ table_name: string }>`
    SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE' ORDER BY table_name`.execute(db);
  const out: Record<string, string[]> = {};
  for (const { table_name } of tables.rows) {
    const rows = await sql<{ j: string }>`SELECT row_to_json(t)::text AS j FROM ${sql.table(table_name)} t`.execute(db);
    out[table_name] = rows.rows.map((r) => r.j).sort();
  }
  return out;
}
