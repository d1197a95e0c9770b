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

/**
 * One row (t, id) per id drawn, `counts` per table (a query to run or to nest). `when`: a condition of the
 * statement it is nested in; false, nothing is drawn (nextval is not called at all).
 */
export function drawnIds<T extends string>(tables: readonly T[], counts: ReadonlyMap<T, number>, when: RawBuilder<unknown> = sql`true`) {
  return sql<{ t: T; id: unknown }>`
    SELECT t, nextval(pg_get_serial_sequence(t, 'id')) AS id
    FROM unnest(${sql.val([...tables])}::text[], ${sql.val(tables.map((t) => counts.get(t)!))}::int[]) AS k(t, n),
      generate_series(1, CASE WHEN ${when} THEN k.n ELSE 0 END)`;
}

/** Drawn ids per table, in ascending order. */
export function idsByTable<T extends string>(tables: readonly T[], drawn: readonly { t: T; id: unknown }[]): Map<T, number[]> {
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

/**
 * A counterparty id drawn by the write statement itself (`runWritesDrawing`): the rows hold a temporary id in its
 * place (state/id-pools.ts), replaced in their JSON text by the id the statement draws.
 */
export interface DrawnInWrite {
  temp: number;
}

/** The CTE of a write that draws a counterparty id (runWritesDrawing). */
const DRAWN_COUNTERPARTY = 'drawn_counterparty';

/**
 * The rows as a jsonb parameter, with the temporary counterparty id replaced by the one the statement draws. The
 * replace works on JSON text, so the temporary id's digits must occur only as that number: a string holding them
 * (a name "4503599627370497 Ltd") or another number spelling them is given a marker that the text does not hold.
 */
function rowsParam(rows: readonly object[], drawn?: DrawnInWrite): RawBuilder<unknown> {
  if (!drawn) return sql`${rowsJson(rows)}::jsonb`;
  let marked: readonly object[] = rows;
  for (let marker = drawn.temp, tries = 0; tries < 64; marker = Number.MAX_SAFE_INTEGER - tries++) {
    if (marker !== drawn.temp) marked = withNumber(rows, drawn.temp, marker) as object[];
    const text = rowsJson(marked);
    const digits = String(marker);
    const spelled = text.split(digits).length - 1;
    if (spelled === 0) return sql`${text}::jsonb`;
    if (spelled === countNumber(marked, marker)) return sql`replace(${text}, ${digits}, (SELECT id::text FROM ${sql.raw(DRAWN_COUNTERPARTY)}))::jsonb`;
  }
  throw new Error(`no marker found for the temporary id ${drawn.temp} (a defect)`);
}

/** A deep copy of a JSON value with every number `from` replaced by `to`. */
function withNumber(value: unknown, from: number, to: number): unknown {
  if (value === from) return to;
  if (Array.isArray(value)) return value.map((v) => withNumber(v, from, to));
  if (value !== null && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, withNumber(v, from, to)]));
  return value;
}

/** How many times a number occurs as a value in a JSON value. */
function countNumber(value: unknown, n: number): number {
  if (value === n) return 1;
  if (Array.isArray(value)) return value.reduce((sum: number, v) => sum + countNumber(v, n), 0);
  if (value !== null && typeof value === 'object') return Object.values(value).reduce((sum: number, v) => sum + countNumber(v, n), 0);
  return 0;
}

/** Inserts many rows (every column named). */
export function insertRows(table: string, columns: readonly string[], rows: readonly Values[], drawn?: DrawnInWrite): SetWrite {
  const cols = sql.join(columns.map((c) => sql.ref(c)));
  return sql`INSERT INTO ${sql.table(table)} (${cols}) SELECT ${cols} FROM jsonb_populate_recordset(NULL::${sql.table(table)}, ${rowsParam(rows, drawn)})`;
}

/**
 * Inserts events whose ids the statement draws itself, in the order of `rows` (nextval per row of the JSON array, in
 * array order), answering them (RETURNING id). Drawn in the write itself: after every lock its transaction took.
 */
export function insertDrawingIds(table: string, columns: readonly string[], rows: readonly Values[], drawn?: DrawnInWrite): SetWrite {
  const cols = sql.join(columns.map((c) => sql.ref(c)));
  return sql`INSERT INTO ${sql.table(table)} (id, ${cols}) SELECT nextval(pg_get_serial_sequence(${table}, 'id')), ${cols}
    FROM jsonb_populate_recordset(NULL::${sql.table(table)}, ${rowsParam(rows, drawn)}) RETURNING id`;
}

/** Sets the same columns of many rows (each row carries its id). */
export function updateRows(table: string, columns: readonly string[], rows: readonly Values[], drawn?: DrawnInWrite): SetWrite {
  return sql`UPDATE ${sql.table(table)} AS t SET ${sql.join(columns.map((c) => sql`${sql.ref(c)} = r.${sql.ref(c)}`))}
    FROM jsonb_populate_recordset(NULL::${sql.table(table)}, ${rowsParam(rows, drawn)}) AS r WHERE t.id = r.id`;
}

/** Blocking keys of names (a key already there stays). */
export function insertBlockingKeys(keys: readonly { key: string; counterparty_id: number; name_id: number }[], drawn?: DrawnInWrite): SetWrite {
  return sql`INSERT INTO blocking_key (key, counterparty_id, name_id)
    SELECT key, counterparty_id, name_id FROM jsonb_populate_recordset(NULL::blocking_key, ${rowsParam(keys, drawn)})
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

/**
 * As runWrites, in one statement that may also draw ids itself: the ids a last write answers (insertDrawingIds), in
 * ascending order, and a counterparty id, drawn once by the statement for the writes built with `DrawnInWrite`.
 */
export async function runWritesDrawing(
  trx: Trx,
  writes: readonly SetWrite[],
  draw: { returning?: SetWrite; counterparty: boolean },
): Promise<{ ids: number[]; counterparty: number | null }> {
  const all = draw.returning ? [...writes, draw.returning] : writes;
  const parts = all.map((w, i) => sql`${sql.raw(`w${i}`)} AS (${w})`);
  if (draw.counterparty) parts.unshift(sql`${sql.raw(DRAWN_COUNTERPARTY)} AS (SELECT nextval(pg_get_serial_sequence('counterparty', 'id')) AS id)`);
  // The drawn counterparty id is answered on every row (and a row with no ids when nothing else is returned).
  const counterparty = draw.counterparty ? sql`(SELECT id FROM ${sql.raw(DRAWN_COUNTERPARTY)})` : sql`NULL::bigint`;
  const answer = draw.returning
    ? sql`SELECT id, ${counterparty} AS counterparty FROM ${sql.raw(`w${writes.length}`)} ORDER BY id`
    : sql`SELECT NULL::bigint AS id, ${counterparty} AS counterparty`;
  const result = await sql<{ id: unknown; counterparty: unknown }>`WITH ${sql.join(parts)} ${answer}`.execute(trx);
  const first = result.rows[0];
  return {
    ids: draw.returning ? result.rows.map((r) => Number(r.id)) : [],
    counterparty: first && first.counterparty !== null ? Number(first.counterparty) : null,
  };
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
