/**
 * One run of the scale-out bench: a fresh database, n workers, the batch submitted as a partitioned ingest job and
 * followed to its end or its time budget, then the CPU times, the job's phases and the tables' sizes read.
 */
import type { ChildProcess } from 'node:child_process';
import pg from 'pg';
import { migrateToLatest } from '../../db/migrate.ts';
import { openDatabase } from '../../db/open-database.ts';
import { dropDatabase, freshDatabase } from '../resolve-load.ts';
import type { BenchContext } from '../types.ts';
import { procCpu, serverCpu, machineCpu } from './proc-cpu.ts';
import { BackendCpu } from './backend-cpu.ts';
import { startWorker, stopProcess, cpreg } from './cpreg-processes.ts';

/** Seconds one run (one worker count) may take from the submit before it is abandoned. */
export const BUDGET_S = { quick: 100, default: 1500, full: 5400 } as const;
/** The tables whose sizes are recorded (each with its indexes and TOAST). */
export const SIZED_TABLES = ['mention', 'counterparty', 'counterparty_name', 'blocking_key', 'history_event', 'review_item'] as const;

/** At least 16 partitions, so that two workers have work to share; at most the default 2,000 mentions each. */
export function partitionSizeFor(size: number): number {
  return Math.max(100, Math.min(2000, Math.ceil(size / 16)));
}

export interface RunOutcome {
  complete: boolean;
  reason?: string;
  wallS: number;
  mentions: number;
  mentionsDone: number;
  workerCpuS: number;
  postgresCpuS: number;
  submitCpuS: number;
  serverCpuS: number;
  machineBusyShare: number;
  otherCpuS: number;
  backends: number;
  result?: Record<string, unknown>;
  phases?: { stagingS: number; toFirstPartitionS: number; partitionsS: number; finalPassS: number };
  sizes?: { table: string; bytes: number; tableBytes: number; indexBytes: number; rows: number }[];
  counterparties?: number;
  mentionRows?: number;
}

