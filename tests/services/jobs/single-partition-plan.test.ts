/**
 * A job that fits one partition is planned without scoring its candidate pairs (they would decide no cut), and
 * resolves exactly as the same job planned with every pair scored: the same partition items (pairs to compare,
 * frozen token counts), the same counts, the same counterparty of every mention. Each job runs in a database of
 * its own, on each backend. Names are invented (cpreg generate's generator).
 */
import { join } from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend, makeTempDir, openTestDatabase, removeTempDir, type TestDatabase } from '../../support/index.ts';
import { resumeUnfinishedJobs, startJobs } from '../../../services/jobs/start-jobs.ts';
import { planIngest, type IngestPlan } from '../../../services/jobs/plan-ingest.ts';
import { submitIngestJob } from '../../../services/jobs/submit-ingest.ts';
import { watchJob } from '../../../services/jobs/watch-job.ts';
import { clusteringOf, generatedMentions, writeNdjson } from './support.ts';

const FAST_QUEUE = { retryLimit: 1, retryDelaySeconds: 0, pollingIntervalSeconds: 0.5, maintenanceIntervalSeconds: 2, expireInSeconds: 60 };

interface Outcome {
  plan: IngestPlan;
  items: unknown;
  counts: Record<string, number>;
  labels: string[];
  statuses: string[];
}

describeEachBackend('an ingest job of one partition', (t) => {
  let dir: string;
  let file: string;
  const mentions = generatedMentions(400, 23, 'one-part');
  beforeAll(() => {
    dir = makeTempDir('cpreg-one-part-');
    file = join(dir, 'one.ndjson');
    writeNdjson(file, mentions);
  });
  afterAll(() => removeTempDir(dir));

  /** Submits the file to a fresh database, plans it as told, runs its partition and reads what was stored. */
  async function runOnce(scoreAlways: boolean): Promise<Outcome> {
    const database: TestDatabase = await openTestDatabase(t.backend);
    try {
      const jobs = await startJobs({ db: database.db, backend: t.backend, work: false, inProcess: true, queueOptions: FAST_QUEUE });
      const jobId = await submitIngestJob({ db: database.db, queue: jobs.queue }, { file, source: 'one-part', actor: 'test', partitionSize: 1000 });
      await jobs.stop();
      await planIngest(jobs.deps, jobId, { scoreAlways });
      const items = (await database.db.selectFrom('job_partition').select('items').where('job_id', '=', jobId).execute()).map((r) =>
        typeof r.items === 'string' ? JSON.parse(r.items) : r.items,
      );
      const working = await startJobs({ db: database.db, backend: t.backend, work: true, inProcess: true, queueOptions: FAST_QUEUE });
      try {
        expect(await resumeUnfinishedJobs(working.deps)).toBe(1);
        const job = await watchJob(database.db, jobId, { pollMs: 100 });
        expect(job.status, String(job.error)).toBe('finished');
        const rows = await database.db.selectFrom('mention').select(['external_id', 'status']).orderBy('external_id').execute();
        return {
          plan: job.plan as unknown as IngestPlan,
          items,
          counts: (job.result as { counts: Record<string, number> }).counts,
          labels: await clusteringOf(database.db, mentions),
          statuses: rows.map((r) => `${r.external_id}:${r.status}`),
        };
      } finally {
        await working.stop();
      }
    } finally {
      await database.close();
    }
  }

  it('skips the pair scoring and resolves as the plan with every pair scored', async () => {
    const skipped = await runOnce(false);
    const scored = await runOnce(true);
    expect(skipped.plan.partitions).toBe(1);
    expect(skipped.plan.candidatePairs).toBeGreaterThan(0);
    expect(skipped.plan.scoredPairs).toBe(0);
    expect(skipped.plan.linkingPairs).toBeNull();
    expect(scored.plan.partitions).toBe(1);
    expect(scored.plan.scoredPairs).toBe(scored.plan.candidatePairs);
    expect(scored.plan.linkingPairs).toBeGreaterThan(0);
    expect(skipped.plan.candidatePairs).toBe(scored.plan.candidatePairs);
    expect(skipped.plan.rarityDocuments).toBe(scored.plan.rarityDocuments);
    // The partition's input is the same, pair for pair and count for count; so is what it stored.
    expect(skipped.items).toEqual(scored.items);
    expect(skipped.counts).toEqual(scored.counts);
    expect(skipped.counts.read).toBe(mentions.length);
    expect(skipped.counts.linked).toBeGreaterThan(0);
    expect(skipped.labels).toEqual(scored.labels);
    expect(skipped.statuses).toEqual(scored.statuses);
  });
});
