/**
 * A planning step that runs longer than the queue's expiry (CPREG_QUEUE_EXPIRE_S) is not taken for dead: the
 * submitter gives it an expiry scaled to the staged rows (services/jobs/deps.ts planningExpirySeconds), so pg-boss
 * neither fails it by timeout nor stops awaiting it, and no other worker plans the job a second time. Here the
 * submitting queue's expiry is 2 s and a hook holds the planning 6 s, with two workers ready to take a redelivery.
 * pg-boss lives in PostgreSQL only: no embedded variant (the in-process queue has no expiry).
 */
import { join } from 'node:path';
import { expect, it } from 'vitest';
import { describePostgres, makeTempDir, openTestDatabase, removeTempDir } from '../../support/index.ts';
import { PLANNING_EXPIRY, planningExpirySeconds, planningMsPerRow } from '../../../services/jobs/deps.ts';
import { startJobs, type Jobs } from '../../../services/jobs/start-jobs.ts';
import { submitIngestJob } from '../../../services/jobs/submit-ingest.ts';
import { watchJob } from '../../../services/jobs/watch-job.ts';
import { generatedMentions, writeNdjson } from './support.ts';

const ROWS = 300;
const SLOW_PLANNING_MS = 6000;
const SHORT_EXPIRY = { retryLimit: 2, retryDelaySeconds: 0, pollingIntervalSeconds: 0.5, maintenanceIntervalSeconds: 1, expireInSeconds: 2 };

it('scales the planning expiry with the rows, within the queue library’s limit', () => {
  expect(planningExpirySeconds(ROWS)).toBe(Math.ceil((ROWS * PLANNING_EXPIRY.msPerRow) / 1000));
  expect(planningExpirySeconds(10_000_000)).toBe(PLANNING_EXPIRY.maxSeconds);
  expect(planningMsPerRow({})).toBe(PLANNING_EXPIRY.msPerRow);
  expect(planningExpirySeconds(1000, planningMsPerRow({ CPREG_PLAN_EXPIRE_MS_PER_ROW: '200' }))).toBe(200);
  expect(() => planningMsPerRow({ CPREG_PLAN_EXPIRE_MS_PER_ROW: 'x' })).toThrow(/CPREG_PLAN_EXPIRE_MS_PER_ROW/);
});

describePostgres('a planning step longer than the queue expiry [postgres]', () => {
  it('is planned once, and the job finishes', async () => {
    expect(planningExpirySeconds(ROWS) * 1000).toBeGreaterThan(SLOW_PLANNING_MS * 2);
    const database = await openTestDatabase('postgres');
    const dir = makeTempDir('cpreg-slow-plan-');
    const planningRuns: number[] = [];
    const planned: string[] = [];
    const started: Jobs[] = [];
    try {
      // Two workers (the queue's own expiry long, as for partitions) and a submitter whose expiry is 2 s: the planning
      // step's expiry is set by the process that queues it.
      for (const worker of ['w1', 'w2'])
        started.push(
          await startJobs({
            db: database.db,
            backend: 'postgres',
            url: database.url!,
            work: true,
            worker,
            queueOptions: { ...SHORT_EXPIRY, expireInSeconds: 120 },
            log: (_level, fields, message) => {
              if (message === 'job planned') planned.push(`${worker}:${String(fields.jobId)}`);
            },
            hooks: {
              planning: async (jobId) => {
                planningRuns.push(jobId);
                await new Promise((r) => setTimeout(r, SLOW_PLANNING_MS));
              },
            },
          }),
        );
      const submitter = await startJobs({ db: database.db, backend: 'postgres', url: database.url!, work: false, queueOptions: SHORT_EXPIRY });
      started.push(submitter);
      const file = join(dir, 'slow.ndjson');
      writeNdjson(file, generatedMentions(ROWS, 31, 'slow-plan'));
      const jobId = await submitIngestJob({ db: database.db, queue: submitter.queue }, { file, source: 'slow-plan', actor: 'test', partitionSize: 100 });
      const job = await watchJob(database.db, jobId, { pollMs: 200 });
      expect(job.status, String(job.error)).toBe('finished');
      expect((job.result as { counts: { read: number }; partitions: number }).counts.read).toBe(ROWS);
      expect((job.result as { partitions: number }).partitions).toBeGreaterThan(1);
      expect(planningRuns).toEqual([jobId]);
      expect(planned).toHaveLength(1);
      expect(planned[0]).toMatch(new RegExp(`^w[12]:${jobId}$`));
    } finally {
      for (const jobs of started.reverse()) await jobs.stop();
      await database.close();
      removeTempDir(dir);
    }
  }, 120_000);
});