export async function runOnce(ctx: BenchContext, file: string, size: number, workers: number): Promise<RunOutcome> {
  const name = `cpreg_bench_scaleout_${size}_w${workers}`;
  const url = await freshDatabase(ctx.databaseUrl!, name);
  const children: ChildProcess[] = [];
  const admin = new pg.Client({ connectionString: ctx.databaseUrl });
  const target = new pg.Client({ connectionString: url });
  try {
    const database = await openDatabase(url, { command: 'bench scale-out' });
    try {
      await migrateToLatest(database.db);
    } finally {
      await database.close();
    }
    const tails: string[][] = [];
    for (let w = 0; w < workers; w++) {
      const tail: string[] = [];
      tails.push(tail);
      children.push(await startWorker(url, tail));
    }
    await admin.connect();
    await target.connect();
    const ownPid = Number((await target.query<{ pid: number }>('SELECT pg_backend_pid() AS pid')).rows[0]!.pid);
    const backends = new BackendCpu(admin, name, ownPid);
    await backends.tick();
    const workerStart = children.map((c) => procCpu(c.pid!)!.own);
    const serverStart = serverCpu();
    const machineStart = machineCpu();
    const selfStart = procCpu('self')!.children;
    const benchStart = procCpu('self')!.own;
    const started = performance.now();
    const sampler = setInterval(() => void backends.tick().catch(() => undefined), 1000);
    let jobId: number;
    try {
      const submitted = await cpreg([
        'ingest',
        file,
        '--source',
        'bench',
        '--as-job',
        '--no-wait',
        '--json',
        '--partition-size',
        String(partitionSizeFor(size)),
        '--db',
        url,
      ]);
      jobId = Number((JSON.parse(submitted.trim().split('\n').pop()!) as { jobId: number }).jobId);
    } catch (error) {
      clearInterval(sampler);
      throw error;
    }
    const submitCpuS = procCpu('self')!.children - selfStart;
    const stagedS = (performance.now() - started) / 1000;
    ctx.log(`${workers} worker(s): job ${jobId} staged in ${stagedS.toFixed(1)} s`);
    let status = 'queued';
    let error: string | null = null;
    let lastLog = 0;
    const budgetMs = BUDGET_S[ctx.mode] * 1000;
    while (status !== 'finished' && status !== 'failed') {
      if (performance.now() - started > budgetMs) break;
      if (children.some((c) => c.exitCode !== null || c.signalCode !== null)) {
        clearInterval(sampler);
        throw new Error(`a worker exited during the job: ${tails.flat().slice(-10).join(' | ')}`);
      }
      await new Promise((r) => setTimeout(r, 250));
      const row = (await target.query<{ status: string; error: string | null }>('SELECT status, error FROM job WHERE id = $1', [jobId])).rows[0]!;
      status = row.status;
      error = row.error;
      if (performance.now() - lastLog > 15_000) {
        lastLog = performance.now();
        const t = (
          await target.query<{ done: string; total: string }>(
            `SELECT count(*) FILTER (WHERE status = 'done') AS done, count(*) AS total FROM job_partition WHERE job_id = $1`,
            [jobId],
          )
        ).rows[0]!;
        ctx.log(`${workers} worker(s): ${status}, ${t.done}/${t.total} partitions after ${((performance.now() - started) / 1000).toFixed(0)} s`);
      }
    }
    const wallS = (performance.now() - started) / 1000;
    clearInterval(sampler);
    await backends.tick();
    const workerCpuS = children.reduce((sum, c, i) => sum + (procCpu(c.pid!)?.own ?? workerStart[i]!) - workerStart[i]!, 0);
    const serverCpuS = serverCpu() - serverStart;
    const machineEnd = machineCpu();
    const machineBusyShare = (machineEnd.busy - machineStart.busy) / Math.max(1e-9, machineEnd.total - machineStart.total);
    const benchCpuS = procCpu('self')!.own - benchStart;
    // CPU the machine spent on anything else meanwhile (other users' processes, other databases): it shares the cores.
    const otherCpuS = machineEnd.busy - machineStart.busy - workerCpuS - backends.seconds() - submitCpuS - benchCpuS;
    const done = (
      await target.query<{ mentions: string | null }>(`SELECT sum(size) AS mentions FROM job_partition WHERE job_id = $1 AND status = 'done'`, [jobId])
    ).rows[0]!;
    const common = {
      wallS,
      mentions: size,
      mentionsDone: Number(done.mentions ?? 0),
      workerCpuS,
      postgresCpuS: backends.seconds(),
      submitCpuS,
      serverCpuS,
      machineBusyShare,
      otherCpuS,
      backends: backends.backends(),
    };
    if (status === 'failed') throw new Error(`job ${jobId} failed: ${error}`);
    if (status !== 'finished') return { ...common, complete: false, reason: `stopped at the ${BUDGET_S[ctx.mode]} s budget (${status})` };
    const shown = JSON.parse(await cpreg(['jobs', 'show', String(jobId), '--json', '--db', url])) as { result: Record<string, unknown> };
    const times = (
      await target.query<{ created: Date; finished: Date; first_start: Date; last_done: Date }>(
        `SELECT j.created_at AS created, j.finished_at AS finished, min(p.started_at) AS first_start, max(p.finished_at) AS last_done
         FROM job j JOIN job_partition p ON p.job_id = j.id WHERE j.id = $1 GROUP BY j.id`,
        [jobId],
      )
    ).rows[0]!;
    const s = (a: Date, b: Date): number => (b.getTime() - a.getTime()) / 1000;
    const phases = {
      stagingS: stagedS,
      toFirstPartitionS: s(times.created, times.first_start),
      partitionsS: s(times.first_start, times.last_done),
      finalPassS: s(times.last_done, times.finished),
    };
    await target.query('ANALYZE');
    const sizes = [];
    for (const table of SIZED_TABLES) {
      const r = (
        await target.query<{ total: string; heap: string; idx: string; rows: string }>(
          `SELECT pg_total_relation_size($1::regclass) AS total, pg_table_size($1::regclass) AS heap, pg_indexes_size($1::regclass) AS idx, (SELECT count(*) FROM ${table}) AS rows`,
          [table],
        )
      ).rows[0]!;
      sizes.push({ table, bytes: Number(r.total), tableBytes: Number(r.heap), indexBytes: Number(r.idx), rows: Number(r.rows) });
    }
    const counterparties = sizes.find((x) => x.table === 'counterparty')!.rows;
    const mentionRows = sizes.find((x) => x.table === 'mention')!.rows;
    return { ...common, complete: true, result: shown.result, phases, sizes, counterparties, mentionRows };
  } finally {
    await Promise.all(children.map(stopProcess));
    await admin.end().catch(() => undefined);
    await target.end().catch(() => undefined);
    await dropDatabase(ctx.databaseUrl!, name);
  }
}
