/**
 * The embedded database's job queue: jobs wait in memory and run in this process, one at a time per name and
 * concurrency slot. A failed job is run again up to retryLimit times. Nothing survives the process: a job row
 * left `queued` or `running` by a stopped process is picked up again by `resumeUnfinishedJobs` (services/jobs).
 */
import type { Delivery, GivenUp, JobHandler, JobQueue, QueueOptions, SendOptions, WorkOptions } from './job-queue.ts';
import { QUEUE_DEFAULTS } from './job-queue.ts';

interface Waiting {
  id: string;
  name: string;
  data: unknown;
  retryCount: number;
  singletonKey?: string;
}

export class InProcessQueue implements JobQueue {
  readonly kind = 'in-process' as const;
  readonly #waiting: Waiting[] = [];
  readonly #handlers = new Map<string, { handler: JobHandler<unknown>; slots: number; busy: number }>();
  readonly #running = new Set<Promise<void>>();
  readonly #retryLimit: number;
  readonly #keys = new Set<string>();
  /** Jobs sent with a singleton key whose last retry failed, by name and key. */
  readonly #givenUp = new Map<string, GivenUp>();
  #nextId = 1;
  #stopped = false;
  #onError: (error: unknown, job: { name: string; id: string }) => void;

  constructor(options: QueueOptions & { onError?: (error: unknown, job: { name: string; id: string }) => void } = {}) {
    this.#retryLimit = options.retryLimit ?? QUEUE_DEFAULTS.retryLimit;
    this.#onError = options.onError ?? (() => undefined);
  }

  async send<T extends object>(name: string, data: T, options: SendOptions = {}): Promise<void> {
    if (this.#stopped) throw new Error(`the job queue is stopped: cannot send ${name}`);
    if (options.singletonKey) {
      const key = `${name}\u0000${options.singletonKey}`;
      if (this.#keys.has(key)) return;
      this.#keys.add(key);
    }
    this.#waiting.push({ id: String(this.#nextId++), name, data, retryCount: 0, ...(options.singletonKey ? { singletonKey: options.singletonKey } : {}) });
    this.#pump();
  }

  async work<T>(name: string, handler: JobHandler<T>, options: WorkOptions = {}): Promise<void> {
    this.#handlers.set(name, { handler: handler as JobHandler<unknown>, slots: Math.max(1, options.concurrency ?? 1), busy: 0 });
    this.#pump();
  }

  async givenUp(name: string, singletonKey: string): Promise<GivenUp | undefined> {
    return this.#givenUp.get(`${name}\u0000${singletonKey}`);
  }

  async stop(options: { graceful?: boolean } = {}): Promise<void> {
    this.#stopped = true;
    this.#waiting.length = 0;
    if (options.graceful ?? true) await Promise.allSettled([...this.#running]);
  }

  #pump(): void {
    if (this.#stopped) return;
    for (let i = 0; i < this.#waiting.length;) {
      const job = this.#waiting[i]!;
      const worker = this.#handlers.get(job.name);
      if (!worker || worker.busy >= worker.slots) {
        i++;
        continue;
      }
      this.#waiting.splice(i, 1);
      worker.busy++;
      const delivery: Delivery = { id: job.id, retryCount: job.retryCount, retryLimit: this.#retryLimit };
      const run = (async () => {
        // A later macrotask, so that send() returns before the handler starts (as with a real queue).
        await new Promise((r) => setImmediate(r));
        try {
          await worker.handler(job.data, delivery);
        } catch (error) {
          this.#onError(error, { name: job.name, id: job.id });
          if (job.retryCount < this.#retryLimit && !this.#stopped) this.#waiting.push({ ...job, retryCount: job.retryCount + 1 });
          else if (job.retryCount >= this.#retryLimit && job.singletonKey !== undefined) {
            this.#givenUp.set(`${job.name}\u0000${job.singletonKey}`, {
              attempts: job.retryCount + 1,
              reason: error instanceof Error ? error.message : String(error),
            });
          }
        } finally {
          worker.busy--;
        }
      })();
      this.#running.add(run);
      void run.finally(() => {
        this.#running.delete(run);
        this.#pump();
      });
    }
  }
}
