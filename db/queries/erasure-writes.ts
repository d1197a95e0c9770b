/**
 * The erasure's rewrites (services/forget): each "lock…" function selects FOR UPDATE the rows an erasure may
 * rewrite — those it owns by id, and any whose JSON text holds one of `needles` (the personal values, written as
 * JSON escapes them) — and each "rewrite…" function stores one replaced row. The service decides the replacement.
 */
import { sql } from 'kysely';
import type { Database } from '../types.ts';
import { containsAnyText } from './contains-any-text.ts';
import { id, type Queryable } from './util.ts';

type StateTableName = keyof Database;

/**
 * Rows of a state table that belong to the counterparties (or, for `mention`, are one of `mentionIds`) or that
 * quote a needle anywhere, in id order, locked.
 */
export async function lockStateRowsToErase(
  db: Queryable,
  table: StateTableName,
  counterpartyIds: readonly number[],
  mentionIds: readonly number[],
  needles: readonly string[],
): Promise<Record<string, unknown>[]> {
  const own =
    table === 'counterparty'
      ? sql`id IN (${sql.join([...counterpartyIds])})`
      : table === 'counterparty_name' || table === 'counterparty_identifier'
        ? sql`counterparty_id IN (${sql.join([...counterpartyIds])})`
        : table === 'mention' && mentionIds.length > 0
          ? sql`id IN (${sql.join([...mentionIds])})`
          : sql`false`;
  const result = await sql<
    Record<string, unknown>
  >`SELECT * FROM ${sql.table(table)} t WHERE ${own} OR ${containsAnyText(sql`row_to_json(t)::text`, needles)} ORDER BY id FOR UPDATE`.execute(db);
  return result.rows;
}

/** Stores the changed columns (already in their database form) of one state row. */
export async function rewriteStateRow(db: Queryable, table: StateTableName, rowId: number, values: Record<string, unknown>): Promise<void> {
  await db
    .updateTable(table as 'counterparty')
    .set(values as never)
    .where('id', '=', rowId)
    .execute();
}

export async function deleteBlockingKeysOfName(db: Queryable, nameId: number): Promise<void> {
  await db.deleteFrom('blocking_key').where('name_id', '=', nameId).execute();
}

/** History events naming the counterparties or mentions, or quoting a needle in their payload or reason; locked. */
export async function lockHistoryToErase(
  db: Queryable,
  counterpartyIds: readonly number[],
  mentionIds: readonly number[],
  needles: readonly string[],
): Promise<{ id: number; payload: unknown; reason: string | null }[]> {
  const result = await sql<{ id: number; payload: unknown; reason: string | null }>`
    SELECT id, payload, reason FROM history_event
    WHERE counterparty_ids && ${sql.val([...counterpartyIds])}::bigint[]
      ${mentionIds.length > 0 ? sql`OR mention_ids && ${sql.val([...mentionIds])}::bigint[]` : sql``}
      OR ${containsAnyText(sql`payload::text`, needles)}
      OR ${containsAnyText(sql`coalesce(reason, '')`, needles)}
    ORDER BY id FOR UPDATE`.execute(db);
  return result.rows.map((r) => ({ id: id(r.id), payload: typeof r.payload === 'string' ? JSON.parse(r.payload) : r.payload, reason: r.reason }));
}

/** Lets this transaction alone rewrite history rows: the append-only trigger lets rows through only with it set. */
export async function allowHistoryRewrite(db: Queryable): Promise<void> {
  await sql`SELECT set_config('cpreg.history_rewrite', 'on', true)`.execute(db);
}

export async function rewriteHistoryEvent(db: Queryable, eventId: number, payloadJson: string, reason: string | null): Promise<void> {
  await db.updateTable('history_event').set({ payload: payloadJson, reason }).where('id', '=', eventId).execute();
}

/** Explanations (the evidence of decisions, stored once) quoting a needle; body parsed; locked. */
export async function lockExplanationsToErase(db: Queryable, needles: readonly string[]): Promise<{ id: number; body: unknown }[]> {
  if (needles.length === 0) return [];
  const result = await sql<{ id: unknown; body: unknown }>`
    SELECT id, body FROM explanation WHERE ${containsAnyText(sql`body::text`, needles)} ORDER BY id FOR UPDATE`.execute(db);
  return result.rows.map((r) => ({ id: id(r.id), body: typeof r.body === 'string' ? JSON.parse(r.body) : r.body }));
}

