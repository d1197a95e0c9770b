/**
 * Glossary of partitioned jobs:
 *  - job: one request for batch work (an ingest, a sweep), a row in `job`, visible at GET /v1/jobs/{id};
 *  - stage: the job's input as read, stored in job_chunk until planned;
 *  - plan: the planner's cut of the job into partitions (job.plan), with the pairs that cross partitions;
 *  - partition: a part of the job that can run on its own, on any worker (job_partition);
 *  - final pass: after the last partition, the job's closing step (reconciles the crossing pairs, sums results).
 * Each step is a queue job (db/job-queue.ts) named in JOB_STEPS, carrying { jobId } or { jobId, partition }.
 */
import type { Kysely } from 'kysely';
import type { JobQueue } from '../../db/job-queue.ts';
import type { Database } from '../../db/types.ts';
import type { RegisterContext } from '../register/context.ts';

export const JOB_STEPS = { plan: 'cpreg-plan', partition: 'cpreg-partition', finish: 'cpreg-finish' } as const;

export interface StepData {
  jobId: number;
  partition?: number;
}

export interface JobDeps {
  db: Kysely<Database>;
  ctx: RegisterContext;
  queue: JobQueue;
  /** Who runs the steps, for job_partition.worker and the logs (default host:pid). */
  worker: string;
  log: (level: 'info' | 'warn' | 'error', fields: Record<string, unknown>, message: string) => void;
  /** Called by a step as it runs (tests make a step slow with it). */
  hooks?: JobHooks;
}

export interface JobHooks {
  /** Inside an ingest job's planning, before it reads the staged rows (not when the job is planned already). */
  planning?: (jobId: number) => Promise<void>;
}

/** Job options, each with its default. */
export interface PartitionSettings {
  /** Mentions per partition aimed at (whole clusters; a partition may be smaller). Default 2,000. */
  partitionSize: number;
  /** Staged rows per job_chunk. Default 5,000. */
  chunkSize: number;
  /** Counterparties per sweep partition. Default 2,000. */
  sweepPartitionSize: number;
}

export const PARTITION_DEFAULTS: PartitionSettings = { partitionSize: 2000, chunkSize: 5000, sweepPartitionSize: 2000 };

/**
 * The queue's expiry of an ingest job's planning step (db/job-queue.ts SendOptions.minExpireInSeconds). Planning is
 * one serial step whose time grows with the job (it blocks and scores the whole file: 160 s for 15,000 rows at a
 * load of 20 on 2 cores), where a partition's is bounded by the partition size; past the queue's expiry
 * (CPREG_QUEUE_EXPIRE_S) the queue would take it for dead and hand it to another worker while it still runs. So it
 * gets at least `msPerRow` per staged row (default 50, about 5 times the loaded figure above; set by
 * CPREG_PLAN_EXPIRE_MS_PER_ROW), at most 23 hours (the queue library's limit is 24). The cost: a planner that did
 * die is run again only that much later (750 s at 15,000 rows).
 */
export const PLANNING_EXPIRY = { msPerRow: 50, maxSeconds: 23 * 3600 };

/** The planning budget per staged row: CPREG_PLAN_EXPIRE_MS_PER_ROW, else the default. */
export function planningMsPerRow(env: NodeJS.ProcessEnv = process.env): number {
  const raw = env.CPREG_PLAN_EXPIRE_MS_PER_ROW;
  const msPerRow = raw === undefined || raw === '' ? PLANNING_EXPIRY.msPerRow : Number(raw);
  if (!Number.isFinite(msPerRow) || msPerRow < 0) throw new RangeError(`CPREG_PLAN_EXPIRE_MS_PER_ROW=${raw}: expected a number of at least 0`);
  return msPerRow;
}

export function planningExpirySeconds(rows: number, msPerRow: number = PLANNING_EXPIRY.msPerRow): number {
  return Math.min(PLANNING_EXPIRY.maxSeconds, Math.ceil((rows * msPerRow) / 1000));
}

/** Rejected rows listed in a job's result (the counts hold them all). */
export const MAX_LISTED_REJECTS = 1000;
