/**
 * Large inserts through COPY … FROM STDIN (PostgreSQL; the bulk loader, services/register/bulk-load.ts): the rows
 * are sent in COPY's text format on the connection of the caller's transaction (db/transaction-client.ts), one COPY
 * per table, with no SQL parameters to bind or JSON to unpack on the server. COPY fires the tables' triggers as an
 * INSERT does (blocking_key_count's statement-level triggers see the copied rows as their transition table) and
 * checks foreign keys at its end, so parents are copied before the rows that refer to them.
 */
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { PoolClient } from 'pg';
import { from as copyFrom } from 'pg-copy-streams';

export interface CopyTable {
  table: string;
  columns: readonly string[];
  /** Columns of type json/jsonb: their values are written as JSON text. */
  json?: readonly string[];
  rows: readonly Record<string, unknown>[];
}

/** Copies the rows into their table; answers how many the server stored. */
export async function copyRows(client: PoolClient, { table, columns, json = [], rows }: CopyTable): Promise<number> {
  if (rows.length === 0) return 0;
  const isJson = columns.map((c) => json.includes(c));
  const stream = client.query(copyFrom(`COPY ${quoteIdent(table)} (${columns.map(quoteIdent).join(', ')}) FROM STDIN`));
  await pipeline(Readable.from(copyTextChunks(table, columns, isJson, rows)), stream);
  return stream.rowCount;
}

/** The COPY text of the rows, in pieces of about 64 kB (each a Buffer: text is sent as UTF-8). */
function* copyTextChunks(table: string, columns: readonly string[], isJson: readonly boolean[], rows: readonly Record<string, unknown>[]): Generator<Buffer> {
  let piece = '';
  for (const row of rows) {
    piece += copyLine(columns.map((c, i) => copyField(row[c], isJson[i]!, `${table}.${c}`)));
    if (piece.length >= 65_536) {
      yield Buffer.from(piece, 'utf8');
      piece = '';
    }
  }
  if (piece.length > 0) yield Buffer.from(piece, 'utf8');
}

/** One line of COPY text: fields already escaped, separated by tabs. */
export function copyLine(fields: readonly string[]): string {
  return `${fields.join('\t')}\n`;
}

/** COPY text's null marker (the default of the text format). */
const NULL_FIELD = '\\N';

/**
 * One value as a field of COPY's text format (PostgreSQL manual, COPY, "Text Format"): null as \N; a backslash,
 * newline, carriage return or tab inside a value as its backslash escape, every other character as itself. A JSON
 * column's value is its JSON text (escaped the same way); an array of integers (a bigint[] column) an array literal.
 * `where` names the column in an error.
 */
export function copyField(value: unknown, json: boolean, where: string): string {
  if (value === null || value === undefined) return NULL_FIELD;
  if (json) return escapeCopyText(jsonText(value), where);
  if (typeof value === 'string') return escapeCopyText(value, where);
  if (typeof value === 'number' || typeof value === 'bigint') {
    if (typeof value === 'number' && !Number.isFinite(value)) throw new Error(`${where}: ${value} is not a number COPY can store`);
    return String(value);
  }
  if (typeof value === 'boolean') return value ? 't' : 'f';
  if (value instanceof Date) return value.toISOString();
  if (Array.isArray(value) && value.every((v) => Number.isSafeInteger(v))) return `{${value.join(',')}}`;
  throw new Error(`${where}: a value of this kind (${Array.isArray(value) ? 'array' : typeof value}) has no COPY text form here`);
}

const COPY_SPECIAL = /[\\\n\r\t]/;
const COPY_SPECIAL_ALL = /[\\\n\r\t]/g;
const COPY_ESCAPES: Record<string, string> = { '\\': '\\\\', '\n': '\\n', '\r': '\\r', '\t': '\\t' };

/**
 * A text value escaped for COPY. U+0000 is refused with the column named: PostgreSQL text cannot hold it (an
 * INSERT fails on it too). A lone surrogate needs nothing here: UTF-8 encoding writes U+FFFD in its place, as the
 * driver does for a text parameter.
 */
export function escapeCopyText(text: string, where: string): string {
  if (text.includes('\u0000')) throw new Error(`${where}: the value holds the character U+0000, which PostgreSQL text cannot store`);
  return COPY_SPECIAL.test(text) ? text.replace(COPY_SPECIAL_ALL, (c) => COPY_ESCAPES[c]!) : text;
}

const LONE_SURROGATE_ESCAPE = /\\ud[89a-f]/;

/**
 * JSON text for a jsonb column, with a lone surrogate written as U+FFFD: JSON.stringify escapes it (\udXXX), which
 * jsonb refuses. The same rule as the set-based writes' rowsJson (db/queries/state-writes.ts), so both paths store
 * the same value.
 */
export function jsonText(value: unknown): string {
  const plain = JSON.stringify(value);
  if (!LONE_SURROGATE_ESCAPE.test(plain)) return plain;
  return JSON.stringify(value, (_key, v: unknown) => (typeof v === 'string' ? toWellFormed(v) : v));
}

// ES2024 (Node 20 has it; the ES2023 lib in tsconfig does not declare it).
const toWellFormed = (text: string): string => (text as unknown as { toWellFormed(): string }).toWellFormed();

/** A table or column name as a quoted identifier (the names here are the schema's own, never input). */
function quoteIdent(name: string): string {
  return `"${name.replaceAll('"', '""')}"`;
}
