/**
 * Scale-out of a partitioned ingest job (PostgreSQL only; a benchmark, not a test): the same batch of generated
 * mentions (ctx.sizes.scaleOut: quick 5,000; default 50,000; full 1,000,000) submitted with
 * `cpreg ingest --as-job --no-wait` to a fresh database served by 1, then 2, `cpreg worker` child processes.
 *
 * Per run it records:
 *  - mentions/s: mentions read / wall time from the submit to the job's end (staging, planning, partitions, final pass);
 *  - the planner's time (job result planningMs) and the phases read from the job's timestamps;
 *  - where the CPU time went: utime+stime (/proc/<pid>/stat) of the worker processes, of the submitting process, and
 *    of the PostgreSQL backends serving this database (pids from pg_stat_activity, sampled every second, so a backend
 *    that exits loses at most its last second). Database share = postgres CPU / (postgres CPU + worker CPU). The
 *    whole server's CPU (every process named postgres, exited backends included through the postmaster's cutime)
 *    and the machine's busy CPU are kept in `extra`: they also count anything else the machine runs meanwhile;
 *  - after the run, pg_total_relation_size (table + indexes + TOAST) of the register's big tables, per million
 *    mentions and per million counterparties.
 * Each run has a time budget (the runner kills a quick file at 300 s): past it the job is abandoned, the rate is
 * recorded over the partitions done and the row says so. Workers are killed and the database dropped at the end,
 * also when the run fails. CPREG_BENCH_SCALE_OUT_SIZES=20000 (comma list) overrides the sizes.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { createWriteStream, readdirSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { migrateToLatest } from '../db/migrate.ts';
import { openDatabase } from '../db/open-database.ts';
import { dropDatabase, freshDatabase } from './resolve-load.ts';
import type { BenchContext, BenchRow } from './types.ts';

const REPO = dirname(dirname(fileURLToPath(import.meta.url)));
const CLI = join(REPO, 'bin/cpreg.js');
const WORKER_COUNTS = [1, 2] as const;
/** Seconds one run (one worker count) may take from the submit before it is abandoned. */
const BUDGET_S = { quick: 100, default: 1500, full: 5400 } as const;
/** The tables whose sizes are recorded (each with its indexes and TOAST). */
const SIZED_TABLES = ['mention', 'counterparty', 'counterparty_name', 'blocking_key', 'history_event', 'review_item'] as const;
const TICKS_PER_S = 100; // USER_HZ on Linux (getconf CLK_TCK)

/** At least 16 partitions, so that two workers have work to share; at most the default 2,000 mentions each. */
export function partitionSizeFor(size: number): number {
  return Math.max(100, Math.min(2000, Math.ceil(size / 16)));
}

// ------------------------------------------------------------------ CPU time from /proc

/** [utime+stime, cutime+cstime] of a process in seconds, or undefined when it is gone. */
function procCpu(pid: number | 'self'): { own: number; children: number } | undefined {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // After "pid (comm) ": f[0] is field 3 (state); utime is field 14, stime 15, cutime 16, cstime 17.
    return { own: (Number(f[11]) + Number(f[12])) / TICKS_PER_S, children: (Number(f[13]) + Number(f[14])) / TICKS_PER_S };
  } catch {
    return undefined;
  }
}

function procName(pid: string): string | undefined {
  try {
    return readFileSync(`/proc/${pid}/comm`, 'utf8').trim();
  } catch {
    return undefined;
  }
}

/** CPU seconds of every process named postgres, their waited-for children included (the whole server). */
function serverCpu(): number {
  let total = 0;
  for (const pid of readdirSync('/proc').filter((p) => /^\d+$/.test(p))) {
    if (procName(pid) !== 'postgres') continue;
    const cpu = procCpu(Number(pid));
    if (cpu) total += cpu.own + cpu.children;
  }
  return total;
}

/** Busy and total CPU seconds of the whole machine (/proc/stat, all cores). */
function machineCpu(): { busy: number; total: number } {
  const cols = readFileSync('/proc/stat', 'utf8').split('\n')[0]!.trim().split(/\s+/).slice(1).map(Number);
  const total = cols.slice(0, 8).reduce((a, b) => a + b, 0);
  const idle = cols[3]! + cols[4]!;
  return { busy: (total - idle) / TICKS_PER_S, total: total / TICKS_PER_S };
}

/**
 * Follows the CPU time of the backends of one database: every `tick` it lists their pids (pg_stat_activity) and
 * reads each one's CPU; a backend's contribution is its last reading minus its first (0 for one born meanwhile).
 */
class BackendCpu {
  private readonly first = new Map<number, number>();
  private readonly last = new Map<number, number>();
  private readonly born = new Set<number>();
  private started = false;

  constructor(
    private readonly admin: pg.Client,
    private readonly database: string,
    private readonly exclude: number,
  ) {}

