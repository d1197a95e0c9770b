/**
 * The SQL of the register's writes to its state tables (services/register/state/change-set.ts): row locks, ids
 * drawn from the tables' sequences, and the set-based statements a ChangeSet's buffer is written with. Values
 * are canonical row images (services/register/state/tables.ts): jsonb as JSON, timestamps as ISO text.
 */
import { sql, type RawBuilder, type Transaction } from 'kysely';
import type { Database } from '../types.ts';

type Trx = Transaction<Database>;
type Values = Record<string, unknown>;

/** Locks rows of one table in id order (so that two transactions never wait on each other in a cycle). */
export async function lockRows(trx: Trx, table: string, ids: readonly number[]): Promise<Values[]> {
  const result = await sql<Values>`SELECT * FROM ${sql.table(table)} WHERE id IN (${sql.join(ids)}) ORDER BY id FOR UPDATE`.execute(trx);
  return result.rows;
}

/** Locks every name of these counterparties, in id order. */
export async function lockNamesOf(trx: Trx, counterpartyIds: readonly number[]): Promise<Values[]> {
  const result = await sql<Values>`SELECT * FROM counterparty_name WHERE counterparty_id IN (${sql.join(counterpartyIds)}) ORDER BY id FOR UPDATE`.execute(trx);
  return result.rows;
}

/** Ids drawn from the sequences of several tables in one statement, per table in ascending order. */
export async function drawIds<T extends string>(trx: Trx, counts: ReadonlyMap<T, number>): Promise<Map<T, number[]>> {
  const tables = [...counts.keys()].filter((t) => counts.get(t)! > 0);
  const out = new Map<T, number[]>(tables.map((t) => [t, []]));
  if (tables.length === 0) return out;
  return idsByTable(tables, (await drawnIds(tables, counts).execute(trx)).rows);
}

/** One row (t, id) per id drawn, `counts` per table (a query to run or to nest). */
function drawnIds<T extends string>(tables: readonly T[], counts: ReadonlyMap<T, number>) {
  return sql<{ t: T; id: unknown }>`
    SELECT t, nextval(pg_get_serial_sequence(t, 'id')) AS id
    FROM unnest(${sql.val([...tables])}::text[], ${sql.val(tables.map((t) => counts.get(t)!))}::int[]) AS k(t, n), generate_series(1, k.n)`;
}

/** Drawn ids per table, in ascending order. */
function idsByTable<T extends string>(tables: readonly T[], drawn: readonly { t: T; id: unknown }[]): Map<T, number[]> {
  const out = new Map<T, number[]>(tables.map((t) => [t, []]));
  for (const row of drawn) out.get(row.t)!.push(Number(row.id));
  for (const ids of out.values()) ids.sort((a, b) => a - b);
  return out;
}

/** One id from a table's sequence. */
export async function nextId(trx: Trx, table: string): Promise<number> {
  const result = await sql<{ id: string | number }>`SELECT nextval(pg_get_serial_sequence(${table}, 'id')) AS id`.execute(trx);
  return Number(result.rows[0]!.id);
}

export async function deleteById(trx: Trx, table: string, id: number): Promise<void> {
  await sql`DELETE FROM ${sql.table(table)} WHERE id = ${id}`.execute(trx);
}

/** One set-based write, to be run alone or with others in one statement (`runWrites`). */
export type SetWrite = RawBuilder<unknown>;

const LONE_SURROGATE_ESCAPE = /\\ud[89a-f]/;

/**
 * Rows as the JSON text the set-based writes read. A string holding a lone surrogate (half of a character outside
 * the Basic Multilingual Plane, cut by code that counted UTF-16 units) is written with U+FFFD in its place, as a
 * text parameter is when the driver encodes it as UTF-8; JSON.stringify would write it as an escape that the
 * database's JSON parser refuses ("Unicode low surrogate must follow a high surrogate"), failing the whole write.
 */
export function rowsJson(rows: readonly object[]): string {
  // A replacer costs a call per value on every flush; JSON.stringify escapes a surrogate only when it is lone
  // (ECMA-262 QuoteJSONString: lowercase \udXXX), so plain text without such an escape needs no second pass. A
  // literal backslash-u in a name can match too: it only costs the careful pass, which writes the same text.
  const plain = JSON.stringify(rows);
  if (!LONE_SURROGATE_ESCAPE.test(plain)) return plain;
  return JSON.stringify(rows, (_key, value: unknown) => (typeof value === 'string' && !wellFormed(value) ? toWellFormed(value) : value));
}

// ES2024 string methods (Node 20 has them; the ES2023 lib in tsconfig does not declare them).
const wellFormed = (text: string): boolean => (text as unknown as { isWellFormed(): boolean }).isWellFormed();
const toWellFormed = (text: string): string => (text as unknown as { toWellFormed(): string }).toWellFormed();

/** Inserts many rows (every column named). */
export function insertRows(table: string, columns: readonly string[], rows: readonly Values[]): SetWrite {
  const cols = sql.join(columns.map((c) => sql.ref(c)));
  return sql`INSERT INTO ${sql.table(table)} (${cols}) SELECT ${cols} FROM jsonb_populate_recordset(NULL::${sql.table(table)}, ${rowsJson(rows)}::jsonb)`;
}

