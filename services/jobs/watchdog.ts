/**
 * The job watchdog. A step whose worker dies on every attempt (killed, out of memory, the machine gone) is given up
 * by the queue without any cpreg code running — `guarded` in steps.ts, which fails the job when a step's last
 * retry throws, never sees it — so the job stayed `running` forever with that partition `running`. The watchdog
 * asks the queue about every step of every unfinished partitioned job and fails a job one of whose steps was given
 * up, naming the step, the partition, the attempts and the queue's reason. `cpreg jobs show` and GET /v1/jobs/{id}
 * then say so. Runs in every process that takes job steps (startJobs with `work`), every
 * WATCHDOG_INTERVAL_MS; any one of them is enough.
 */
import type { GivenUp } from '../../db/job-queue.ts';
import { failJobIfUnfinished, unfinishedJobs, unfinishedPartitions } from '../../db/queries/jobs.ts';
import { JOB_STEPS, type JobDeps } from './deps.ts';

export const WATCHDOG_INTERVAL_MS = 30_000;

export interface AbandonedJob {
  jobId: number;
  error: string;
}

/** What to tell the operator: which step, how many attempts, the queue's reason, and what to do. */
function abandonedMessage(step: string, gone: GivenUp): string {
  return `${step} was given up by the job queue after ${gone.attempts} attempt${gone.attempts === 1 ? '' : 's'} (${gone.reason}); its worker failed or stopped answering each time, so the job cannot finish: submit the input again (rows already stored count as already ingested)`;
}

/** The first given-up step of one unfinished job, as the job's error; undefined when none was given up. */
async function givenUpStep(deps: JobDeps, jobId: number, planned: boolean): Promise<string | undefined> {
  const key = String(jobId);
  if (!planned) {
    const gone = await deps.queue.givenUp(JOB_STEPS.plan, key);
    return gone && abandonedMessage('planning', gone);
  }
  const open = await unfinishedPartitions(deps.db, jobId);
  for (const p of open) {
    const gone = await deps.queue.givenUp(JOB_STEPS.partition, `${jobId}:${p}`);
    if (gone) return abandonedMessage(`partition ${p}`, gone);
  }
  if (open.length > 0) return undefined;
  const gone = await deps.queue.givenUp(JOB_STEPS.finish, key);
  return gone && abandonedMessage('the final pass', gone);
}

/** Fails every unfinished partitioned job one of whose steps the queue gave up; answers those jobs. */
export async function failAbandonedJobs(deps: JobDeps): Promise<AbandonedJob[]> {
  const failed: AbandonedJob[] = [];
  for (const row of await unfinishedJobs(deps.db)) {
    if (row.params.partitioned !== true) continue;
    const jobId = row.id;
    const error = await givenUpStep(deps, jobId, row.plan !== null);
    if (!error) continue;
    // Only a job still unfinished: a step that succeeded meanwhile on another worker may have finished it.
    if (!(await failJobIfUnfinished(deps.db, jobId, error))) continue;
    deps.log('error', { jobId }, error);
    failed.push({ jobId, error });
  }
  return failed;
}

/** Runs the watchdog every `intervalMs` until the answer's stop() (a failed round is logged and tried again). */
export function startWatchdog(deps: JobDeps, intervalMs = WATCHDOG_INTERVAL_MS): { stop(): void } {
  let running = false;
  const timer = setInterval(() => {
    if (running) return;
    running = true;
    failAbandonedJobs(deps)
      .catch((error: unknown) => deps.log('warn', { err: error }, 'job watchdog round failed; trying again later'))
      .finally(() => {
        running = false;
      });
  }, intervalMs);
  timer.unref();
  return { stop: () => clearInterval(timer) };
}