  async tick(): Promise<void> {
    const { rows } = await this.admin.query<{ pid: number }>('SELECT pid FROM pg_stat_activity WHERE datname = $1 AND pid <> $2', [
      this.database,
      this.exclude,
    ]);
    for (const { pid } of rows) {
      const cpu = procCpu(pid);
      if (!cpu) continue;
      if (!this.first.has(pid)) {
        this.first.set(pid, this.started ? 0 : cpu.own);
        if (this.started) this.born.add(pid);
      }
      this.last.set(pid, cpu.own);
    }
    this.started = true;
  }

  seconds(): number {
    let total = 0;
    for (const [pid, last] of this.last) total += last - (this.first.get(pid) ?? last);
    return total;
  }

  backends(): number {
    return this.last.size;
  }
}

// ------------------------------------------------------------------ processes

async function writeMentions(ctx: BenchContext, file: string, size: number): Promise<void> {
  const out = createWriteStream(file);
  let i = 0;
  for (const name of ctx.generator.names(size, ctx.seed)) {
    const line = `${JSON.stringify({ externalId: `r${i++}`, text: name.name, country: name.country })}\n`;
    if (!out.write(line)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
}

/** `cpreg worker --db url`; resolves once it says it is taking jobs. */
async function startWorker(url: string, tail: string[]): Promise<ChildProcess> {
  const child = spawn(process.execPath, [CLI, 'worker', '--db', url], { cwd: REPO, stdio: ['ignore', 'ignore', 'pipe'] });
  const lines = createInterface({ input: child.stderr! });
  const ready = new Promise<void>((resolve, reject) => {
    lines.on('line', (line) => {
      tail.push(line);
      if (tail.length > 20) tail.shift();
      if (line.includes('taking jobs from')) resolve();
    });
    child.once('exit', (code, signal) => reject(new Error(`cpreg worker exited (${signal ?? code}) before taking jobs: ${tail.join(' | ')}`)));
  });
  await ready;
  return child;
}

async function stopProcess(child: ChildProcess): Promise<void> {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = once(child, 'exit');
  child.kill('SIGTERM');
  const timer = setTimeout(() => child.kill('SIGKILL'), 5000);
  await exited;
  clearTimeout(timer);
}

/** Runs a cpreg command to its end; answers its stdout (throws with its stderr when it fails). */
async function cpreg(args: string[]): Promise<string> {
  const child = spawn(process.execPath, [CLI, ...args], { cwd: REPO, stdio: ['ignore', 'pipe', 'pipe'] });
  let out = '';
  let err = '';
  child.stdout!.on('data', (d: Buffer) => (out += d.toString()));
  child.stderr!.on('data', (d: Buffer) => (err += d.toString()));
  const [code] = (await once(child, 'exit')) as [number | null];
  if (code !== 0) throw new Error(`cpreg ${args[0]} exited with ${code}: ${err.trim().slice(-500)}`);
  return out;
}

// ------------------------------------------------------------------ one run

interface RunOutcome {
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

async function runOnce(ctx: BenchContext, file: string, size: number, workers: number): Promise<RunOutcome> {
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

// ------------------------------------------------------------------ the bench

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const override = process.env.CPREG_BENCH_SCALE_OUT_SIZES?.split(',').filter(Boolean).map(Number);
  const sizes = override && override.length > 0 ? override : (ctx.sizes.scaleOut ?? { quick: [5_000], default: [50_000], full: [1_000_000] }[ctx.mode]);
  if (!ctx.databaseUrl) {
    return [
      {
        id: 'scaleout.rate',
        label: 'job ingest mentions/s',
        value: 0,
        unit: 'mentions/s',
        better: 'higher',
        backend: 'postgres',
        skipped: 'DATABASE_URL not set',
      },
    ];
  }
  if (process.platform !== 'linux') {
    return [
      {
        id: 'scaleout.rate',
        label: 'job ingest mentions/s',
        value: 0,
        unit: 'mentions/s',
        better: 'higher',
        backend: 'postgres',
        skipped: 'CPU times are read from /proc (Linux only)',
      },
    ];
  }
  const rows: BenchRow[] = [];
  for (const size of sizes) {
    if (!Number.isInteger(size) || size < 1) throw new Error(`CPREG_BENCH_SCALE_OUT_SIZES: ${size} is not a whole number of mentions`);
    const file = join(ctx.tmpDir, `mentions-${size}.ndjson`);
    await writeMentions(ctx, file, size);
    let lastComplete: RunOutcome | undefined;
    for (const workers of WORKER_COUNTS) {
      const id = `scaleout.${size}.w${workers}`;
      const base = { size, backend: 'postgres' as const };
      ctx.log(`${size.toLocaleString('en-US')} mentions, ${workers} worker(s), partitions of ${partitionSizeFor(size)} (budget ${BUDGET_S[ctx.mode]} s)`);
      const o = await runOnce(ctx, file, size, workers);
      const dbShare = o.postgresCpuS / Math.max(1e-9, o.postgresCpuS + o.workerCpuS);
      const counted = o.complete ? o.mentions : o.mentionsDone;
      const extra: Record<string, number | string | boolean> = {
        workers,
        complete: o.complete,
        wallSeconds: o.wallS,
        mentions: counted,
        partitionSize: partitionSizeFor(size),
        workerCpuSeconds: o.workerCpuS,
        postgresCpuSeconds: o.postgresCpuS,
        submitCpuSeconds: o.submitCpuS,
        serverWideCpuSeconds: o.serverCpuS,
        machineBusyShare: o.machineBusyShare,
        otherProcessesCpuSeconds: o.otherCpuS,
        otherProcessesCoreShare: o.otherCpuS / o.wallS,
        postgresBackendsSeen: o.backends,
        cpus: 2,
      };
      if (o.reason) extra.stopped = o.reason;
      if (o.phases) for (const [k, v] of Object.entries(o.phases)) extra[k] = v;
      const result = o.result ?? {};
      for (const k of ['partitions', 'crossPairs', 'slowestPartitionMs', 'retriedPartitions'] as const) if (typeof result[k] === 'number') extra[k] = result[k];
      if (Array.isArray(result.merges)) extra.finalPassMerges = result.merges.length;
      const counts = (result.counts ?? {}) as Record<string, number>;
      for (const [k, v] of Object.entries(counts)) extra[`count_${k}`] = v;
      const label = o.complete ? '' : ` (partial: ${o.reason}; over the ${counted} mentions in finished partitions)`;
      ctx.record({
        id: `${id}.rate`,
        label: `job ingest mentions/s, ${workers} worker(s), submit to finished${label}`,
        value: counted / o.wallS,
        unit: 'mentions/s',
        better: 'higher',
        ...base,
        ...(workers > 1 ? { baseline: `scaleout.${size}.w1.rate` } : {}),
        extra,
      });
      const more: BenchRow[] = [
        {
          id: `${id}.db_share`,
          label: `database share of CPU (postgres / (postgres + workers)), ${workers} worker(s)`,
          value: dbShare,
          unit: 'share',
          better: 'lower',
          ...base,
        },
        {
          id: `${id}.worker_cpu_ms_per_mention`,
          label: `worker (matching) CPU per mention, ${workers} worker(s)`,
          value: (o.workerCpuS * 1000) / Math.max(1, counted),
          unit: 'ms',
          better: 'lower',
          ...base,
        },
        {
          id: `${id}.postgres_cpu_ms_per_mention`,
          label: `PostgreSQL CPU per mention, ${workers} worker(s)`,
          value: (o.postgresCpuS * 1000) / Math.max(1, counted),
          unit: 'ms',
          better: 'lower',
          ...base,
        },
      ];
      if (typeof result.planningMs === 'number')
        more.push({
          id: `${id}.planning`,
          label: `planner time (serial), ${workers} worker(s)`,
          value: result.planningMs / 1000,
          unit: 's',
          better: 'lower',
          ...base,
        });
      if (o.phases)
        more.push({
          id: `${id}.final_pass`,
          label: `final pass (serial), last partition done to job finished, ${workers} worker(s)`,
          value: o.phases.finalPassS,
          unit: 's',
          better: 'lower',
          ...base,
        });
      // Sent now (kept if a later run fails), so not returned again.
      for (const row of more) ctx.record(row);
      if (o.complete) lastComplete = o;
    }
    if (!lastComplete?.sizes) {
      rows.push({
        id: `scaleout.${size}.size.total`,
        label: 'register size per million mentions',
        value: 0,
        unit: 'MB',
        better: 'lower',
        size,
        backend: 'postgres',
        skipped: 'no run finished within its budget',
      });
      continue;
    }
    const mentions = lastComplete.mentionRows!;
    const cps = lastComplete.counterparties!;
    const mb = (bytes: number): number => bytes / 1024 ** 2;
    let total = 0;
    for (const t of lastComplete.sizes) {
      total += t.bytes;
      rows.push({
        id: `scaleout.${size}.size.${t.table}`,
        label: `${t.table} (table + indexes + TOAST) per million mentions`,
        value: (mb(t.bytes) * 1e6) / mentions,
        unit: 'MB',
        better: 'lower',
        size,
        backend: 'postgres',
        extra: {
          bytes: t.bytes,
          tableBytes: t.tableBytes,
          indexBytes: t.indexBytes,
          rows: t.rows,
          mentions,
          counterparties: cps,
          mbPerMillionCounterparties: (mb(t.bytes) * 1e6) / Math.max(1, cps),
          rowsPerMention: t.rows / mentions,
        },
      });
    }
    rows.push({
      id: `scaleout.${size}.size.total`,
      label: `the ${SIZED_TABLES.length} tables together per million mentions`,
      value: (mb(total) * 1e6) / mentions,
      unit: 'MB',
      better: 'lower',
      size,
      backend: 'postgres',
      extra: {
        bytes: total,
        mentions,
        counterparties: cps,
        counterpartiesPerMention: cps / mentions,
        mbPerMillionCounterparties: (mb(total) * 1e6) / Math.max(1, cps),
      },
    });
  }
  return rows;
}
