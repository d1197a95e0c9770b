/**
 * Issue 17 item 10: a partition whose worker dies on every attempt is given up by the queue without any cpreg code
 * running (the step's own error handling never sees it), and its job stayed `running` forever. The watchdog asks
 * the queue and fails such a job naming the partition, the attempts and the reason; `cpreg jobs show` (its
 * describeJob lines) says so. The dying worker is simulated by a handler for the partition step that fails on
 * every attempt outside cpreg's step code (in-process queue) or never answers until the queue's expiry
 * (pg-boss). Names are invented (cpreg generate's generator).
 */
import { join } from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend, describePostgres, makeTempDir, openTestDatabase, removeTempDir } from '../../support/index.ts';
import { startJobs, type Jobs } from '../../../services/jobs/start-jobs.ts';
import { submitIngestJob } from '../../../services/jobs/submit-ingest.ts';
import { planIngest } from '../../../services/jobs/plan-ingest.ts';
import { failAbandonedJobs, startWatchdog } from '../../../services/jobs/watchdog.ts';
import { JOB_STEPS, type StepData } from '../../../services/jobs/deps.ts';
import { readJob, startPartition } from '../../../db/queries/jobs.ts';
import { openPgBossQueue } from '../../../db/pg-boss-queue.ts';
import { describeJob } from '../../../services/cli/commands/jobs.ts';
import { generatedMentions, writeNdjson } from './support.ts';

const FAST_QUEUE = { retryLimit: 1, retryDelaySeconds: 0, pollingIntervalSeconds: 0.5, maintenanceIntervalSeconds: 1, expireInSeconds: 1 };

describeEachBackend('job watchdog (in-process queue)', (t) => {
  let dir: string;
  let jobs: Jobs;
  beforeAll(async () => {
    dir = makeTempDir('cpreg-watchdog-');
    // A process that submits and plans but takes no steps: the partition step is the "dying worker" below.
    jobs = await startJobs({ db: t.db(), backend: t.backend, work: false, inProcess: true, queueOptions: FAST_QUEUE });
  });
  afterAll(async () => {
    await jobs?.stop();
    removeTempDir(dir);
  });

  it('fails a running job whose partition the queue gave up, naming the partition and the reason; jobs show says so', async () => {
    const file = join(dir, 'w.ndjson');
    writeNdjson(file, generatedMentions(30, 21, 'watch'));
    const jobId = await submitIngestJob({ db: t.db(), queue: jobs.queue }, { file, source: 'watch', actor: 'test', partitionSize: 10 });
    await planIngest(jobs.deps, jobId);
    await t.db().updateTable('job').set({ status: 'running' }).where('id', '=', jobId).execute();
    await startPartition(t.db(), jobId, 1, 'worker-that-dies');
    let attempts = 0;
    await jobs.queue.work<StepData>(JOB_STEPS.partition, async () => {
      attempts++;
      throw new Error('worker process killed (simulated)');
    });
    await jobs.queue.send(JOB_STEPS.partition, { jobId, partition: 1 }, { singletonKey: `${jobId}:1` });
    for (let i = 0; i < 100 && !(await jobs.queue.givenUp(JOB_STEPS.partition, `${jobId}:1`)); i++) await new Promise((r) => setTimeout(r, 20));
    expect(attempts).toBe(FAST_QUEUE.retryLimit + 1);
    // Before the watchdog: given up by the queue, yet the job is still running (the defect).
    expect((await readJob(t.db(), jobId))!.status).toBe('running');

    const failed = await failAbandonedJobs(jobs.deps);
    expect(failed.map((f) => f.jobId)).toEqual([jobId]);
    const job = (await readJob(t.db(), jobId))!;
    expect(job.status).toBe('failed');
    expect(job.finishedAt).not.toBeNull();
    expect(job.error).toMatch(/^partition 1 was given up by the job queue after 2 attempts \(worker process killed \(simulated\)\)/);
    expect(job.error).toContain('submit the input again');
    const shown = describeJob(job).join('\n');
    expect(shown).toContain(`job ${jobId} (ingest) failed: partition 1 was given up by the job queue after 2 attempts`);
    // A second round finds nothing more to do, and a job whose steps were not given up is left alone.
    expect(await failAbandonedJobs(jobs.deps)).toEqual([]);
  });

  it('leaves running jobs alone while their steps wait or run, and runs on its own timer', async () => {
    const file = join(dir, 'v.ndjson');
    writeNdjson(file, generatedMentions(20, 22, 'watch-ok'));
    const jobId = await submitIngestJob({ db: t.db(), queue: jobs.queue }, { file, source: 'watch-ok', actor: 'test', partitionSize: 10 });
    await planIngest(jobs.deps, jobId);
    await t.db().updateTable('job').set({ status: 'running' }).where('id', '=', jobId).execute();
    expect(await failAbandonedJobs(jobs.deps)).toEqual([]);
    expect((await readJob(t.db(), jobId))!.status).toBe('running');
    // Its partition 0 now meets the dying worker of the test above (a handler that always fails) and is given up
    // too: the timer's round fails the job without being asked.
    await jobs.queue.send(JOB_STEPS.partition, { jobId, partition: 0 }, { singletonKey: `${jobId}:0` });
    const watchdog = startWatchdog(jobs.deps, 50);
    try {
      let status = 'running';
      for (let i = 0; i < 200 && status === 'running'; i++) {
        await new Promise((r) => setTimeout(r, 25));
        status = (await readJob(t.db(), jobId))!.status;
      }
      expect(status).toBe('failed');
      expect((await readJob(t.db(), jobId))!.error).toMatch(/^partition 0 was given up/);
    } finally {
      watchdog.stop();
    }
  });
});

