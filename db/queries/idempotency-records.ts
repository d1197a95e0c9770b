/**
 * Idempotency-Key claims and their stored answers (services/api/auth/idempotency.ts): the `idempotency_record`
 * rows, one per (API key, Idempotency-Key).
 */
import type { IdempotencyRecord } from '../types.ts';
import type { Queryable } from './util.ts';

export interface IdempotencyClaimKey {
  keyId: string;
  key: string;
}

export async function deleteIdempotencyRecordsBefore(db: Queryable, before: Date): Promise<void> {
  await db.deleteFrom('idempotency_record').where('created_at', '<', before).execute();
}

/** Inserts the claim row; answers false when a row for the same key already exists (nothing written). */
export async function insertIdempotencyClaim(
  db: Queryable,
  claim: IdempotencyClaimKey & { method: string; path: string; hash: string; createdAt: Date },
): Promise<boolean> {
  const inserted = await db
    .insertInto('idempotency_record')
    .values({ key_id: claim.keyId, idempotency_key: claim.key, method: claim.method, path: claim.path, body_hash: claim.hash, created_at: claim.createdAt })
    .onConflict((oc) => oc.columns(['key_id', 'idempotency_key']).doNothing())
    .returning('key_id')
    .executeTakeFirst();
  return inserted !== undefined;
}

export async function selectIdempotencyRecord(db: Queryable, claim: IdempotencyClaimKey): Promise<IdempotencyRecord | undefined> {
  return db.selectFrom('idempotency_record').selectAll().where('key_id', '=', claim.keyId).where('idempotency_key', '=', claim.key).executeTakeFirst();
}

/**
 * Takes over an unanswered claim created at `createdAt` (its process died) by stamping it `now`; answers whether
 * this caller won (another instance may take it over at the same time).
 */
export async function takeOverIdempotencyClaim(db: Queryable, claim: IdempotencyClaimKey, createdAt: Date, now: Date): Promise<boolean> {
  const taken = await db
    .updateTable('idempotency_record')
    .set({ created_at: now })
    .where('key_id', '=', claim.keyId)
    .where('idempotency_key', '=', claim.key)
    .where('status_code', 'is', null)
    .where('created_at', '=', createdAt)
    .executeTakeFirst();
  return Number(taken.numUpdatedRows) === 1;
}

export async function updateIdempotencyAnswer(db: Queryable, claim: IdempotencyClaimKey, statusCode: number, responseJson: string): Promise<void> {
  await db
    .updateTable('idempotency_record')
    .set({ status_code: statusCode, response: responseJson })
    .where('key_id', '=', claim.keyId)
    .where('idempotency_key', '=', claim.key)
    .execute();
}

/** Deletes the claim; with `answered` false only while it holds no answer. */
export async function deleteIdempotencyClaim(db: Queryable, claim: IdempotencyClaimKey, options: { answered?: boolean } = {}): Promise<void> {
  let query = db.deleteFrom('idempotency_record').where('key_id', '=', claim.keyId).where('idempotency_key', '=', claim.key);
  if (!options.answered) query = query.where('status_code', 'is', null);
  await query.execute();
}
