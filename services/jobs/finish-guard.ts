/**
 * When a job's final pass may run, and who queues it. The last partition to finish queues the final pass; a final
 * pass delivered early (a resumed job, a duplicate delivery) finds work still open and leaves it to that partition.
 */
import { partitionTally, readJob, type JobRow } from '../../db/queries/jobs.ts';
import { JOB_STEPS, type JobDeps } from './deps.ts';

/** The job, when it is planned, not ended, and every partition is done; null otherwise. */
export async function readyToFinish(deps: JobDeps, jobId: number): Promise<JobRow | null> {
  const job = await readJob(deps.db, jobId);
  if (!job) throw new Error(`job ${jobId} does not exist`);
  if (job.status === 'finished' || job.status === 'failed' || !job.plan) return null;
  const tally = await partitionTally(deps.db, jobId);
  return tally.done === tally.total ? job : null;
}

/** Queues the final pass once every partition is done (the job row lock orders concurrent last partitions). */
export async function queueFinishWhenAllDone(deps: JobDeps, jobId: number): Promise<void> {
  const allDone = await deps.db.transaction().execute(async (trx) => {
    await readJob(trx, jobId, { forUpdate: true });
    const tally = await partitionTally(trx, jobId);
    return tally.done === tally.total;
  });
  if (allDone) await deps.queue.send(JOB_STEPS.finish, { jobId }, { singletonKey: String(jobId) });
}
