/**
 * The PostgreSQL job queue: pg-boss (a maintained, general-purpose queue that keeps its jobs in PostgreSQL tables,
 * hands each job to one worker with SELECT … FOR UPDATE SKIP LOCKED, retries failed jobs, and — through its
 * supervisor — fails and retries a job whose worker vanished once the job's expiry has passed). Its tables live in
 * the schema QUEUE_SCHEMA and are created by the library itself (its own migrations, under an advisory lock), not
 * by cpreg's migrations.
 *
 * pg-boss 10 is the newest major version that supports Node 20 (11 and later need Node 22).
 */
import { createHash } from 'node:crypto';
import PgBoss from 'pg-boss';
import type { GivenUp, JobHandler, JobQueue, QueueOptions, SendOptions, WorkOptions } from './job-queue.ts';
import { QUEUE_DEFAULTS, QUEUE_SCHEMA } from './job-queue.ts';

export interface PgBossQueueOptions extends QueueOptions {
  /** Connections the queue's own pool may open. Default 4. */
  maxConnections?: number;
  /** Called with errors the library reports in the background (lost connections, failed maintenance). */
  onError?: (error: Error) => void;
  /** Runs the supervisor (expiry, retries of vanished workers). Default true. */
  supervise?: boolean;
}

/** A stable job id (a UUID) for a key: sending the same key twice stores one job. */
export function jobIdFor(key: string): string {
  const h = createHash('sha256').update(key).digest('hex');
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-5${h.slice(13, 16)}-${((parseInt(h.slice(16, 18), 16) & 0x3f) | 0x80).toString(16)}${h.slice(18, 20)}-${h.slice(20, 32)}`;
}

export async function openPgBossQueue(connectionString: string, options: PgBossQueueOptions = {}): Promise<JobQueue> {
  const settings = { ...QUEUE_DEFAULTS, ...options };
  const boss = new PgBoss({
    connectionString,
    schema: QUEUE_SCHEMA,
    max: options.maxConnections ?? 4,
    application_name: 'cpreg-queue',
    supervise: options.supervise ?? true,
    schedule: false,
    maintenanceIntervalSeconds: settings.maintenanceIntervalSeconds,
  });
  boss.on('error', (error: Error) => options.onError?.(error));
  await boss.start();
  const created = new Set<string>();
  const ensureQueue = async (name: string): Promise<void> => {
    if (created.has(name)) return;
    await boss.createQueue(name, {
      name,
      policy: 'standard',
      retryLimit: settings.retryLimit,
      retryDelay: settings.retryDelaySeconds,
      expireInSeconds: settings.expireInSeconds,
    });
    created.add(name);
  };
  const queue: JobQueue = {
    kind: 'pg-boss',
    async send<T extends object>(name: string, data: T, sendOptions: SendOptions = {}): Promise<void> {
      await ensureQueue(name);
      await boss.send(name, data, {
        retryLimit: settings.retryLimit,
        retryDelay: settings.retryDelaySeconds,
        // pg-boss both fails an active job past its expiry (supervisor) and stops awaiting its handler then (work):
        // either way the step is delivered again while the first run goes on.
        expireInSeconds: Math.max(settings.expireInSeconds, Math.ceil(sendOptions.minExpireInSeconds ?? 0)),
        ...(sendOptions.singletonKey ? { id: jobIdFor(`${name}:${sendOptions.singletonKey}`) } : {}),
      });
    },
    async work<T>(name: string, handler: JobHandler<T>, workOptions: WorkOptions = {}): Promise<void> {
      await ensureQueue(name);
      // One work() loop per slot: each fetches one job at a time and completes (or fails) it before the next.
      for (let slot = 0; slot < Math.max(1, workOptions.concurrency ?? 1); slot++) {
        await boss.work<T>(name, { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: settings.pollingIntervalSeconds }, async (jobs) => {
          for (const job of jobs) await handler(job.data, { id: job.id, retryCount: job.retryCount, retryLimit: job.retryLimit });
        });
      }
    },
    async givenUp(name: string, singletonKey: string): Promise<GivenUp | undefined> {
      await ensureQueue(name);
      // pg-boss marks a job `failed` only when no retry is left (a failure with retries left becomes `retry`); a
      // worker that vanished is failed by the supervisor once the job's expiry passed, with its own message.
      const job = (await boss.getJobById(name, jobIdFor(`${name}:${singletonKey}`), { includeArchive: true })) as {
        state?: string;
        retryCount?: number;
        output?: unknown;
      } | null;
      if (job?.state !== 'failed') return undefined;
      return { attempts: (job.retryCount ?? 0) + 1, reason: outputMessage(job.output) };
    },
    async stop(stopOptions: { graceful?: boolean } = {}): Promise<void> {
      await boss.stop({ graceful: stopOptions.graceful ?? true, wait: true, timeout: 30_000 });
    },
  };
  return queue;
}

/** The message pg-boss stored as a failed job's output: a handler's error, or its supervisor's `{ value: { message } }`. */
function outputMessage(output: unknown): string {
  const o = output as { message?: unknown; value?: { message?: unknown } } | null | undefined;
  const message = o?.message ?? o?.value?.message;
  return typeof message === 'string' && message !== '' ? message : 'failed (the queue kept no message)';
}
