/** The whole register state, table by table in id order, as canonical rows: for replay checks, tests and verify. */
import { sql, type Kysely } from 'kysely';
import type { Database } from '../../../db/types.ts';
import { canonicalRow, STATE_TABLES, type Row, type StateTable } from './tables.ts';

export type StateSnapshot = Record<StateTable | 'blocking_key', Row[]>;

export async function stateSnapshot(db: Kysely<Database>): Promise<StateSnapshot> {
  const out = {} as StateSnapshot;
  for (const table of STATE_TABLES) {
    const result = await sql<Row>`SELECT * FROM ${sql.table(table)} ORDER BY id`.execute(db);
    out[table] = result.rows.map((r) => canonicalRow(table, r));
  }
  const keys = await db.selectFrom('blocking_key').selectAll().orderBy('key').orderBy('counterparty_id').orderBy('name_id').execute();
  out.blocking_key = keys.map((k) => ({ key: k.key, counterparty_id: Number(k.counterparty_id), name_id: Number(k.name_id) }));
  return out;
}
