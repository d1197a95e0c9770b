/**
 * Rewrites the state rows of one register table that hold an erased person's values, and rebuilds the blocking keys
 * of the names rewritten (their normalised form changed with them).
 */
import type { Transaction } from 'kysely';
import type { Database } from '../../db/types.ts';
import type { RegisterContext } from '../register/context.ts';
import { insertNameKeys } from '../register/state/derived.ts';
import { canonicalRow, toDbValues, type Row, type StateTable } from '../register/state/tables.ts';
import { deleteBlockingKeysOfName, lockStateRowsToErase, rewriteStateRow } from '../../db/queries/erasure-writes.ts';
import { needlesOf, type Secrets } from './secrets.ts';

export async function rewriteTable(
  trx: Transaction<Database>,
  table: StateTable,
  cluster: number[],
  mentionIds: number[],
  secrets: Secrets,
  replace: (value: unknown) => unknown,
): Promise<Row[]> {
  const rows = await lockStateRowsToErase(trx, table, cluster, mentionIds, needlesOf(secrets));
  const changed: Row[] = [];
  for (const raw of rows) {
    const before: Row = canonicalRow(table, raw);
    const after = replace(before) as Row;
    const patch: Row = {};
    for (const column of Object.keys(before)) if (JSON.stringify(before[column]) !== JSON.stringify(after[column])) patch[column] = after[column];
    if (Object.keys(patch).length === 0) continue;
    await rewriteStateRow(trx, table, before.id as number, toDbValues(table, patch));
    changed.push(after);
  }
  return changed;
}

export async function rebuildKeys(trx: Transaction<Database>, names: Row[], ctx: RegisterContext): Promise<void> {
  for (const row of names) {
    await deleteBlockingKeysOfName(trx, row.id as number);
    await insertNameKeys(trx, row, ctx.derived);
  }
}
