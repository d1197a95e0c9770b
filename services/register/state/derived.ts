/**
 * Tables derived from the state tables and kept in step with them by every write, live, in undo and in replay:
 * blocking_key holds the candidate keys of every counterparty name, so that candidate lookup is an index range
 * scan. It is not in the history (it follows from the names and the key function) and can be rebuilt.
 */
import type { Transaction } from 'kysely';
import { deleteKeysOfName, insertKeysOfName, moveKeysOfName } from '../../../db/queries/blocking-key-writes.ts';
import { rowById } from '../../../db/queries/state-rows.ts';
import type { Database } from '../../../db/types.ts';
import type { Op } from './change-set.ts';
import { intColumn } from './ops.ts';
import type { Row } from './tables.ts';

export interface DerivedContext {
  /** Candidate keys of one counterparty name (pure, deterministic). */
  nameKeys(name: { name: string; normalised: string; kind: string }): string[];
}

export async function insertNameKeys(trx: Transaction<Database>, row: Row, derived: DerivedContext): Promise<void> {
  const keys = [...new Set(derived.nameKeys(row as { name: string; normalised: string; kind: string }))];
  await insertKeysOfName(trx, keys, intColumn(row, 'counterparty_id'), intColumn(row, 'id'));
}

export async function syncDerived(trx: Transaction<Database>, op: Op, derived: DerivedContext): Promise<void> {
  if (op.table !== 'counterparty_name') return;
  if (op.op === 'insert') {
    await insertNameKeys(trx, op.row, derived);
  } else if (op.op === 'delete') {
    await deleteKeysOfName(trx, intColumn(op.row, 'id'));
  } else {
    if ('name' in op.after || 'normalised' in op.after) {
      // The text changed: recompute its keys.
      await deleteKeysOfName(trx, op.id);
      const row = await rowById(trx, 'counterparty_name', op.id);
      if (row) await insertNameKeys(trx, { ...row, id: op.id }, derived);
    } else if ('counterparty_id' in op.after) {
      await moveKeysOfName(trx, op.id, intColumn(op.after, 'counterparty_id'));
    }
  }
}
