/**
 * Rewrites the history events and the explanations of decisions that quote an erased person: the one permitted
 * rewrite of the append-only history (see forget.ts).
 */
import type { Transaction } from 'kysely';
import type { Database } from '../../db/types.ts';
import { allowHistoryRewrite, lockHistoryToErase, lockExplanationsToErase, rewriteExplanation, rewriteHistoryEvent } from '../../db/queries/erasure-writes.ts';
import { needlesOf, type Secrets } from './secrets.ts';

export async function rewriteHistory(
  trx: Transaction<Database>,
  cluster: number[],
  mentionIds: number[],
  secrets: Secrets,
  replace: (value: unknown) => unknown,
): Promise<number> {
  const rows = await lockHistoryToErase(trx, cluster, mentionIds, needlesOf(secrets));
  let count = 0;
  await allowHistoryRewrite(trx);
  for (const row of rows) {
    const payload = row.payload;
    const rewritten = replace(payload);
    const reason = row.reason === null ? null : (replace(row.reason) as string);
    if (JSON.stringify(rewritten) === JSON.stringify(payload) && reason === row.reason) continue;
    await rewriteHistoryEvent(trx, row.id, JSON.stringify(rewritten), reason);
    count++;
  }
  return count;
}

/**
 * The explanations of decisions (stored once, referenced by mentions, review items and the history's row images)
 * quoting the person, rewritten like the history they belong to. Runs after rewriteHistory (which allows the rewrite).
 */
export async function rewriteExplanations(trx: Transaction<Database>, secrets: Secrets, replace: (value: unknown) => unknown): Promise<number> {
  let count = 0;
  for (const row of await lockExplanationsToErase(trx, needlesOf(secrets))) {
    const rewritten = JSON.stringify(replace(row.body));
    if (rewritten === JSON.stringify(row.body)) continue;
    await rewriteExplanation(trx, row.id, rewritten);
    count++;
  }
  return count;
}
