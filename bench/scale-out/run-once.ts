/**
 * One run of the scale-out bench: a fresh database, n workers, the batch submitted as a partitioned ingest job and
 * followed to its end or its time budget, then the CPU times, the job's phases and the tables' sizes read.
 */
import { createFreshDatabase, dropDatabaseIfExists } from '../../db/queries/admin-databases.ts';
import type { ChildProcess } from 'node:child_process';
import { migrateToLatest } from '../../db/migrate.ts';
import { openDatabase, type OpenedDatabase } from '../../db/open-database.ts';
import { jobStatus, jobTimes, partitionTally } from '../../db/queries/jobs.ts';
import { ownBackendPid } from '../../db/queries/server-activity.ts';
import { analyze, tableSizes } from '../../db/queries/table-statistics.ts';
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
  const url = await createFreshDatabase(ctx.databaseUrl!, name);
  const children: ChildProcess[] = [];
  // One connection each, so that the bench's own backend on the job's database is one pid to leave out.
  let admin: OpenedDatabase | undefined;
  let target: OpenedDatabase | undefined;
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
    admin = await openDatabase(ctx.databaseUrl, { poolSize: 1 });
    target = await openDatabase(url, { poolSize: 1 });
    const db = target.db;
    const ownPid = await ownBackendPid(db);
    const backends = new BackendCpu(admin.db, name, ownPid);
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
      const row = (await jobStatus(db, jobId))!;
      status = row.status;
      error = row.error;
      if (performance.now() - lastLog > 15_000) {
        lastLog = performance.now();
        const t = await partitionTally(db, jobId);
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
    const { mentionsDone } = await partitionTally(db, jobId);
    const common = {
      wallS,
      mentions: size,
      mentionsDone,
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
    const times = (await jobTimes(db, jobId))!;
    const s = (a: Date, b: Date): number => (b.getTime() - a.getTime()) / 1000;
    // A finished job has finished partitions: the instants are there.
    const firstStart = times.firstPartitionStart!;
    const lastDone = times.lastPartitionDone!;
    const phases = {
      stagingS: stagedS,
      toFirstPartitionS: s(times.createdAt, firstStart),
      partitionsS: s(firstStart, lastDone),
      finalPassS: s(lastDone, times.finishedAt!),
    };
    await analyze(db);
    const sizes = await tableSizes(db, SIZED_TABLES);
    const counterparties = sizes.find((x) => x.table === 'counterparty')!.rows;
    const mentionRows = sizes.find((x) => x.table === 'mention')!.rows;
    return { ...common, complete: true, result: shown.result, phases, sizes, counterparties, mentionRows };
  } finally {
    await Promise.all(children.map(stopProcess));
    await admin?.close().catch(() => undefined);
    await target?.close().catch(() => undefined);
    await dropDatabaseIfExists(ctx.databaseUrl!, name);
  }
}
