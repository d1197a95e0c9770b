/**
 * The three steps of every partitioned job, as queue handlers: plan → partitions (any number at once, on any
 * worker) → final pass. A step that throws is retried by the queue; when its last retry fails too, the job is
 * marked failed with the step's error, so that GET /v1/jobs/{id} never shows a dead job as running.
 */
import type { Delivery, JobQueue } from '../../db/job-queue.ts';
import { insertJob, readJob, updateJob } from '../../db/queries/jobs.ts';
import { JOB_STEPS, type JobDeps, type StepData } from './deps.ts';
import { finishContracts, planContracts, runContractsPartition } from './contracts-job.ts';
import { finishIngest } from './finish-ingest.ts';
import { planIngest } from './plan-ingest.ts';
import { runIngestPartition } from './run-ingest-partition.ts';
import { finishSweep, planSweep, runSweepPartition } from './sweep-job.ts';

/** The job kinds that run as partitioned jobs, with their steps. */
const KINDS = {
  ingest: { plan: planIngest, partition: runIngestPartition, finish: finishIngest },
  sweep: { plan: planSweep, partition: runSweepPartition, finish: finishSweep },
  contracts: { plan: planContracts, partition: runContractsPartition, finish: finishContracts },
} as const;

export type PartitionedKind = keyof typeof KINDS;

export function isPartitionedKind(kind: string): kind is PartitionedKind {
  return Object.hasOwn(KINDS, kind);
}

async function kindOf(deps: JobDeps, jobId: number): Promise<PartitionedKind | null> {
  const job = await readJob(deps.db, jobId);
  if (!job || !isPartitionedKind(job.kind)) return null;
  if (job.status === 'failed') return null;
  return job.kind;
}

/** Runs `step`; on the queue's last attempt a failure also fails the job. */
async function guarded(deps: JobDeps, name: string, data: StepData, delivery: Delivery, step: () => Promise<void>): Promise<void> {
  try {
    await step();
  } catch (error) {
    const last = delivery.retryCount >= delivery.retryLimit;
    deps.log(
      last ? 'error' : 'warn',
      { err: error, jobId: data.jobId, partition: data.partition, step: name, retry: delivery.retryCount },
      last ? 'job step failed for good' : 'job step failed; the queue retries it',
    );
    if (last)
      await updateJob(deps.db, data.jobId, {
        status: 'failed',
        error: `${name}${data.partition === undefined ? '' : ` of partition ${data.partition}`} failed: ${(error as Error).message}`,
      }).catch(() => undefined);
    throw error;
  }
}

export async function plan(deps: JobDeps, data: StepData): Promise<void> {
  const kind = await kindOf(deps, data.jobId);
  if (!kind) return;
  const planned = await KINDS[kind].plan(deps, data.jobId);
  // Queued again even when a retry finds the plan made: the first run may have died before queueing them all.
  for (let p = 0; p < planned.partitions; p++)
    await deps.queue.send(JOB_STEPS.partition, { jobId: data.jobId, partition: p }, { singletonKey: `${data.jobId}:${p}` });
  if (planned.partitions === 0) await deps.queue.send(JOB_STEPS.finish, { jobId: data.jobId }, { singletonKey: String(data.jobId) });
}

/** Makes this process take job steps from `queue` (a `cpreg worker`, or the embedded service itself). */
export async function workOnJobs(deps: JobDeps, options: { concurrency?: number } = {}): Promise<void> {
  const queue: JobQueue = deps.queue;
  await queue.work<StepData>(JOB_STEPS.plan, (data, delivery) => guarded(deps, 'planning', data, delivery, () => plan(deps, data)));
  await queue.work<StepData>(
    JOB_STEPS.partition,
    (data, delivery) =>
      guarded(deps, 'partition', data, delivery, async () => {
        const kind = await kindOf(deps, data.jobId);
        if (kind) await KINDS[kind].partition(deps, data.jobId, data.partition!);
      }),
    { concurrency: options.concurrency ?? 1 },
  );
  await queue.work<StepData>(JOB_STEPS.finish, (data, delivery) =>
    guarded(deps, 'final pass', data, delivery, async () => {
      const kind = await kindOf(deps, data.jobId);
      if (kind) await KINDS[kind].finish(deps, data.jobId);
    }),
  );
}

/** Submits a sweep as a partitioned job (the planner lists the counterparties when it runs). */
export async function submitSweepJob(deps: Pick<JobDeps, 'db' | 'queue'>, options: { actor: string; partitionSize?: number }): Promise<number> {
  const jobId = await insertJob(deps.db, {
    kind: 'sweep',
    actor: options.actor,
    status: 'queued',
    params: { partitioned: true, ...(options.partitionSize ? { partitionSize: options.partitionSize } : {}) },
  });
  await deps.queue.send(JOB_STEPS.plan, { jobId }, { singletonKey: String(jobId) });
  return jobId;
}
