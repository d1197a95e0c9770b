/**
 * API keys (services/api/auth/keys.ts): the `api_key` rows. The secret itself is never here, only its digest;
 * the service turns rows into the public view.
 */
import type { ApiKey } from '../types.ts';
import type { Queryable } from './util.ts';

/** An api_key row without its digest: what lists and single reads show. */
export type ApiKeyListRow = Omit<ApiKey, 'secret_hash'>;

export async function insertApiKey(
  db: Queryable,
  key: { id: string; label: string; scope: ApiKey['scope']; secretHash: string; createdAt: Date },
): Promise<ApiKey> {
  return db
    .insertInto('api_key')
    .values({ id: key.id, label: key.label, scope: key.scope, secret_hash: key.secretHash, created_at: key.createdAt })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/** Keys in creation order (then id); revoked ones only when asked for. */
export async function selectApiKeys(db: Queryable, options: { includeRevoked?: boolean } = {}): Promise<ApiKeyListRow[]> {
  let query = db.selectFrom('api_key').select(['id', 'label', 'scope', 'created_at', 'revoked_at', 'last_used_at']).orderBy('created_at').orderBy('id');
  if (!options.includeRevoked) query = query.where('revoked_at', 'is', null);
  return query.execute();
}

export async function selectApiKey(db: Queryable, id: string): Promise<ApiKeyListRow | undefined> {
  return db.selectFrom('api_key').select(['id', 'label', 'scope', 'created_at', 'revoked_at', 'last_used_at']).where('id', '=', id).executeTakeFirst();
}

/** The whole row, digest included: only for verifying a presented key. */
export async function selectApiKeyWithDigest(db: Queryable, id: string): Promise<ApiKey | undefined> {
  return db.selectFrom('api_key').selectAll().where('id', '=', id).executeTakeFirst();
}

/** Stamps a key revoked unless it already is (the first revocation time is kept). */
export async function markApiKeyRevoked(db: Queryable, id: string, at: Date): Promise<void> {
  await db.updateTable('api_key').set({ revoked_at: at }).where('id', '=', id).where('revoked_at', 'is', null).execute();
}

/** Records use when the last recorded use is older than `minIntervalMs` (so that reads do not turn into writes). */
export async function touchApiKeyLastUsed(db: Queryable, id: string, at: Date, minIntervalMs: number): Promise<void> {
  await db
    .updateTable('api_key')
    .set({ last_used_at: at })
    .where('id', '=', id)
    .where((eb) => eb.or([eb('last_used_at', 'is', null), eb('last_used_at', '<', new Date(at.getTime() - minIntervalMs))]))
    .execute();
}
