/**
 * Explanations: the evidence of one decision, stored once in its own append-only row and referenced by id from the
 * mention and the review item (migrations/20261205130000_explanation.ts). What a user reads of a mention or an item
 * is the body with the row's own evidence over it (`body || evidence`, as `composedEvidence` writes it in SQL).
 */
import { sql, type RawBuilder, type Transaction } from 'kysely';
import type { Database } from '../types.ts';
import { rowsJson } from './state-writes.ts';
import type { Queryable } from './util.ts';

type Body = Record<string, unknown>;

/**
 * The evidence a user reads of a row with `explanation_id` and `evidence` (alias `t`): jsonb concatenation gives the
 * object, key for key and in jsonb's key order, that was stored inline before explanations had their own rows.
 */
export function composedEvidence(alias: string): RawBuilder<Body> {
  return sql<Body>`coalesce((SELECT e.body FROM explanation e WHERE e.id = ${sql.ref(`${alias}.explanation_id`)}), '{}'::jsonb) || ${sql.ref(`${alias}.evidence`)}`;
}

/** The bodies of some explanations, by id. */
export async function explanationBodies(db: Queryable, ids: readonly number[]): Promise<Map<number, Body>> {
  const wanted = [...new Set(ids)];
  if (wanted.length === 0) return new Map();
  const rows = await db.selectFrom('explanation').select(['id', 'body']).where('id', 'in', wanted).execute();
  return new Map(rows.map((r) => [Number(r.id), r.body]));
}

/** Many explanations as one set-based write (a ChangeSet's flush, state/write-buffer.ts). */
export function insertExplanations(rows: readonly { id: number; body: Body }[]): RawBuilder<unknown> {
  return sql`INSERT INTO explanation (id, body) SELECT id, body FROM jsonb_populate_recordset(NULL::explanation, ${rowsJson(rows)}::jsonb)`;
}

/** A page of explanations in id order (a replay copies them before the events that reference them). */
export async function explanationPage(db: Queryable, afterId: number, limit: number): Promise<{ id: number; body: Body }[]> {
  const rows = await db.selectFrom('explanation').select(['id', 'body']).where('id', '>', afterId).orderBy('id').limit(limit).execute();
  return rows.map((r) => ({ id: Number(r.id), body: r.body }));
}

/** Copies explanations into another database, ids kept. */
export async function copyExplanations(trx: Transaction<Database>, rows: readonly { id: number; body: Body }[]): Promise<void> {
  if (rows.length > 0) await insertExplanations(rows).execute(trx);
}
