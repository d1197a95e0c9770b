/**
 * Rewrites the answers kept outside the register that may quote an erased person: idempotency records, job
 * parameters, results and plans, and the staged input of jobs still under way.
 */
import type { Transaction } from 'kysely';
import type { Database } from '../../db/types.ts';
import {
  lockIdempotencyAnswersToErase,
  lockJobChunksToErase,
  lockJobPartitionsToErase,
  lockJobsToErase,
  rewriteIdempotencyAnswer,
  rewriteJobChunk,
  rewriteJobJson,
  rewriteJobPartition,
} from '../../db/queries/erasure-writes.ts';
import { needlesOf, type Secrets } from './secrets.ts';

/** Answers kept for idempotent retries and job results may quote the person: rewritten too. */
export async function rewriteStoredAnswers(trx: Transaction<Database>, secrets: Secrets, replace: (value: unknown) => unknown): Promise<number> {
  let count = 0;
  const needles = needlesOf(secrets);
  for (const r of await lockIdempotencyAnswersToErase(trx, needles)) {
    await rewriteIdempotencyAnswer(trx, r.keyId, r.key, JSON.stringify(replace(r.response)));
    count++;
  }
  for (const j of await lockJobsToErase(trx, needles)) {
    await rewriteJobJson(trx, j.id, {
      params: JSON.stringify(replace(j.params)),
      result: j.result === null ? null : JSON.stringify(replace(j.result)),
      plan: j.plan === null ? null : JSON.stringify(replace(j.plan)),
    });
    count++;
  }
  // A job still under way holds its input (staged rows, partition items): the same replacement applies there.
  for (const c of await lockJobChunksToErase(trx, needles)) {
    await rewriteJobChunk(trx, c.jobId, c.chunkNo, JSON.stringify(replace(c.rows)));
    count++;
  }
  for (const p of await lockJobPartitionsToErase(trx, needles)) {
    await rewriteJobPartition(trx, p.jobId, p.partitionNo, {
      items: JSON.stringify(replace(p.items)),
      result: p.result === null ? null : JSON.stringify(replace(p.result)),
    });
    count++;
  }
  return count;
}
