/**
 * Whole rows of the register's state tables by id, and the state as a whole: what replay and undo apply
 * (services/register/state/apply.ts) and what a replay check compares (services/register/state/snapshot.ts). Values
 * are ready for the driver (jsonb as JSON text); rows come back as the driver reads them.
 */
import { sql, type Transaction } from 'kysely';
import type { Database } from '../types.ts';
import { insertClause, setClause } from './state-writes.ts';
import type { Queryable } from './util.ts';

type Trx = Transaction<Database>;
type Values = Record<string, unknown>;

/** One row, locked. */
export async function rowForUpdate(trx: Trx, table: string, id: number): Promise<Values | undefined> {
  const result = await sql<Values>`SELECT * FROM ${sql.table(table)} WHERE id = ${id} FOR UPDATE`.execute(trx);
  return result.rows[0];
}

/** One row, not locked (a name whose keys are recomputed). */
export async function rowById(trx: Trx, table: string, id: number): Promise<Values | undefined> {
  const result = await sql<Values>`SELECT * FROM ${sql.table(table)} WHERE id = ${id}`.execute(trx);
  return result.rows[0];
}

export async function insertRow(trx: Trx, table: string, values: Values): Promise<void> {
  await sql`INSERT INTO ${sql.table(table)} ${insertClause(values)}`.execute(trx);
}

export async function updateRow(trx: Trx, table: string, id: number, values: Values): Promise<void> {
  await sql`UPDATE ${sql.table(table)} SET ${setClause(values)} WHERE id = ${id}`.execute(trx);
}

export async function deleteRow(trx: Trx, table: string, id: number): Promise<void> {
  await sql`DELETE FROM ${sql.table(table)} WHERE id = ${id}`.execute(trx);
}

/** Every row of a table in id order. */
export async function allRows(db: Queryable, table: string): Promise<Values[]> {
  const result = await sql<Values>`SELECT * FROM ${sql.table(table)} ORDER BY id`.execute(db);
  return result.rows;
}

/** Every blocking key, in (key, counterparty, name) order. */
export async function allBlockingKeys(db: Queryable): Promise<{ key: string; counterparty_id: number; name_id: number }[]> {
  const keys = await db.selectFrom('blocking_key').selectAll().orderBy('key').orderBy('counterparty_id').orderBy('name_id').execute();
  return keys.map((k) => ({ key: k.key, counterparty_id: Number(k.counterparty_id), name_id: Number(k.name_id) }));
}

/** Moves a table's id sequence past its largest id (after rows were inserted with their ids, as a replay does). */
export async function resetSequence(db: Queryable, table: string): Promise<void> {
  await sql`SELECT setval(pg_get_serial_sequence(${table}, 'id'), coalesce((SELECT max(id) FROM ${sql.table(table)}), 0) + 1, false)`.execute(db);
}
