/**
 * API keys: `cpreg_<keyId>_<secret>`. The key id is public (shown in lists, logs may name it); the whole key is
 * shown once when it is created and stored only as its SHA-256 digest. A key with 256 bits of randomness needs
 * no slow password hash: the digest cannot be reversed and guessing is hopeless (common practice for
 * machine-generated tokens). Digests are compared with crypto.timingSafeEqual (constant time).
 */
import { createHash, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Kysely } from 'kysely';
import type { Database } from '../../../db/types.ts';
import { markWorkCommitted } from '../../../db/idempotency-scope.ts';
import { insertApiKey, markApiKeyRevoked, selectApiKey, selectApiKeys, selectApiKeyWithDigest, touchApiKeyLastUsed } from '../../../db/queries/api-keys.ts';
import { API_SCOPES, type ApiScope } from '../../../resolvers/vocabulary.ts';

export interface ApiKeyInfo {
  id: string;
  label: string;
  scope: ApiScope;
  createdAt: string;
  revokedAt: string | null;
  lastUsedAt: string | null;
}

export interface CreatedApiKey extends ApiKeyInfo {
  /** The whole key: shown once, never stored. */
  secret: string;
}

export const MAX_LABEL_LENGTH = 200;
const KEY_SHAPE = /^cpreg_(k[0-9a-f]{12})_[\w-]{43}$/;
/** A whole key anywhere in a text (so that no stored answer keeps one: services/api/auth/idempotency.ts). */
export const KEY_IN_TEXT = /cpreg_k[0-9a-f]{12}_[\w-]{43}/g;

/** Scopes nest: admin ⊇ write ⊇ read. */
export function scopeAllows(have: ApiScope, need: ApiScope): boolean {
  return API_SCOPES.indexOf(have) >= API_SCOPES.indexOf(need);
}

export function isApiScope(value: unknown): value is ApiScope {
  return typeof value === 'string' && (API_SCOPES as readonly string[]).includes(value);
}

export function digest(secret: string): string {
  return createHash('sha256').update(secret, 'utf8').digest('hex');
}

function toInfo(row: { id: string; label: string; scope: ApiScope; created_at: Date; revoked_at: Date | null; last_used_at: Date | null }): ApiKeyInfo {
  const iso = (d: Date | null): string | null => (d === null ? null : new Date(d).toISOString());
  return { id: row.id, label: row.label, scope: row.scope, createdAt: iso(row.created_at)!, revokedAt: iso(row.revoked_at), lastUsedAt: iso(row.last_used_at) };
}

export function checkLabel(label: unknown): string {
  if (typeof label !== 'string' || label.trim().length === 0) throw new RangeError('label: name the person or system the key is for');
  if (label.length > MAX_LABEL_LENGTH) throw new RangeError(`label: at most ${MAX_LABEL_LENGTH} characters`);
  return label.trim();
}

export async function createApiKey(db: Kysely<Database>, input: { scope: ApiScope; label: string }): Promise<CreatedApiKey> {
  if (!isApiScope(input.scope)) throw new RangeError(`scope: must be one of ${API_SCOPES.join(', ')}`);
  const label = checkLabel(input.label);
  const id = `k${randomBytes(6).toString('hex')}`;
  const secret = `cpreg_${id}_${randomBytes(32).toString('base64url')}`;
  const row = await db.transaction().execute(async (trx) => {
    const created = await insertApiKey(trx, { id, label, scope: input.scope, secretHash: digest(secret), createdAt: new Date() });
    // A retried POST /v1/keys whose answer was lost must not create a second key (db/idempotency-scope.ts).
    await markWorkCommitted(trx);
    return created;
  });
  return { ...toInfo(row), secret };
}

export async function listApiKeys(db: Kysely<Database>, options: { includeRevoked?: boolean } = {}): Promise<ApiKeyInfo[]> {
  return (await selectApiKeys(db, options)).map(toInfo);
}

export async function getApiKey(db: Kysely<Database>, id: string): Promise<ApiKeyInfo | undefined> {
  const row = await selectApiKey(db, id);
  return row ? toInfo(row) : undefined;
}

/** Revokes a key; answers undefined when no such key exists. Revoking twice keeps the first time. */
export async function revokeApiKey(db: Kysely<Database>, id: string): Promise<ApiKeyInfo | undefined> {
  await markApiKeyRevoked(db, id, new Date());
  return getApiKey(db, id);
}

/**
 * The active key a presented secret belongs to, or undefined. The lookup is by the public key id; the digest
 * comparison is constant-time, so timing does not reveal how much of a guessed secret was right.
 */
export async function verifyApiKey(db: Kysely<Database>, presented: string): Promise<ApiKeyInfo | undefined> {
  const match = KEY_SHAPE.exec(presented);
  if (!match) return undefined;
  const row = await selectApiKeyWithDigest(db, match[1]!);
  const expected = Buffer.from(row?.secret_hash ?? '0'.repeat(64), 'hex');
  const actual = Buffer.from(digest(presented), 'hex');
  const equal = timingSafeEqual(expected, actual);
  if (!row || !equal || row.revoked_at !== null) return undefined;
  return toInfo(row);
}

/** Records use at most once a minute per key, so that reads do not turn into writes. */
export async function touchApiKey(db: Kysely<Database>, id: string, at: Date): Promise<void> {
  await touchApiKeyLastUsed(db, id, at, 60_000);
}
