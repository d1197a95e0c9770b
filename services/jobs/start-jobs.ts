/**
 * Connects a process to the job queue of its database: on PostgreSQL the shared pg-boss queue (db/pg-boss-queue.ts),
 * on the embedded database an in-process queue. With `work`, the process also takes job steps (a `cpreg worker`;
 * `cpreg serve` on the embedded database; `cpreg serve --work` on PostgreSQL). Without it, it only submits jobs
 * and reads their progress, and the API process holds no job state of its own.
 */
import { hostname } from 'node:os';
import type { Kysely } from 'kysely';
import type { Backend } from '../../db/open-database.ts';
import { InProcessQueue } from '../../db/in-process-queue.ts';
import { queueOptionsFromEnv, type JobQueue, type QueueOptions } from '../../db/job-queue.ts';
import type { Database } from '../../db/types.ts';
import { createRegisterContext, type RegisterContext } from '../register/context.ts';
import type { JobDeps, JobHooks } from './deps.ts';
import { JOB_STEPS } from './deps.ts';
import { workOnJobs } from './steps.ts';
import { startWatchdog } from './watchdog.ts';
import { unfinishedJobs, unfinishedPartitions, updateJob } from '../../db/queries/jobs.ts';

export interface StartJobsOptions {
  db: Kysely<Database>;
  backend: Backend;
  /** The PostgreSQL URL (required on PostgreSQL: the queue keeps its own connection pool). */
  url?: string;
  /** Take job steps in this process. */
  work: boolean;
  /** Partitions run at once in this process. Default 1. */
  concurrency?: number;
  ctx?: RegisterContext;
  log?: JobDeps['log'];
  /** Queue options; default from the environment (queueOptionsFromEnv), then QUEUE_DEFAULTS. */
  queueOptions?: QueueOptions;
  worker?: string;
  /** Use the in-process queue even on PostgreSQL (tests, one-process tools). Default false. */
  inProcess?: boolean;
  /** How often the job watchdog looks for steps the queue gave up (watchdog.ts). Default WATCHDOG_INTERVAL_MS. */
  watchdogIntervalMs?: number;
  hooks?: JobHooks;
}

export interface Jobs {
  queue: JobQueue;
  deps: JobDeps;
  stop(): Promise<void>;
}

export async function startJobs(options: StartJobsOptions): Promise<Jobs> {
  const log: JobDeps['log'] = options.log ?? (() => undefined);
  const queueOptions = options.queueOptions ?? queueOptionsFromEnv();
  let queue: JobQueue;
  if (options.backend === 'postgres' && !options.inProcess) {
    if (!options.url) throw new Error('startJobs on PostgreSQL needs the database URL');
    // Loaded only here: pg-boss and the pg driver are about 40 modules the embedded service never needs.
    const { openPgBossQueue } = await import('../../db/pg-boss-queue.ts');
    queue = await openPgBossQueue(options.url, {
      ...queueOptions,
      supervise: options.work,
      onError: (error) => log('warn', { err: error }, 'job queue error'),
    });
  } else {
    queue = new InProcessQueue({ ...queueOptions, onError: (error, job) => log('warn', { err: error, queueJob: job.id }, `job step ${job.name} failed`) });
  }
  const deps: JobDeps = {
    db: options.db,
    ctx: options.ctx ?? createRegisterContext(options.db),
    queue,
    worker: options.worker ?? `${hostname()}:${process.pid}`,
    log,
    ...(options.hooks ? { hooks: options.hooks } : {}),
  };
  if (options.work) await workOnJobs(deps, { concurrency: options.concurrency ?? 1 });
  // The in-process queue forgets everything when its process stops: pick up where the last one left off.
  if (options.work && queue.kind === 'in-process' && options.backend !== 'postgres') await resumeUnfinishedJobs(deps);
  // A step given up by the queue after its worker died on every attempt fails its job (watchdog.ts).
  const watchdog = options.work ? startWatchdog(deps, options.watchdogIntervalMs) : undefined;
  return {
    queue,
    deps,
    stop: async () => {
      watchdog?.stop();
      await queue.stop({ graceful: true });
    },
  };
}

/**
 * Queues again the steps of partitioned jobs that a stopped process left unfinished. A job whose input was still
 * being read cannot be completed (the rest of its input is gone): it is marked failed, to be submitted again
 * (rows stored meanwhile count as already ingested).
 */
export async function resumeUnfinishedJobs(deps: JobDeps): Promise<number> {
  let resumed = 0;
  for (const row of await unfinishedJobs(deps.db)) {
    if (row.params.partitioned !== true) continue;
    const jobId = row.id;
    if (row.plan === null && row.progress.stage === 'staging') {
      await updateJob(deps.db, jobId, {
        status: 'failed',
        error: 'the process stopped while reading the input: submit it again (rows already stored count as already ingested)',
      });
      continue;
    }
    resumed++;
    if (row.plan === null) await deps.queue.send(JOB_STEPS.plan, { jobId });
    else {
      for (const p of await unfinishedPartitions(deps.db, jobId)) await deps.queue.send(JOB_STEPS.partition, { jobId, partition: p });
      await deps.queue.send(JOB_STEPS.finish, { jobId });
    }
  }
  return resumed;
}
