/**
 * One part of the ingest bench (bench/ingest.bench.ts), run in a process of its own so that its peak memory is its
 * own: `load` bulk-loads a register into a database, `ingest` ingests an NDJSON file of generated mentions into one
 * and records its rate, the stages its time went to, its peak RSS and the rate of a second run (resume).
 */
import { createWriteStream } from 'node:fs';
import { once } from 'node:events';
import { join } from 'node:path';
import { openDatabase } from '../db/open-database.ts';
import { migrateToLatest } from '../db/migrate.ts';
import { ingestFile } from '../services/ingest/run-ingest.ts';
import type { StageTimes } from '../services/register/stage-times.ts';
import { bulkLoad } from './register.bench.ts';
import type { BenchContext, BenchRow, GeneratedName } from './types.ts';

export interface IngestTarget {
  part: 'load' | 'ingest';
  backend: 'pglite' | 'postgres';
  /** Mentions ingested. */
  size: number;
  /** Counterparties bulk-loaded before the ingest (0: a fresh register). */
  registerSize: number;
  /** PostgreSQL: the database, created (and dropped) by the caller. PGlite: a directory in the part's scratch dir. */
  url?: string;
}

/** The goals of issue 18 for a batch ingest: mentions/s by backend, and memory for a batch of 1,000,000 names. */
export const INGEST_GOALS = { postgres: 5000, pglite: 1500, memoryMb: 1024, memoryFromSize: 1_000_000 } as const;

/** Seconds one backend may ingest before the run stops between batches (the runner kills a file at 300 s in
 * quick mode): the rate is then measured over the rows done, and the row says it was stopped. */
const BUDGET_S = { quick: 20, default: 1500, full: 3000 } as const;
/** Rows resolved together. Quick mode takes smaller batches so that its 20 s budget (checked between batches)
 * is not overrun by one long batch: on PGlite a batch of 1,000 took about 37 s (about 27 mentions/s), and the
 * whole quick run must stay under two minutes. */
const BATCH_SIZE = { quick: 250, default: 1000, full: 1000 } as const;

/** The row id prefix of a target: `ingest.<backend>.<mentions>`, with `.register_<n>` into a loaded register. */
export function targetId(t: Pick<IngestTarget, 'backend' | 'size' | 'registerSize'>): string {
  return `ingest.${t.backend}.${t.size}${t.registerSize > 0 ? `.register_${t.registerSize}` : ''}`;
}

/** The generated names of a target: the register's first (registerSize of them), then the mentions. */
function namesOf(ctx: BenchContext, t: IngestTarget): Iterator<GeneratedName> {
  return ctx.generator.names(t.registerSize + t.size, ctx.seed)[Symbol.iterator]();
}

