/**
 * Scale-out on one PostgreSQL: one API process (`cpreg serve --work 0`, submits only) and three `cpreg worker`
 * processes resolve a generated batch (15,000 mentions in partitions of 500; 200,000 in partitions of 1,000 under
 * CPREG_LONG=1), while a fourth worker, alone on a database of its own, resolves the same file as one batch (one
 * process). In the middle of a partition one worker is killed with SIGKILL: the queue runs that partition again on
 * another worker once it expires. The two registers must agree (pairwise agreement of the clusterings ≥ AGREEMENT; every pair they
 * disagree on is printed with the partitions its two names fell in) and `cpreg verify` must pass on both.
 * Names are invented (cpreg generate's generator).
 */
import { spawn, type ChildProcess } from 'node:child_process';

/**
 * The least pairwise agreement with one process. The goal is 0.999; measured with the company-name matcher: 0.99934
 * and 0.99839 at 30,000 mentions (the killed partition was the first, and the kill fell after some of its write chunks
 * had committed); on 2026-12-05 0.999118 at 30,000 in partitions of 1,000 and 0.999792 at 15,000 in partitions of 500.
 * Two known causes, both in docs/scaling.md: a partition run again resolves its remaining mentions against the
 * counterparties its first attempt committed (mention-to-counterparty, best name) instead of pairwise with those
 * mentions, which links typo variants more readily; and whether a word is common depends on the register's token
 * counts, which grow as partitions write. Atomic partition writes and token counts frozen at plan time would close
 * both; until then the test holds 0.995.
 */
const AGREEMENT = 0.995;
import { readFileSync } from 'node:fs';
import { hostname } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { differingPairs, pairAgreement } from '../../../resolvers/evaluate/index.ts';
import type { OpenedDatabase } from '../../../db/open-database.ts';
import { watchJob } from '../../../services/jobs/watch-job.ts';
import { createPostgresCopy, describePostgres, makeTempDir, openTestDatabase, removeTempDir } from '../../support/index.ts';
import { CPREG_BIN, REPO_ROOT, childEnv, runCli, startServe, type ServerProcess } from '../../support/cli.ts';
import { clusteringOf, generatedMentions, writeNdjson, type TruthMention } from './support.ts';

const LONG = process.env.CPREG_LONG === '1';
// What is asserted is a ratio (pairwise agreement) and the retry of a killed partition, not a size: npm test keeps the
// 30 partitions it had at 30,000 mentions with half the mentions in each. The test's time is set by the planner
// (it scores every candidate pair of the file: 153 s and 308 s of the run measured at 30,000 under load) and by the
// reference's single partition.
const SIZE = LONG ? 200_000 : 15_000;
const PARTITION_SIZE = LONG ? 1000 : 500;
/** A partition whose worker vanished runs again after this many seconds (the queue's expiry). */
const EXPIRE_S = 60;
const ENV = {
  CPREG_QUEUE_EXPIRE_S: String(EXPIRE_S),
  CPREG_QUEUE_MAINTENANCE_S: '2',
  CPREG_QUEUE_POLL_S: '0.5',
  CPREG_QUEUE_RETRY_DELAY_S: '0',
  CPREG_RATE_LIMIT_PER_MINUTE: 'off',
};

interface Worker {
  child: ChildProcess;
  id: string;
  output(): string;
}