describePostgres('job watchdog (pg-boss) [postgres]', () => {
  it('fails a job whose partition pg-boss gave up after its worker never answered', async () => {
    const database = await openTestDatabase('postgres');
    const dir = makeTempDir('cpreg-watchdog-boss-');
    const jobs = await startJobs({ db: database.db, backend: 'postgres', url: database.url!, work: false, queueOptions: FAST_QUEUE });
    // The dying worker: another queue connection whose handler never answers, so each run expires.
    const dying = await openPgBossQueue(database.url!, FAST_QUEUE);
    try {
      expect(jobs.queue.kind).toBe('pg-boss');
      const file = join(dir, 'b.ndjson');
      writeNdjson(file, generatedMentions(20, 23, 'watch-boss'));
      const jobId = await submitIngestJob({ db: database.db, queue: jobs.queue }, { file, source: 'watch-boss', actor: 'test', partitionSize: 10 });
      await planIngest(jobs.deps, jobId);
      await database.db.updateTable('job').set({ status: 'running' }).where('id', '=', jobId).execute();
      await dying.work<StepData>(JOB_STEPS.partition, () => new Promise<void>(() => undefined));
      await jobs.queue.send(JOB_STEPS.partition, { jobId, partition: 0 }, { singletonKey: `${jobId}:0` });
      let gone;
      for (let i = 0; i < 120 && !gone; i++) {
        await new Promise((r) => setTimeout(r, 250));
        gone = await jobs.queue.givenUp(JOB_STEPS.partition, `${jobId}:0`);
      }
      expect(gone?.attempts).toBe(2);
      expect((await readJob(database.db, jobId))!.status).toBe('running');
      expect((await failAbandonedJobs(jobs.deps)).map((f) => f.jobId)).toEqual([jobId]);
      const job = (await readJob(database.db, jobId))!;
      expect(job.status).toBe('failed');
      expect(job.error).toMatch(/^partition 0 was given up by the job queue after 2 attempts \(/);
    } finally {
      await dying.stop({ graceful: false });
      await jobs.stop();
      await database.close();
      removeTempDir(dir);
    }
  }, 90_000);
});
