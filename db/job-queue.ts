/**
 * The job queue behind partitioned work (services/jobs): a named job with a small JSON payload, delivered to one
 * handler at a time, retried when the handler fails or its process disappears. Two implementations:
 *
 *  - `openPgBossQueue` (db/pg-boss-queue.ts): jobs stored in PostgreSQL by the pg-boss library, in a schema of its
 *    own, shared by any number of `cpreg worker` processes on any number of machines;
 *  - `InProcessQueue` (db/in-process-queue.ts): the embedded database's queue, in memory, run by the process that
 *    sent the jobs (`npm start` needs no queue service).
 *
 * Services depend on this interface only, never on the library.
 */

/** What a handler learns about the delivery it runs. */
export interface Delivery {
  /** The queue's id of this job (for logs). */
  id: string;
  /** 0 on the first run, then 1, 2, … */
  retryCount: number;
  /** Runs after the first that the queue allows; when retryCount equals it, this is the last chance. */
  retryLimit: number;
}

export type JobHandler<T> = (data: T, delivery: Delivery) => Promise<void>;

export interface SendOptions {
  /** One job per key: a later send with a key already sent is dropped (the queue keeps the key as long as the job). */
  singletonKey?: string;
  /**
   * This job's expiry is at least this many seconds (the queue's expireInSeconds when that is longer): for a step
   * whose length is known to grow with its input (a job's planning), so that a slow run is not taken for a dead one.
   * The in-process queue has no expiry and ignores it.
   */
  minExpireInSeconds?: number;
}

export interface WorkOptions {
  /** Jobs of this name run at once in this process. Default 1. */
  concurrency?: number;
}

/** A job the queue gave up: every attempt failed (or its worker vanished each time) and no retry is left. */
export interface GivenUp {
  /** Runs made: the first and its retries. */
  attempts: number;
  /** The queue's last word on it (the handler's error, or the queue's own, e.g. an expired run). */
  reason: string;
}

export interface JobQueue {
  /** 'pg-boss' or 'in-process' (for logs and /healthz). */
  readonly kind: 'pg-boss' | 'in-process';
  send<T extends object>(name: string, data: T, options?: SendOptions): Promise<void>;
  /** Starts taking jobs of `name` in this process. */
  work<T>(name: string, handler: JobHandler<T>, options?: WorkOptions): Promise<void>;
  /**
   * Whether the job sent as `name` with `singletonKey` was given up (its retries exhausted), and why; undefined
   * while it waits, runs, succeeded, or is unknown. The job watchdog (services/jobs/watchdog.ts) asks this, because
   * a step whose worker died on every attempt never ran the cpreg code that would have failed its job.
   */
  givenUp(name: string, singletonKey: string): Promise<GivenUp | undefined>;
  /** Stops taking jobs; with `graceful` (the default) the running ones finish first. */
  stop(options?: { graceful?: boolean }): Promise<void>;
}

/** Queue options, each with its default (the same for both implementations where it applies). */
export interface QueueOptions {
  /** Runs after the first before a job is given up. Default 3. */
  retryLimit?: number;
  /** Seconds between a failure and the retry. Default 5 (in-process: 0). */
  retryDelaySeconds?: number;
  /**
   * Seconds a job may stay running before the queue takes its process for dead and runs it again elsewhere
   * (a worker killed mid-job). Longer than any partition takes. Default 900.
   */
  expireInSeconds?: number;
  /** Seconds between the pg-boss supervisor's sweeps for expired jobs. Default 30. */
  maintenanceIntervalSeconds?: number;
  /** Seconds an idle worker waits before asking the queue again. Default 1. */
  pollingIntervalSeconds?: number;
}

export const QUEUE_DEFAULTS: Required<QueueOptions> = {
  retryLimit: 3,
  retryDelaySeconds: 5,
  expireInSeconds: 900,
  maintenanceIntervalSeconds: 30,
  pollingIntervalSeconds: 1,
};

/** The PostgreSQL schema that holds the queue library's tables (kept apart from cpreg's own, in `public`). */
export const QUEUE_SCHEMA = 'cpreg_queue';

/** Reads queue options from the environment (CPREG_QUEUE_RETRY_LIMIT, …_RETRY_DELAY_S, …_EXPIRE_S, …_MAINTENANCE_S, …_POLL_S). */
export function queueOptionsFromEnv(env: NodeJS.ProcessEnv = process.env): QueueOptions {
  const read = (name: string, min: number): number | undefined => {
    const raw = env[name];
    if (raw === undefined || raw === '') return undefined;
    const value = Number(raw);
    if (!Number.isFinite(value) || value < min) throw new RangeError(`${name}=${raw}: expected a number of at least ${min}`);
    return value;
  };
  const out: QueueOptions = {};
  const set = <K extends keyof QueueOptions>(key: K, value: number | undefined): void => {
    if (value !== undefined) out[key] = value;
  };
  set('retryLimit', read('CPREG_QUEUE_RETRY_LIMIT', 0));
  set('retryDelaySeconds', read('CPREG_QUEUE_RETRY_DELAY_S', 0));
  set('expireInSeconds', read('CPREG_QUEUE_EXPIRE_S', 1));
  set('maintenanceIntervalSeconds', read('CPREG_QUEUE_MAINTENANCE_S', 1));
  set('pollingIntervalSeconds', read('CPREG_QUEUE_POLL_S', 0.5));
  return out;
}
