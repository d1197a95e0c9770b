/**
 * The job commands as a user runs them, on the embedded database (the PostgreSQL path with worker processes is
 * tests/services/jobs/distributed.test.ts): `ingest --as-job` runs its partitions in the submitting process and
 * prints counts that reconcile, `jobs show` reads the job back, `sweep --as-job` partitions the sweep, and
 * `worker` refuses the embedded database with the reason. Names are invented.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTempDir, removeTempDir } from '../../support/index.ts';
import { runCli } from '../../support/cli.ts';

describe('cpreg ingest --as-job, jobs show, sweep --as-job, worker', () => {
  let dir: string;
  beforeAll(() => {
    dir = makeTempDir('cpreg-jobs-cli-');
    const rows = [
      'Ravelstone Pumps Ltd',
      'RAVELSTONE PUMPS LTD',
      'Ravelstone Pumps Limited',
      'Corvath Mills GmbH',
      'Corvath Mühlen GmbH',
      'Tessaly Freight AS',
    ];
    writeFileSync(
      join(dir, 'm.ndjson'),
      rows.map((text, i) => JSON.stringify({ externalId: `m${i}`, text, country: i < 3 ? 'GB' : i < 5 ? 'DE' : 'NO' })).join('\n') + '\nnot json\n',
    );
  });
  afterAll(() => removeTempDir(dir));

  it('ingests as a partitioned job in this process, and the job reads back', async () => {
    const db = join(dir, 'db');
    const run = await runCli(['ingest', join(dir, 'm.ndjson'), '--source', 'cli', '--as-job', '--partition-size', '2', '--json', '--db', db], {
      timeoutMs: 180_000,
    });
    expect(run.code, run.stderr).toBe(0);
    const job = JSON.parse(run.stdout) as {
      id: number;
      status: string;
      result: { counts: Record<string, number>; rejected: { line: number }[]; partitions: number };
    };
    expect(job.status).toBe('finished');
    expect(job.result.counts.read).toBe(7);
    expect(job.result.counts.rejected).toBe(1);
    expect(job.result.rejected.map((r) => r.line)).toEqual([7]);
    expect(job.result.partitions).toBeGreaterThanOrEqual(2);
    const show = await runCli(['jobs', 'show', String(job.id), '--db', db], { timeoutMs: 120_000 });
    expect(show.code, show.stderr).toBe(0);
    expect(show.stdout).toContain(`job ${job.id} (ingest) finished`);
    expect(show.stdout).toMatch(/partitions: \d+ done, 0 running, 0 queued/);
    const sweep = await runCli(['sweep', '--as-job', '--partition-size', '1', '--json', '--db', db], { timeoutMs: 180_000 });
    expect(sweep.code, sweep.stderr).toBe(0);
    const swept = JSON.parse(sweep.stdout) as { status: string; result: { scanned: number; partitions: number } };
    expect(swept.status).toBe('finished');
    expect(swept.result.partitions).toBe(swept.result.scanned);
    const missing = await runCli(['jobs', 'show', '999', '--db', db], { timeoutMs: 120_000 });
    expect(missing.code).toBe(1);
    expect(missing.stderr).toContain('job 999 does not exist');
  }, 300_000);

  it('worker needs PostgreSQL and says so', async () => {
    const run = await runCli(['worker', '--db', join(dir, 'db-worker')]);
    expect(run.code).toBe(1);
    // One "cpreg:" prefix (it read "cpreg: cpreg worker needs …"), and the database it was given named.
    expect(run.stderr).toContain(
      `cpreg: the worker needs PostgreSQL (--db postgres://… or DATABASE_URL), and ${join(dir, 'db-worker')} is an embedded database`,
    );
    expect(run.stderr).not.toContain('cpreg: cpreg');
  });
});
