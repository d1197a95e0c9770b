/** The whole register state, table by table in id order, as canonical rows: for replay checks, tests and verify. */
import type { Kysely } from 'kysely';
import { allBlockingKeys, allRows } from '../../../db/queries/state-rows.ts';
import type { Database } from '../../../db/types.ts';
import { canonicalRow, STATE_TABLES, type Row, type StateTable } from './tables.ts';

export type StateSnapshot = Record<StateTable | 'blocking_key', Row[]>;

export async function stateSnapshot(db: Kysely<Database>): Promise<StateSnapshot> {
  const out = {} as StateSnapshot;
  for (const table of STATE_TABLES) {
    out[table] = (await allRows(db, table)).map((r) => canonicalRow(table, r));
  }
  out.blocking_key = await allBlockingKeys(db);
  return out;
}