/**
 * Inserts events whose ids the statement draws itself, in the order of `rows` (nextval per row of the JSON array, in
 * array order), answering them (RETURNING id). Drawn in the write itself: after every lock its transaction took.
 */
export function insertDrawingIds(table: string, columns: readonly string[], rows: readonly Values[]): SetWrite {
  const cols = sql.join(columns.map((c) => sql.ref(c)));
  return sql`INSERT INTO ${sql.table(table)} (id, ${cols}) SELECT nextval(pg_get_serial_sequence(${table}, 'id')), ${cols}
    FROM jsonb_populate_recordset(NULL::${sql.table(table)}, ${rowsJson(rows)}::jsonb) RETURNING id`;
}

/** Sets the same columns of many rows (each row carries its id). */
export function updateRows(table: string, columns: readonly string[], rows: readonly Values[]): SetWrite {
  return sql`UPDATE ${sql.table(table)} AS t SET ${sql.join(columns.map((c) => sql`${sql.ref(c)} = r.${sql.ref(c)}`))}
    FROM jsonb_populate_recordset(NULL::${sql.table(table)}, ${rowsJson(rows)}::jsonb) AS r WHERE t.id = r.id`;
}

/** Blocking keys of names (a key already there stays). */
export function insertBlockingKeys(keys: readonly { key: string; counterparty_id: number; name_id: number }[]): SetWrite {
  return sql`INSERT INTO blocking_key (key, counterparty_id, name_id)
    SELECT key, counterparty_id, name_id FROM jsonb_populate_recordset(NULL::blocking_key, ${rowsJson(keys)}::jsonb)
    ON CONFLICT DO NOTHING`;
}

/**
 * Runs set-based writes as ONE statement (one round trip), each a data-modifying WITH query. They touch different
 * rows; foreign keys are checked at the end of the statement, so a row may refer to one inserted beside it.
 */
export async function runWrites(trx: Trx, writes: readonly SetWrite[]): Promise<void> {
  if (writes.length === 0) return;
  if (writes.length === 1) {
    await writes[0]!.execute(trx);
    return;
  }
  const parts = writes.map((w, i) => sql`${sql.raw(`w${i}`)} AS (${w})`);
  await sql`WITH ${sql.join(parts)} SELECT 1`.execute(trx);
}

/** As runWrites, with a last write that answers ids (insertDrawingIds): answers them in ascending order. */
export async function runWritesReturning(trx: Trx, writes: readonly SetWrite[], returning: SetWrite): Promise<number[]> {
  const parts = [...writes, returning].map((w, i) => sql`${sql.raw(`w${i}`)} AS (${w})`);
  const result = await sql<{ id: unknown }>`WITH ${sql.join(parts)} SELECT id FROM ${sql.raw(`w${writes.length}`)} ORDER BY id`.execute(trx);
  return result.rows.map((r) => Number(r.id));
}

/**
 * Draws ids (as drawIds) and locks the rows a write is about to change, in one statement: counterparties by id,
 * then every name of some counterparties, each in id order (as lockRows and lockNamesOf, in the order the register
 * always locks them), then the ids. Rows are answered as JSON images (timestamps as text, as canonicalRow takes).
 */
export async function drawIdsAndLock<T extends string>(
  trx: Trx,
  counts: ReadonlyMap<T, number>,
  lock: { counterparties: readonly number[]; namesOf: readonly number[] },
): Promise<{ ids: Map<T, number[]>; counterparties: Values[]; names: Values[] }> {
  const tables = [...counts.keys()].filter((t) => counts.get(t)! > 0);
  const result = await sql<{ counterparties: Values[]; names: Values[]; ids: [T, unknown][] }>`
    SELECT
      (SELECT coalesce(json_agg(row_to_json(c) ORDER BY c.id), '[]'::json)
        FROM (SELECT * FROM counterparty WHERE id = ANY(${sql.val([...lock.counterparties])}::bigint[]) ORDER BY id FOR UPDATE) c) AS counterparties,
      (SELECT coalesce(json_agg(row_to_json(n) ORDER BY n.id), '[]'::json)
        FROM (SELECT * FROM counterparty_name WHERE counterparty_id = ANY(${sql.val([...lock.namesOf])}::bigint[]) ORDER BY id FOR UPDATE) n) AS names,
      (SELECT coalesce(json_agg(json_build_array(d.t, d.id)), '[]'::json) FROM (${drawnIds(tables, counts)}) d) AS ids`.execute(trx);
  const row = result.rows[0]!;
  const ids = idsByTable(
    tables,
    row.ids.map(([t, id]) => ({ t, id })),
  );
  return { ids, counterparties: row.counterparties, names: row.names };
}

export function insertClause(values: Values) {
  const columns = Object.keys(values).filter((c) => values[c] !== undefined);
  return sql`(${sql.join(columns.map((c) => sql.ref(c)))}) VALUES (${sql.join(columns.map((c) => values[c]))})`;
}

export function setClause(values: Values) {
  return sql.join(Object.keys(values).map((c) => sql`${sql.ref(c)} = ${values[c]}`));
}
