/**
 * The image a row's values have once stored in PostgreSQL and read back: jsonb columns with jsonb's key order, so
 * that a buffered row's image (written later, set-based) is the one an immediate INSERT … RETURNING would give.
 */
import { columnKindsOf, type Row, type StateTable } from './tables.ts';

/** jsonb's key order: shorter keys first, then by bytes. */
function jsonbKeyOrder(a: string, b: string): number {
  const la = Buffer.byteLength(a);
  const lb = Buffer.byteLength(b);
  return la !== lb ? la - lb : Buffer.compare(Buffer.from(a), Buffer.from(b));
}

/** A JSON value as jsonb keeps it (built directly, by JSON's rules: objects' keys reordered, undefined members dropped, a Date as its ISO text). */
export function asJsonb(value: unknown): unknown {
  if (typeof value === 'number') return Number.isFinite(value) ? value + 0 : null; // JSON has no -0, NaN or ±Infinity
  if (Array.isArray(value)) return value.map((v) => (v === undefined || typeof v === 'function' ? null : asJsonb(v)));
  if (value === null || typeof value !== 'object') return value;
  const toJson = (value as { toJSON?: () => unknown }).toJSON;
  if (typeof toJson === 'function') return asJsonb(toJson.call(value));
  const out: Record<string, unknown> = {};
  for (const key of Object.keys(value).sort(jsonbKeyOrder)) {
    const member = (value as Record<string, unknown>)[key];
    if (member !== undefined && typeof member !== 'function') out[key] = asJsonb(member);
  }
  return out;
}

export function jsonbImage(table: StateTable, values: Row): Row {
  const kinds = columnKindsOf(table);
  const out: Row = { ...values };
  for (const [column, value] of Object.entries(values)) {
    if (!kinds[column]) throw new Error(`${table}.${column} is not a column of a register state table`);
    if (kinds[column] === 'json' && value !== null && value !== undefined) out[column] = asJsonb(value);
  }
  return out;
}