/** Stores a rewritten explanation (append-only like the history: only with allowHistoryRewrite). */
export async function rewriteExplanation(db: Queryable, explanationId: number, bodyJson: string): Promise<void> {
  await db.updateTable('explanation').set({ body: bodyJson }).where('id', '=', explanationId).execute();
}

const parsed = (v: unknown): unknown => (typeof v === 'string' ? JSON.parse(v) : v);

/** Stored idempotent answers quoting a needle; response parsed; locked. */
export async function lockIdempotencyAnswersToErase(db: Queryable, needles: readonly string[]): Promise<{ keyId: string; key: string; response: unknown }[]> {
  const result = await sql<{ key_id: string; idempotency_key: string; response: unknown }>`
    SELECT key_id, idempotency_key, response FROM idempotency_record WHERE response IS NOT NULL AND ${containsAnyText(sql`response::text`, needles)} FOR UPDATE`.execute(
    db,
  );
  return result.rows.map((r) => ({ keyId: r.key_id, key: r.idempotency_key, response: parsed(r.response) }));
}

export async function rewriteIdempotencyAnswer(db: Queryable, keyId: string, key: string, responseJson: string): Promise<void> {
  await db.updateTable('idempotency_record').set({ response: responseJson }).where('key_id', '=', keyId).where('idempotency_key', '=', key).execute();
}

/** Jobs whose params, result or plan quote a needle; JSON parsed; locked. */
export async function lockJobsToErase(db: Queryable, needles: readonly string[]): Promise<{ id: number; params: unknown; result: unknown; plan: unknown }[]> {
  const result = await sql<{ id: number; params: unknown; result: unknown; plan: unknown }>`
    SELECT id, params, result, plan FROM job WHERE ${containsAnyText(sql`coalesce(result::text, '') || params::text || coalesce(plan::text, '')`, needles)} FOR UPDATE`.execute(
    db,
  );
  return result.rows.map((j) => ({
    id: id(j.id),
    params: parsed(j.params),
    result: j.result === null ? null : parsed(j.result),
    plan: j.plan === null ? null : parsed(j.plan),
  }));
}

/** Stores a job's rewritten JSON columns (null stays null). */
export async function rewriteJobJson(db: Queryable, jobId: number, json: { params: string; result: string | null; plan: string | null }): Promise<void> {
  await db.updateTable('job').set(json).where('id', '=', jobId).execute();
}

/** Staged job input quoting a needle; rows parsed; locked. */
export async function lockJobChunksToErase(db: Queryable, needles: readonly string[]): Promise<{ jobId: number; chunkNo: number; rows: unknown }[]> {
  const result = await sql<{ job_id: number; chunk_no: number; rows: unknown }>`
    SELECT job_id, chunk_no, rows FROM job_chunk WHERE ${containsAnyText(sql`rows::text`, needles)} FOR UPDATE`.execute(db);
  return result.rows.map((c) => ({ jobId: id(c.job_id), chunkNo: c.chunk_no, rows: parsed(c.rows) }));
}

export async function rewriteJobChunk(db: Queryable, jobId: number, chunkNo: number, rowsJson: string): Promise<void> {
  await db.updateTable('job_chunk').set({ rows: rowsJson }).where('job_id', '=', jobId).where('chunk_no', '=', chunkNo).execute();
}

/** Job partitions whose items or result quote a needle; JSON parsed; locked. */
export async function lockJobPartitionsToErase(
  db: Queryable,
  needles: readonly string[],
): Promise<{ jobId: number; partitionNo: number; items: unknown; result: unknown }[]> {
  const result = await sql<{ job_id: number; partition_no: number; items: unknown; result: unknown }>`
    SELECT job_id, partition_no, items, result FROM job_partition WHERE ${containsAnyText(sql`items::text || coalesce(result::text, '')`, needles)} FOR UPDATE`.execute(
    db,
  );
  return result.rows.map((p) => ({
    jobId: id(p.job_id),
    partitionNo: p.partition_no,
    items: parsed(p.items),
    result: p.result === null ? null : parsed(p.result),
  }));
}

export async function rewriteJobPartition(db: Queryable, jobId: number, partitionNo: number, json: { items: string; result: string | null }): Promise<void> {
  await db.updateTable('job_partition').set(json).where('job_id', '=', jobId).where('partition_no', '=', partitionNo).execute();
}
