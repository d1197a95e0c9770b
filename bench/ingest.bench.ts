/**
 * Batch ingest throughput (issue 7 goal: ≥ 5,000 mentions/s into PostgreSQL): `ingestFile` over an NDJSON file of
 * generated mentions (the scale generator's invented names, a quarter of them variants of others), into a fresh
 * embedded database and a fresh PostgreSQL database. Sizes: ctx.sizes.ingest (quick 10,000; default 100,000;
 * full adds 1,000,000 on PostgreSQL only). Also records the rate of a second run over the same file (resume:
 * every row already ingested), the peak RSS (memory must not grow with the file) and which stage of the batch path
 * took the time (check, read, decide, cluster, write, flush, and the ingest's own: file, resume, record).
 */
import { createWriteStream } from 'node:fs';
import { once } from 'node:events';
import { join } from 'node:path';
import pg from 'pg';
import { openDatabase } from '../db/open-database.ts';
import { migrateToLatest } from '../db/migrate.ts';
import { ingestFile } from '../services/ingest/run-ingest.ts';
import type { StageTimes } from '../services/register/stage-times.ts';
import type { BenchContext, BenchRow } from './types.ts';

async function writeMentions(ctx: BenchContext, file: string, size: number): Promise<void> {
  const out = createWriteStream(file);
  let i = 0;
  for (const name of ctx.generator.names(size, ctx.seed)) {
    const line = `${JSON.stringify({ externalId: `g-${i++}`, text: name.name, country: name.country })}\n`;
    if (!out.write(line)) await once(out, 'drain');
  }
  out.end();
  await once(out, 'finish');
}

/**
 * Which stage took the time (services/register/stage-times.ts): one row per stage, in milliseconds per mention read,
 * largest first, and one log line with each stage's share of the run.
 */
function recordStages(ctx: BenchContext, id: string, backend: 'pglite' | 'postgres', size: number, stages: StageTimes, rowsDone: number): void {
  const total = Object.values(stages).reduce((a, b) => a + b, 0);
  const order = Object.entries(stages).sort((a, b) => b[1] - a[1]);
  ctx.log(`${backend}: time by stage: ${order.map(([stage, ms]) => `${stage} ${((100 * ms) / total).toFixed(1)} %`).join(', ')}`);
  for (const [stage, ms] of order) {
    ctx.record({
      id: `${id}.stage.${stage}`,
      label: `ingest stage ${stage}, ms per mention (${((100 * ms) / total).toFixed(1)} % of the run)`,
      value: ms / Math.max(1, rowsDone),
      unit: 'ms/mention',
      better: 'lower',
      size,
      backend,
    });
  }
}

async function freshPostgres(url: string, name: string): Promise<{ url: string; drop: () => Promise<void> }> {
  const admin = new pg.Client({ connectionString: url });
  await admin.connect();
  await admin.query(`DROP DATABASE IF EXISTS "${name}"`);
  await admin.query(`CREATE DATABASE "${name}"`);
  await admin.end();
  const target = new URL(url);
  target.pathname = `/${name}`;
  return {
    url: target.toString(),
    drop: async () => {
      const c = new pg.Client({ connectionString: url });
      await c.connect();
      await c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      await c.end();
    },
  };
}

/** Seconds one backend may ingest before the run stops between batches (the runner kills a file at 300 s in
 * quick mode): the rate is then measured over the rows done, and the row says it was stopped. */
const BUDGET_S = { quick: 20, default: 1500, full: 3000 } as const;
/** Rows resolved together. Quick mode takes smaller batches so that its 20 s budget (checked between batches)
 * is not overrun by one long batch: on PGlite a batch of 1,000 took about 37 s (about 27 mentions/s), and the
 * whole quick run must stay under two minutes. */
const BATCH_SIZE = { quick: 250, default: 1000, full: 1000 } as const;
/** CPREG_BENCH_BACKENDS=postgres (or pglite) runs one backend only. */
const ONLY = process.env.CPREG_BENCH_BACKENDS?.split(',');

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const targets: { backend: 'pglite' | 'postgres'; size: number }[] = [];
  for (const size of ctx.sizes.ingest) {
    if (size <= 100_000) targets.push({ backend: 'pglite', size });
    targets.push({ backend: 'postgres', size });
  }
  for (const { backend, size } of targets.filter((t) => !ONLY || ONLY.includes(t.backend))) {
    const id = `ingest.${backend}.${size}`;
    if (backend === 'postgres' && !ctx.databaseUrl) {
      rows.push({
        id: `${id}.rate`,
        label: 'ingest mentions/s',
        value: 0,
        unit: 'mentions/s',
        better: 'higher',
        size,
        backend,
        skipped: 'DATABASE_URL not set',
      });
      continue;
    }
    const file = join(ctx.tmpDir, `mentions-${size}.ndjson`);
    await writeMentions(ctx, file, size);
    const pgDb = backend === 'postgres' ? await freshPostgres(ctx.databaseUrl!, `cpreg_bench_ingest_${size}`) : undefined;
    const database = await openDatabase(pgDb ? pgDb.url : join(ctx.tmpDir, `pglite-${size}`), { command: 'bench ingest' });
    try {
      await migrateToLatest(database.db);
      ctx.log(`${backend}: ingesting ${size.toLocaleString('en-US')} mentions (time budget ${BUDGET_S[ctx.mode]} s)`);
      const started = performance.now();
      const stages: StageTimes = {};
      const { result, peakRssMb } = await ctx.withPeakMemory(() =>
        ingestFile({
          db: database.db,
          file,
          stages,
          source: 'bench',
          rejectsFile: join(ctx.tmpDir, `rejects-${backend}-${size}.csv`),
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
      ctx.record({
        id: `${id}.rate`,
        label: stopped ? `ingest mentions/s (first run; stopped at the time budget after ${result.counts.read} rows)` : 'ingest mentions/s (first run)',
        value: result.counts.read / seconds,
        unit: 'mentions/s',
        better: 'higher',
        size,
        backend,
        ...(backend === 'postgres' ? { goal: { op: '>=' as const, value: 5000 } } : {}),
        extra: {
          seconds,
          rowsDone: result.counts.read,
          complete: !stopped,
          rejected: result.counts.rejected,
          linked: result.counts.linked,
          new: result.counts.new,
          review: result.counts.review,
          ...Object.fromEntries(Object.entries(stages).map(([stage, ms]) => [`stageMs.${stage}`, Math.round(ms)])),
        },
      });
      recordStages(ctx, id, backend, size, stages, result.counts.read);
      ctx.record({ id: `${id}.peak_rss`, label: 'peak RSS while ingesting', value: peakRssMb, unit: 'MB', better: 'lower', size, backend });
      if (stopped) {
        rows.push({
          id: `${id}.resume_rate`,
          label: 'ingest rows/s when every row is already ingested (resume)',
          value: 0,
          unit: 'rows/s',
          better: 'higher',
          size,
          backend,
          skipped: 'the first run stopped at its time budget',
        });
        continue;
      }
      const again = await ingestFile({
        db: database.db,
        file,
        source: 'bench',
        rejectsFile: join(ctx.tmpDir, `rejects2-${backend}-${size}.csv`),
        actor: 'bench',
      });
      rows.push({
        id: `${id}.resume_rate`,
        label: 'ingest rows/s when every row is already ingested (resume)',
        value: again.counts.read / (again.elapsedMs / 1000),
        unit: 'rows/s',
        better: 'higher',
        size,
        backend,
        baseline: `${id}.rate`,
      });
    } finally {
      await database.close();
      await pgDb?.drop();
    }
  }
  return rows;
}
