/**
 * One register write = one transaction. Rows are locked with SELECT … FOR UPDATE in id order (ChangeSet.lock);
 * a deadlock, a serialisation failure or a unique-key race with a concurrent request rolls everything back and
 * runs the whole function again (it re-reads what it needs), so a failed request changes nothing and two
 * overlapping requests both land. The ChangeSet's buffer is written before every commit.
 */
import type { RegisterContext } from './context.ts';
import { ChangeSet } from './state/change-set.ts';
import { assertNoTemporaryIds } from './state/id-pools.ts';
import { RegisterError } from './errors.ts';
import { markWorkCommitted } from '../../db/idempotency-scope.ts';

/** deadlock_detected, serialization_failure, unique_violation (a concurrent insert of the same key). */
const RETRYABLE = new Set(['40P01', '40001', '23505']);
const MAX_ATTEMPTS = 8;

export function pgErrorCode(error: unknown): string | undefined {
  const code = (error as { code?: unknown } | null)?.code;
  return typeof code === 'string' ? code : undefined;
}

export async function write<T>(ctx: RegisterContext, fn: (cs: ChangeSet) => Promise<T>): Promise<T> {
  let lastError: unknown;
  for (let attempt = 0; attempt < MAX_ATTEMPTS; attempt++) {
    try {
      return await ctx.db.transaction().execute(async (trx) => {
        const cs = new ChangeSet(trx, ctx.derived);
        const result = await fn(cs);
        // Whatever the writer left in the buffer is written before the commit: nothing it changed is lost.
        await cs.flush();
        assertNoTemporaryIds(result);
        // An idempotent API request's claim is stamped in the same commit as its work (db/idempotency-scope.ts).
        await markWorkCommitted(trx);
        return result;
      });
    } catch (error) {
      const code = pgErrorCode(error);
      if (!code || !RETRYABLE.has(code)) throw error;
      lastError = error;
      // Jittered back-off so that two colliding requests do not collide again in step.
      await new Promise((resolve) => setTimeout(resolve, 2 + Math.random() * 8 * (attempt + 1)));
    }
  }
  if (pgErrorCode(lastError) === '23505') {
    const detail = (lastError as { detail?: string; constraint?: string }).constraint ?? 'a unique key';
    throw new RegisterError('CONFLICT', `the change conflicts with existing data (${detail})`, {}, { cause: lastError });
  }
  throw new RegisterError(
    'TRANSACTION_RETRIES_EXHAUSTED',
    `the change collided with concurrent changes ${MAX_ATTEMPTS} times; try again`,
    {},
    { cause: lastError },
  );
}
