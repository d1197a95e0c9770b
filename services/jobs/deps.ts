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

/** Rejected rows listed in a job's result (the counts hold them all). */
export const MAX_LISTED_REJECTS = 1000;
