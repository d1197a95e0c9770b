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
import { join } from 'node:path';
import type { BenchContext, BenchRow } from './types.ts';
import { BUDGET_S, partitionSizeFor, runOnce, type RunOutcome } from './scale-out/run-once.ts';
import { writeMentions } from './scale-out/cpreg-processes.ts';
import { sizeRows } from './scale-out/size-rows.ts';

const WORKER_COUNTS = [1, 2] as const;

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
    rows.push(...sizeRows(size, lastComplete));
  }
  return rows;
}
