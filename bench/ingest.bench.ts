/**
 * Batch ingest throughput (issue 18 goals: ≥ 5,000 mentions/s into PostgreSQL, into an empty register and into one
 * of 1,000,000 counterparties; ≥ 1,500/s embedded; memory ≤ 1 GiB for a batch of 1,000,000 names): `ingestFile`
 * over an NDJSON file of generated mentions (the scale generator's invented names, a quarter of them variants of
 * others). Sizes: ctx.sizes.ingest (quick 10,000; default 100,000; full adds 1,000,000 on PostgreSQL only).
 *
 *  - into a fresh database, embedded (up to 100,000) and PostgreSQL;
 *  - into a PostgreSQL register bulk-loaded first (bulkLoad, bench/register.bench.ts) with the register sizes of
 *    1,000,000 or more (--full, or `--sizes 1000000`), or with every size given by --sizes (`--sizes 10000` runs it
 *    small): the mentions are the smallest ingest size, the generator's names after the register's own.
 *
 * Each ingest and each bulk load runs in a process of its own (bench/in-child.ts), so that the peak RSS of an ingest
 * is that ingest's alone (not raised by an embedded run or a load before it in the same process). Beside the rate:
 * the rate of a second run over the same file (resume: every row already ingested), the peak RSS, and which stage
 * of the batch path took the time (check, read, decide, cluster, write, flush, and the ingest's own: file, resume,
 * record); the rate row carries them, so a missed goal names its largest stage in the table.
 */
import { createFreshDatabase, dropDatabaseIfExists } from '../db/queries/admin-databases.ts';
import { runInChild } from './in-child.ts';
import { runTarget, targetId, type IngestTarget } from './ingest-target.ts';
import type { BenchContext, BenchRow } from './types.ts';

/** CPREG_BENCH_BACKENDS=postgres (or pglite) runs one backend only. */
const ONLY = process.env.CPREG_BENCH_BACKENDS?.split(',');
/** Set in the bench's own child processes: the part to run there (IngestTarget as JSON). */
const PART_ENV = 'CPREG_BENCH_INGEST_PART';
/** The register size from which --full (and a size given alone) ingests into a loaded register. */
const LOADED_FROM = 1_000_000;

/** What the run measures: fresh registers for every ingest size, then loaded registers (see the header). */
export function ingestTargets(ctx: Pick<BenchContext, 'sizes' | 'sizesGiven'>): Omit<IngestTarget, 'part' | 'url'>[] {
  const targets: Omit<IngestTarget, 'part' | 'url'>[] = [];
  for (const size of ctx.sizes.ingest) {
    if (size <= 100_000) targets.push({ backend: 'pglite', size, registerSize: 0 });
    targets.push({ backend: 'postgres', size, registerSize: 0 });
  }
  const mentions = Math.min(...ctx.sizes.ingest);
  for (const registerSize of ctx.sizes.register.filter((s) => ctx.sizesGiven || s >= LOADED_FROM)) {
    targets.push({ backend: 'postgres', size: mentions, registerSize });
  }
  return targets.filter((t) => !ONLY || ONLY.includes(t.backend));
}

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const part = process.env[PART_ENV];
  if (part) return runTarget(ctx, JSON.parse(part) as IngestTarget);
  const rows: BenchRow[] = [];
  for (const target of ingestTargets(ctx)) {
    const id = targetId(target);
    if (target.backend === 'postgres' && !ctx.databaseUrl) {
      const { size, backend } = target;
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
    // The process id keeps two runs on one server (two checkouts) from dropping each other's database.
    const name = `cpreg_bench_ingest_${target.size}${target.registerSize > 0 ? `_r${target.registerSize}` : ''}_${process.pid}`;
    const url = target.backend === 'postgres' ? await createFreshDatabase(ctx.databaseUrl!, name) : undefined;
    try {
      const inChild = (p: IngestTarget['part']) => runInChild(ctx, 'ingest.bench.ts', { [PART_ENV]: JSON.stringify({ ...target, part: p, url }) });
      if (target.registerSize > 0) await inChild('load');
      const { peakRssMb } = await inChild('ingest');
      ctx.record({
        id: `${id}.process_peak_rss`,
        label: 'peak RSS of the ingest process (from the OS: mention file, ingest and resume)',
        value: peakRssMb,
        unit: 'MB',
        better: 'lower',
        size: target.size,
        backend: target.backend,
      });
    } finally {
      if (url) await dropDatabaseIfExists(ctx.databaseUrl!, name);
    }
  }
  return rows;
}