async function writeMentions(names: Iterator<GeneratedName>, file: string, size: number): Promise<void> {
  const out = createWriteStream(file);
  for (let i = 0; i < size; i++) {
    const r = names.next();
    if (r.done) break;
    const line = `${JSON.stringify({ externalId: `g-${i}`, text: r.value.name, country: r.value.country })}\n`;
    if (!out.write(line)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
}

/**
 * Which stage took the time (services/register/stage-times.ts): one row per stage, in milliseconds per mention read,
 * largest first, and one log line with each stage's share of the run.
 */
function recordStages(ctx: BenchContext, id: string, t: IngestTarget, stages: StageTimes, rowsDone: number): void {
  const total = Object.values(stages).reduce((a, b) => a + b, 0);
  const order = Object.entries(stages).sort((a, b) => b[1] - a[1]);
  ctx.log(`${t.backend}: time by stage: ${order.map(([stage, ms]) => `${stage} ${((100 * ms) / total).toFixed(1)} %`).join(', ')}`);
  for (const [stage, ms] of order) {
    ctx.record({
      id: `${id}.stage.${stage}`,
      label: `ingest stage ${stage}, ms per mention (${((100 * ms) / total).toFixed(1)} % of the run)`,
      value: ms / Math.max(1, rowsDone),
      unit: 'ms/mention',
      better: 'lower',
      size: t.size,
      backend: t.backend,
    });
  }
}

export async function runTarget(ctx: BenchContext, t: IngestTarget): Promise<BenchRow[]> {
  const database = await openDatabase(t.url ?? join(ctx.tmpDir, 'pglite'), { command: `bench ingest ${t.part}` });
  try {
    await migrateToLatest(database.db);
    if (t.part === 'load') {
      const started = performance.now();
      ctx.log(`${t.backend}: bulk-loading a register of ${t.registerSize.toLocaleString('en-US')} counterparties`);
      await bulkLoad(database.db, namesOf(ctx, t), t.registerSize, ctx.log);
      ctx.log(`${t.backend}: register loaded in ${((performance.now() - started) / 1000).toFixed(1)} s`);
      return [];
    }
    return await ingest(ctx, t, database.db);
  } finally {
    await database.close();
  }
}

async function ingest(ctx: BenchContext, t: IngestTarget, db: Parameters<typeof ingestFile>[0]['db']): Promise<BenchRow[]> {
  const { backend, size, registerSize } = t;
  const id = targetId(t);
  const file = join(ctx.tmpDir, `mentions-${size}.ndjson`);
  const names = namesOf(ctx, t);
  for (let n = 0; n < registerSize; n++) names.next();
  await writeMentions(names, file, size);
  const into = registerSize > 0 ? `into a register of ${registerSize.toLocaleString('en-US')}` : 'into an empty register';
  ctx.log(`${backend}: ingesting ${size.toLocaleString('en-US')} mentions ${into} (time budget ${BUDGET_S[ctx.mode]} s)`);
  const started = performance.now();
  const stages: StageTimes = {};
  const { result, peakRssMb } = await ctx.withPeakMemory(() =>
    ingestFile({
      db,
      file,
      stages,
      source: 'bench',
      rejectsFile: join(ctx.tmpDir, 'rejects.csv'),
      actor: 'bench',
      batchSize: BATCH_SIZE[ctx.mode],
      shouldStop: () => performance.now() - started > BUDGET_S[ctx.mode] * 1000,
      onProgress: (p) => {
        if (p.counts.read % 5000 < 1000) ctx.log(`${backend}: ${p.counts.read} rows, ${Math.round(p.counts.read / (p.elapsedMs / 1000))}/s`);
      },
    }),
  );
  const seconds = result.elapsedMs / 1000;
  const stopped = result.status === 'interrupted';
  const run = registerSize > 0 ? `${into}` : 'first run';
  ctx.record({
    id: `${id}.rate`,
    label: stopped ? `ingest mentions/s (${run}; stopped at the time budget after ${result.counts.read} rows)` : `ingest mentions/s (${run})`,
    value: result.counts.read / seconds,
    unit: 'mentions/s',
    better: 'higher',
    size,
    backend,
    goal: { op: '>=', value: INGEST_GOALS[backend] },
    stages,
    extra: {
      seconds,
      registerSize,
      rowsDone: result.counts.read,
      complete: !stopped,
      rejected: result.counts.rejected,
      linked: result.counts.linked,
      new: result.counts.new,
      review: result.counts.review,
      ...Object.fromEntries(Object.entries(stages).map(([stage, ms]) => [`stageMs.${stage}`, Math.round(ms)])),
    },
  });
  recordStages(ctx, id, t, stages, result.counts.read);
  ctx.record({
    id: `${id}.peak_rss`,
    label: `peak RSS while ingesting (sampled every 50 ms in a process of its own, ${backend})`,
    value: peakRssMb,
    unit: 'MB',
    better: 'lower',
    size,
    backend,
    ...(size >= INGEST_GOALS.memoryFromSize ? { goal: { op: '<=' as const, value: INGEST_GOALS.memoryMb } } : {}),
  });
  const resume = { id: `${id}.resume_rate`, label: 'ingest rows/s when every row is already ingested (resume)', unit: 'rows/s', better: 'higher' as const };
  if (stopped) return [{ ...resume, value: 0, size, backend, skipped: 'the first run stopped at its time budget' }];
  const again = await ingestFile({ db, file, source: 'bench', rejectsFile: join(ctx.tmpDir, 'rejects2.csv'), actor: 'bench' });
  return [{ ...resume, value: again.counts.read / (again.elapsedMs / 1000), size, backend, baseline: `${id}.rate` }];
}
