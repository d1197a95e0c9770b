/**
 * Tables derived from the state tables and kept in step with them by every write, live, in undo and in replay:
 * blocking_key holds the candidate keys of every counterparty name, so that candidate lookup is an index range
 * scan. It is not in the history (it follows from the names and the key function) and can be rebuilt.
 */
import { sql, type Transaction } from 'kysely';
import type { Database } from '../../../db/types.ts';
import type { Op } from './change-set.ts';
import type { Row } from './tables.ts';

export interface DerivedContext {
  /** Candidate keys of one counterparty name (pure, deterministic). */
  nameKeys(name: { name: string; normalised: string; kind: string }): string[];
}

export async function insertNameKeys(trx: Transaction<Database>, row: Row, derived: DerivedContext): Promise<void> {
  const keys = [...new Set(derived.nameKeys(row as { name: string; normalised: string; kind: string }))];
  if (keys.length === 0) return;
  await trx
    .insertInto('blocking_key')
    .values(keys.map((key) => ({ key, counterparty_id: row.counterparty_id as number, name_id: row.id as number })))
    .onConflict((oc) => oc.doNothing())
    .execute();
}

export async function syncDerived(trx: Transaction<Database>, op: Op, derived: DerivedContext): Promise<void> {
  if (op.table !== 'counterparty_name') return;
  if (op.op === 'insert') {
    await insertNameKeys(trx, op.row, derived);
  } else if (op.op === 'delete') {
    await trx
      .deleteFrom('blocking_key')
      .where('name_id', '=', op.row.id as number)
      .execute();
  } else {
    if ('name' in op.after || 'normalised' in op.after) {
      // The text changed: recompute its keys.
      await trx.deleteFrom('blocking_key').where('name_id', '=', op.id).execute();
      const result = await sql<Row>`SELECT * FROM counterparty_name WHERE id = ${op.id}`.execute(trx);
      if (result.rows[0]) await insertNameKeys(trx, { ...result.rows[0], id: op.id }, derived);
    } else if ('counterparty_id' in op.after) {
      await trx
        .updateTable('blocking_key')
        .set({ counterparty_id: op.after.counterparty_id as number })
        .where('name_id', '=', op.id)
        .execute();
    }
  }
}
