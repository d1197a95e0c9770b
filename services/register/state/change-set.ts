/**
 * A ChangeSet is the only way the register writes its state tables. Inside one transaction it locks, reads and
 * changes rows, and records each change as a row image (Op). The ops then become the payload of one history
 * event (history/commit.ts), which is what makes replay from empty and exact undo possible.
 */
import { sql, type Kysely, type Transaction } from 'kysely';
import type { Database } from '../../../db/types.ts';
import { deepEqual } from './deep-equal.ts';
import { canonicalPatch, canonicalRow, COUNTERPARTY_COLUMNS, MENTION_COLUMNS, toDbValues } from './tables.ts';
import type { Row, StateTable } from './tables.ts';
import { syncDerived, type DerivedContext } from './derived.ts';

export type Op =
  | { op: 'insert'; table: StateTable; row: Row }
  /** `refs`: the row's counterparty and mention columns at the time, so the event knows whose row it changed. */
  | { op: 'update'; table: StateTable; id: number; before: Row; after: Row; refs: Row }
  | { op: 'delete'; table: StateTable; row: Row };

export type Db = Kysely<Database> | Transaction<Database>;

function rowKey(table: StateTable, id: number): string {
  return `${table}:${id}`;
}


export class ChangeSet {
  readonly ops: Op[] = [];
  /** Merged id → survivor, as found while locking (records.ts lockActive). */
  readonly aliases = new Map<number, number>();
  private readonly rows = new Map<string, Row>();

  constructor(
    readonly trx: Transaction<Database>,
    private readonly derived: DerivedContext,
  ) {}

  /**
   * Locks rows (SELECT … FOR UPDATE, in id order so that two transactions never wait on each other in a cycle)
   * and returns their canonical images, in id order. Missing ids are absent from the result.
   */
  async lock(table: StateTable, ids: number[]): Promise<Row[]> {
    const wanted = [...new Set(ids)].sort((a, b) => a - b);
    if (wanted.length === 0) return [];
    const result = await sql<Row>`SELECT * FROM ${sql.table(table)} WHERE id IN (${sql.join(wanted)}) ORDER BY id FOR UPDATE`.execute(
      this.trx,
    );
    const rows = result.rows.map((r) => canonicalRow(table, r));
    for (const row of rows) this.rows.set(rowKey(table, row.id as number), row);
    return rows;
  }

  /** The current image of one row, locking it on first use. */
  async get(table: StateTable, id: number): Promise<Row | undefined> {
    const cached = this.rows.get(rowKey(table, id));
    if (cached) return cached;
    const [row] = await this.lock(table, [id]);
    return row;
  }

  /** The image of a row this ChangeSet already read or wrote, without a query. */
  cached(table: StateTable, id: number): Row | undefined {
    return this.rows.get(rowKey(table, id));
  }

  async require(table: StateTable, id: number): Promise<Row> {
    const row = await this.get(table, id);
    if (!row) throw new Error(`${table} ${id} vanished inside its own transaction`);
    return row;
  }

  async insert(table: StateTable, values: Row): Promise<Row> {
    const result = await sql<Row>`INSERT INTO ${sql.table(table)} ${insertClause(toDbValues(table, values))} RETURNING *`.execute(
      this.trx,
    );
    const row = canonicalRow(table, result.rows[0]!);
    this.rows.set(rowKey(table, row.id as number), row);
    const op: Op = { op: 'insert', table, row };
    this.ops.push(op);
    await syncDerived(this.trx, op, this.derived);
    return row;
  }

  /** Changes the given columns; records only the columns whose value really changes. */
  async update(table: StateTable, id: number, patch: Row): Promise<Row> {
    const current = await this.require(table, id);
    const next = canonicalPatch(table, patch);
    const before: Row = {};
    const after: Row = {};
    for (const [column, value] of Object.entries(next)) {
      if (deepEqual(current[column], value)) continue;
      before[column] = current[column];
      after[column] = value;
    }
    if (Object.keys(after).length === 0) return current;
    await sql`UPDATE ${sql.table(table)} SET ${setClause(toDbValues(table, after))} WHERE id = ${id}`.execute(this.trx);
    const row = { ...current, ...after };
    this.rows.set(rowKey(table, id), row);
    const refs: Row = {};
    for (const column of [...COUNTERPARTY_COLUMNS[table], ...MENTION_COLUMNS[table]]) refs[column] = current[column];
    const op: Op = { op: 'update', table, id, before, after, refs };
    this.ops.push(op);
    await syncDerived(this.trx, op, this.derived);
    return row;
  }

  async delete(table: StateTable, id: number): Promise<Row> {
    const current = await this.require(table, id);
    const op: Op = { op: 'delete', table, row: current };
    // Derived rows go first: they reference the row being deleted.
    await syncDerived(this.trx, op, this.derived);
    await sql`DELETE FROM ${sql.table(table)} WHERE id = ${id}`.execute(this.trx);
    this.rows.delete(rowKey(table, id));
    this.ops.push(op);
    return current;
  }

  touched(): { counterpartyIds: number[]; mentionIds: number[] } {
    return touchedBy(this.ops);
  }
}

/** The counterparty and mention ids a list of ops touched (both before and after images count). */
export function touchedBy(ops: Op[]): { counterpartyIds: number[]; mentionIds: number[] } {
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

export function insertClause(values: Row) {
  const columns = Object.keys(values).filter((c) => values[c] !== undefined);
  return sql`(${sql.join(columns.map((c) => sql.ref(c)))}) VALUES (${sql.join(columns.map((c) => values[c]))})`;
}

export function setClause(values: Row) {
  return sql.join(Object.keys(values).map((c) => sql`${sql.ref(c)} = ${values[c]}`));
}
