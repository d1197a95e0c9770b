/**
 * Which idempotent request, if any, the code running now serves: the API's idempotency plugin opens a scope per
 * request (AsyncLocalStorage) and names its claim in it; a transaction that commits the request's work calls
 * `markWorkCommitted(trx)` last, so that the claim row says "the work is committed" atomically with the work. A
 * retry of a request whose answer was never stored (its process died between the commit and the answer) then
 * learns that the work was done instead of doing it again. Outside a request (CLI, jobs) it does nothing.
 */
import { AsyncLocalStorage } from 'node:async_hooks';
import type { Kysely, Transaction } from 'kysely';
import type { Database } from './types.ts';

export interface IdempotencyScope {
  claim?: { keyId: string; key: string };
}

const scope = new AsyncLocalStorage<IdempotencyScope>();

/** Runs `fn` (and everything it starts) inside a fresh scope. */
export function runInIdempotencyScope<T>(fn: () => T): T {
  return scope.run({}, fn);
}

/** The current request's scope, or undefined outside one. */
export function currentIdempotencyScope(): IdempotencyScope | undefined {
  return scope.getStore();
}

/** Inside the work's transaction: stamps the current request's claim (if any) as committed with it. */
export async function markWorkCommitted(trx: Transaction<Database> | Kysely<Database>): Promise<void> {
  const claim = scope.getStore()?.claim;
  if (!claim) return;
  await trx
    .updateTable('idempotency_record')
    .set({ work_committed_at: new Date() })
    .where('key_id', '=', claim.keyId)
    .where('idempotency_key', '=', claim.key)
    .where('work_committed_at', 'is', null)
    .execute();
}
