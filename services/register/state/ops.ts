/**
 * Row images of changes (ops): what a ChangeSet records for each insert, update and delete, and what a history
 * event's payload keeps so that replay from empty and exact undo are possible.
 */
import { COUNTERPARTY_COLUMNS, MENTION_COLUMNS, type Row, type StateTable } from './tables.ts';

export type Op =
  | { op: 'insert'; table: StateTable; row: Row }
  /** `refs`: the row's counterparty and mention columns at the time, so the event knows whose row it changed. */
  | { op: 'update'; table: StateTable; id: number; before: Row; after: Row; refs: Row }
  | { op: 'delete'; table: StateTable; row: Row };

/**
 * An int8 column of a row image (canonical: int8 as a number). Anything else is a corrupt image (an edited history
 * payload): refused here, naming the column, rather than written as a wrong id.
 */
export function intColumn(row: Row, column: string): number {
  const value = row[column];
  if (typeof value !== 'number') throw new Error(`row image: ${column} is ${JSON.stringify(value) ?? 'missing'}, expected an integer id`);
  return value;
}

/** The counterparty and mention columns of a row image (an update op's `refs`). */
export function refsOf(table: StateTable, row: Row): Row {
  const refs: Row = {};
  for (const column of [...COUNTERPARTY_COLUMNS[table], ...MENTION_COLUMNS[table]]) refs[column] = row[column];
  return refs;
}

/** The counterparty and mention ids a list of ops touched (both before and after images count). */
export function touchedBy(ops: readonly Op[]): { counterpartyIds: number[]; mentionIds: number[] } {
  const cps = new Set<number>();
  const mentions = new Set<number>();
  const collect = (table: StateTable, image: Row) => {
    for (const column of COUNTERPARTY_COLUMNS[table]) {
      const v = image[column];
      if (typeof v === 'number') cps.add(v);
    }
    for (const column of MENTION_COLUMNS[table]) {
      const v = image[column];
      if (typeof v === 'number') mentions.add(v);
    }
  };
  for (const op of ops) {
    if (op.op === 'update') {
      collect(op.table, { ...op.refs, id: op.id });
      collect(op.table, { id: op.id, ...op.before });
      collect(op.table, { id: op.id, ...op.after });
    } else {
      collect(op.table, op.row);
    }
  }
  const sorted = (s: Set<number>) => [...s].sort((a, b) => a - b);
  return { counterpartyIds: sorted(cps), mentionIds: sorted(mentions) };
}
