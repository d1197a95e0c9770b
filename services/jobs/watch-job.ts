/** Follows a job until it ends, reporting its partitions as they finish (the CLI progress bar, tests). */
import type { Kysely } from 'kysely';
import { partitionTally, readJob, type JobRow, type PartitionTally } from '../../db/queries/jobs.ts';
import type { Database } from '../../db/types.ts';

export interface JobProgress {
  job: JobRow;
  partitions: PartitionTally;
}

export async function watchJob(
  db: Kysely<Database>,
  jobId: number,
  options: { onProgress?: (progress: JobProgress) => void; pollMs?: number; signal?: AbortSignal } = {},
): Promise<JobRow> {
  for (;;) {
    const job = await readJob(db, jobId);
    if (!job) throw new RangeError(`job ${jobId} does not exist`);
    options.onProgress?.({ job, partitions: await partitionTally(db, jobId) });
    if (job.status === 'finished' || job.status === 'failed') return job;
    if (options.signal?.aborted) return job;
    await new Promise((resolve) => setTimeout(resolve, options.pollMs ?? 500));
  }
}