function startWorker(url: string, env: Record<string, string> = {}): Promise<Worker> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [CPREG_BIN, 'worker', '--db', url], { cwd: REPO_ROOT, env: childEnv({ ...ENV, ...env }) });
    let output = '';
    const timer = setTimeout(() => reject(new Error(`cpreg worker did not start; output:\n${output}`)), 60_000);
    const onData = (chunk: Buffer): void => {
      output += chunk.toString();
      if (/taking jobs/.test(output)) {
        clearTimeout(timer);
        resolve({ child, id: `${hostname()}:${child.pid}`, output: () => output });
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', onData);
    child.on('exit', (code) => reject(new Error(`cpreg worker exited (${code}) before taking jobs; output:\n${output}`)));
  });
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describePostgres('scale-out: one API and three workers on PostgreSQL [postgres]', () => {
  let dir: string;
  let file: string;
  let mentions: TruthMention[];
  let distUrl: string;
  let refUrl: string;
  let api: ServerProcess | undefined;
  const workers: Worker[] = [];
  const opened: OpenedDatabase[] = [];

  beforeAll(async () => {
    dir = makeTempDir('cpreg-scale-');
    file = join(dir, 'batch.ndjson');
    mentions = generatedMentions(SIZE, 2026, 'scale');
    writeNdjson(file, mentions);
    distUrl = await createPostgresCopy();
    refUrl = await createPostgresCopy();
  }, 120_000);

  afterAll(async () => {
    for (const w of workers) if (w.child.exitCode === null && w.child.signalCode === null) w.child.kill('SIGKILL');
    await api?.stop('SIGKILL');
    for (const o of opened) await o.close().catch(() => undefined);
    removeTempDir(dir);
  });

  it(
    `resolves ${SIZE.toLocaleString('en-US')} mentions as one process does, through a worker killed mid-partition`,
    async () => {
      const created = await runCli(['keys', 'create', '--scope', 'write', '--label', 'scale-out test', '--json', '--db', distUrl], { env: childEnv(ENV) });
      expect(created.code, created.stderr).toBe(0);
      const key = (JSON.parse(created.stdout) as { secret: string }).secret;
      // Each step's expiry is set by the process that queues it: the planning step by the API (and, for the reference,
      // by the submitting command), the partitions by the worker that planned them. The planning step's expiry grows
      // with the staged rows (services/jobs/deps.ts planningExpirySeconds: 750 s here), so the short expiry a killed
      // partition needs no longer hands a slow planning step to a second worker (it once failed the job: "planning
      // failed: no result", planning 160 s at load 20 on 2 cores).
      const SUBMIT_ENV = ENV;
      api = await startServe(['--db', distUrl, '--port', '0', '--work', '0'], { env: childEnv(SUBMIT_ENV) });
      for (let i = 0; i < 3; i++) workers.push(await startWorker(distUrl));

      // The reference: one worker process alone resolves the same file as one batch (a single partition), into a
      // database of its own (it runs meanwhile; this test process only watches).
      const ref = await openTestDatabase({ at: refUrl });
      opened.push(ref);
      // (Its one partition takes minutes: a longer expiry, so that the queue does not take it for lost.)
      workers.push(await startWorker(refUrl, { CPREG_QUEUE_EXPIRE_S: '3600' }));
      const submitted = await runCli(
        ['ingest', file, '--source', 'scale', '--as-job', '--no-wait', '--json', '--partition-size', String(SIZE), '--db', refUrl],
        { env: childEnv(SUBMIT_ENV), timeoutMs: 300_000 },
      );
      expect(submitted.code, submitted.stderr).toBe(0);
      const refJobId = (JSON.parse(submitted.stdout) as { jobId: number }).jobId;

      const upload = await fetch(`${api.url}/v1/jobs/ingest?source=scale&partitionSize=${PARTITION_SIZE}`, {
        method: 'POST',
        headers: { authorization: `Bearer ${key}`, 'content-type': 'application/x-ndjson' },
        body: readFileSync(file),
      });
      expect(upload.status, await upload.clone().text()).toBe(202);
      const jobId = ((await upload.json()) as { id: number }).id;

      // Kill the first worker while it is inside a partition.
      const dist = await openTestDatabase({ at: distUrl });
      opened.push(dist);
      let killed: { partitionNo: number } | undefined;
      for (let i = 0; i < 1200 && !killed; i++) {
        const running = await dist.db
          .selectFrom('job_partition')
          .select(['partition_no', 'started_at'])
          .where('job_id', '=', jobId)
          .where('status', '=', 'running')
          .where('worker', '=', workers[0]!.id)
          .executeTakeFirst();
        if (running && Date.now() - new Date(running.started_at!).getTime() > 1000) {
          workers[0]!.child.kill('SIGKILL');
          killed = { partitionNo: running.partition_no };
        } else await sleep(250);
      }
      expect(killed, 'the first worker never ran a partition').toBeDefined();

      // Follow the job through the API, as a client would.
      let view:
        { status: string; partitions: { total: number; done: number } | null; result: Record<string, unknown> | null; error: string | null } | undefined;
      const deadline = Date.now() + 25 * 60_000;
      do {
        await sleep(2000);
        const res = await fetch(`${api.url}/v1/jobs/${jobId}`, { headers: { authorization: `Bearer ${key}` } });
        expect(res.status).toBe(200);
        view = (await res.json()) as typeof view;
      } while (view!.status !== 'finished' && view!.status !== 'failed' && Date.now() < deadline);
      expect(view!.status, JSON.stringify(view!.error)).toBe('finished');
      expect(view!.partitions!.done).toBe(view!.partitions!.total);
      const result = view!.result as { counts: Record<string, number>; retriedPartitions: number; partitions: number; crossPairs: number; merges: unknown[] };
      expect(result.counts.read).toBe(SIZE);

      // The killed worker's partition ran again, elsewhere.
      const again = await dist.db
        .selectFrom('job_partition')
        .select(['status', 'attempts', 'worker'])
        .where('job_id', '=', jobId)
        .where('partition_no', '=', killed!.partitionNo)
        .executeTakeFirstOrThrow();
      expect(again.status).toBe('done');
      expect(again.attempts).toBeGreaterThanOrEqual(2);
      expect(again.worker).not.toBe(workers[0]!.id);
      expect(result.retriedPartitions).toBeGreaterThanOrEqual(1);

      const refJob = await watchJob(ref.db, refJobId, { pollMs: 2000 });
      expect(refJob.status, String(refJob.error)).toBe('finished');
      expect((refJob.result as { counts: { read: number }; partitions: number }).counts.read).toBe(SIZE);
      expect((refJob.result as { partitions: number }).partitions).toBe(1);

      // The two registers agree.
      const a = await clusteringOf(dist.db, mentions);
      const b = await clusteringOf(ref.db, mentions);
      const agreement = pairAgreement(a, b);
      const partitionOf = new Map<string, number>();
      const parts = await dist.db.selectFrom('job_partition').select(['partition_no', 'result']).where('job_id', '=', jobId).execute();
      for (const p of parts) {
        const r = (typeof p.result === 'string' ? JSON.parse(p.result) : p.result) as { members: [string, string][] };
        for (const [, externalId] of r.members) partitionOf.set(externalId, p.partition_no);
      }
      const differing = differingPairs(a, b);
      const lines = [
        `scale-out: ${SIZE} mentions, ${result.partitions} partitions, ${result.crossPairs} linking pairs across partitions, ${result.merges.length} final-pass merges, ${result.retriedPartitions} partition(s) run again (worker ${workers[0]!.id} killed in partition ${killed!.partitionNo})`,
        `pairwise agreement with one process: ${agreement.agreement.toFixed(6)} (together in both ${agreement.both}, only distributed ${agreement.firstOnly}, only one process ${agreement.secondOnly})`,
        ...differing.map(({ pair: [x, y], together }) => {
          const m = mentions[x]!;
          const n = mentions[y]!;
          return `  differs: "${m.text}" (${m.externalId}, partition ${partitionOf.get(m.externalId)}) + "${n.text}" (${n.externalId}, partition ${partitionOf.get(n.externalId)}): together only in the ${together === 'first' ? 'distributed' : 'one-process'} register`;
        }),
      ];
      process.stdout.write(`${lines.join('\n')}\n`);
      expect(agreement.both).toBeGreaterThan(SIZE / 10);
      expect(agreement.agreement).toBeGreaterThanOrEqual(AGREEMENT);

      // `cpreg verify` on the distributed register: every invariant and a replay of the whole history. (The
      // reference only needs its invariants.)
      const verified = await Promise.all([
        runCli(['verify', '--db', distUrl, '--json'], { timeoutMs: 900_000 }),
        runCli(['verify', '--no-replay', '--db', refUrl, '--json'], { timeoutMs: 900_000 }),
      ]);
      for (const v of verified) expect(v.code, v.stdout + v.stderr).toBe(0);
    },
    40 * 60_000,
  );
});
