/**
 * Applying recorded ops again: forward (replay from empty) or inverted (undo). Inversion checks that each row is
 * still exactly as the event left it before restoring it, so an undo never overwrites a change it did not make.
 */
import type { Transaction } from 'kysely';
import type { Database } from '../../../db/types.ts';
import { deepEqual } from './deep-equal.ts';
import { deleteRow as deleteById, insertRow as insertValues, rowForUpdate, updateRow as updateById } from '../../../db/queries/state-rows.ts';
import { intColumn, type Op } from './ops.ts';
import { syncDerived, type DerivedContext } from './derived.ts';
import { canonicalRow, toDbValues, type Row, type StateTable } from './tables.ts';

export class StateDriftError extends Error {
  constructor(
    readonly table: StateTable,
    readonly id: number,
    detail: string,
  ) {
    super(`${table} ${id} is no longer as the event left it (${detail})`);
    this.name = 'StateDriftError';
  }
}

async function readRow(trx: Transaction<Database>, table: StateTable, id: number): Promise<Row | undefined> {
  const row = await rowForUpdate(trx, table, id);
  return row ? canonicalRow(table, row) : undefined;
}

async function insertRow(trx: Transaction<Database>, table: StateTable, row: Row, derived: DerivedContext) {
  await insertValues(trx, table, toDbValues(table, row));
  await syncDerived(trx, { op: 'insert', table, row }, derived);
}

async function deleteRow(trx: Transaction<Database>, table: StateTable, row: Row, derived: DerivedContext) {
  await syncDerived(trx, { op: 'delete', table, row }, derived);
  await deleteById(trx, table, intColumn(row, 'id'));
}

async function updateRow(trx: Transaction<Database>, table: StateTable, id: number, values: Row, refs: Row, derived: DerivedContext) {
  await updateById(trx, table, id, toDbValues(table, values));
  await syncDerived(trx, { op: 'update', table, id, before: {}, after: values, refs }, derived);
}

/** Replays one op as it was first applied. */
export async function applyForward(trx: Transaction<Database>, op: Op, derived: DerivedContext): Promise<void> {
  if (op.op === 'insert') await insertRow(trx, op.table, op.row, derived);
  else if (op.op === 'delete') await deleteRow(trx, op.table, op.row, derived);
  else await updateRow(trx, op.table, op.id, op.after, op.refs, derived);
}

/** The op that takes the state back from after `op` to before it. */
export function invertOp(op: Op): Op {
  if (op.op === 'insert') return { op: 'delete', table: op.table, row: op.row };
  if (op.op === 'delete') return { op: 'insert', table: op.table, row: op.row };
  return { op: 'update', table: op.table, id: op.id, before: op.after, after: op.before, refs: op.refs };
}

/** Checks that the state is as `op` left it, then applies its inverse. Returns the inverse (for the undo event). */
export async function applyInverse(trx: Transaction<Database>, op: Op, derived: DerivedContext): Promise<Op> {
  const id = op.op === 'update' ? op.id : intColumn(op.row, 'id');
  const current = await readRow(trx, op.table, id);
  if (op.op === 'insert') {
    if (!current) throw new StateDriftError(op.table, id, 'the row it created is gone');
    if (!deepEqual(current, op.row)) throw new StateDriftError(op.table, id, 'the row it created has changed since');
  } else if (op.op === 'delete') {
    if (current) throw new StateDriftError(op.table, id, 'a row with the id it deleted exists again');
  } else {
    if (!current) throw new StateDriftError(op.table, id, 'the row it changed is gone');
    for (const [column, value] of Object.entries(op.after)) {
      if (!deepEqual(current[column], value)) throw new StateDriftError(op.table, id, `${column} has changed since`);
    }
  }
  const inverse = invertOp(op);
  await applyForward(trx, inverse, derived);
  return inverse;
}
