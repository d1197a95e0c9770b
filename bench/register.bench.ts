/**
 * Resolve latency for single mentions inside the service (no HTTP): median and p99, with registers of 10,000 and
 * 100,000 counterparties on PGlite and PostgreSQL, and 1,000,000 on PostgreSQL under --full (or alone, with
 * `--sizes 1000000`: bench/run.ts).
 * Goal (issue 6): p99 ≤ 10 ms per mention on PostgreSQL at 1M.
 *
 * The register is bulk-loaded from the seeded name generator (one counterparty per generated name) through the
 * register's set-based loader (services/register/bulk-load.ts: keys, key counts and history as any write leaves
 * them; COPY on PostgreSQL, one statement of set-based inserts per chunk on PGlite); its time is reported
 * (loadSeconds, with the name generation and the VACUUM ANALYZE after it) but is set-up, not what is measured. Beside the latency: how many
 * candidates each resolve fetched and how many it had to score (the rest were cut by the score bound). Each measured call is a full resolveMention: analysis, candidates, scoring, the write and its
 * history event, in one transaction.
 *
 * Baseline (PostgreSQL only, issue 8): PostgreSQL trigram top-10 search over the same register, on the same probe
 * names, before any resolve call has grown it: `ORDER BY normalised <-> probe LIMIT 10` on counterparty_name.
 * The schema's trigram index is GIN, which cannot order by distance, so a GiST trigram index is built in the
 * throw-away bench database for this measurement and dropped before the resolve calls (whose writes it would
 * otherwise slow). The probe is normalised in Node first, outside the timing: the figure is the query alone.
 */
import type { Kysely } from 'kysely';
import type { Database } from '../db/types.ts';
import { createFreshDatabase, dropDatabaseIfExists } from '../db/queries/admin-databases.ts';
import { vacuumAnalyze } from '../db/queries/table-statistics.ts';
import { createTrigramGistIndex, dropTrigramGistIndex, trigramTop10, trigramTop10UsesIndex } from '../db/queries/trigram-baseline.ts';
import { openDatabase } from '../db/open-database.ts';
import { migrateToLatest } from '../db/migrate.ts';
import { createRegisterContext, resolveMention } from '../services/register/index.ts';
import { analyse } from '../services/register/matching/analysis.ts';
import { newMatchStats } from '../services/register/matching/match-stats.ts';
import { loadCounterparties, LOAD_CHUNK, type LoadRow } from '../services/register/bulk-load.ts';
import { observeStatements, resolveStages, type TimedStatement } from './resolve-stages.ts';
import type { BenchContext, BenchRow, GeneratedName } from './types.ts';

/**
 * Loads `size` generated names as counterparties through the register's bulk loader (services/register/bulk-load.ts:
 * the same set-based path a migration from another system takes, with keys, key counts and history).
 */
export async function bulkLoad(db: Kysely<Database>, names: Iterator<GeneratedName>, size: number, log: (m: string) => void): Promise<void> {
  // Read with next(), not for-of: breaking a for-of would close the generator the queries are taken from.
  function* rows(): Generator<LoadRow> {
    for (let n = 0; n < size; n++) {
      const r = names.next();
      if (r.done) return;
      yield { name: r.value.name, country: r.value.country };
    }
  }
  const progress = (loaded: number) => {
    if (loaded % 50_000 < LOAD_CHUNK) log(`  loaded ${loaded.toLocaleString('en-US')} / ${size.toLocaleString('en-US')}`);
  };
  // One transaction: a bench register is a fresh database's first load, the case oneTransaction is for (indexes
  // and key counts built once at the end, services/register/bulk-load.ts).
  await loadCounterparties(createRegisterContext(db), rows(), { actor: 'bench' }, { source: 'bench', progress, oneTransaction: true });
  // A register in service is vacuumed by autovacuum; a freshly loaded one is not yet: vacuum so that the key
  // lookups can use index-only scans as they would in steady state.
  await vacuumAnalyze(db);
}

function percentile(sorted: number[], p: number): number {
  const index = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[index]!;
}

async function measure(ctx: BenchContext, db: Kysely<Database>, backend: 'pglite' | 'postgres', size: number): Promise<BenchRow[]> {
  const started = performance.now();
  const stream = ctx.generator.names(size + 2000, ctx.seed)[Symbol.iterator]();
  await bulkLoad(db, stream, size, ctx.log);
  const loadSeconds = (performance.now() - started) / 1000;
  const queries: GeneratedName[] = [];
  for (let r = stream.next(); !r.done && queries.length < 1100; r = stream.next()) queries.push(r.value);
  const warm = 50;
  const count = ctx.mode === 'quick' ? 300 : 1000;
  const probes = queries.slice(0, warm + count);
  const baseline = backend === 'postgres' ? await measureTrigramTop10(db, probes, warm, size) : [];
  const candidateCounts = newMatchStats();
  const register = createRegisterContext(db, { stats: candidateCounts });
  const times: number[] = [];
  const stagesOf: Record<string, number>[] = [];
  const statuses: Record<string, number> = {};
  let counted = { ...candidateCounts };
  let sent: TimedStatement[] = [];
  const stopObserving = await observeStatements((s) => sent.push(s));
  try {
    for (let i = 0; i < Math.min(queries.length, warm + count); i++) {
      const q = queries[i]!;
      sent = [];
      const t0 = performance.now();
      const r = await resolveMention(register, { source: 'bench', externalId: `q${i}`, text: q.name, country: q.country }, { actor: 'bench' });
      const t1 = performance.now();
      if (i >= warm) {
        times.push(t1 - t0);
        stagesOf.push(
          resolveStages(
            t0,
            t1,
            [...sent].sort((a, b) => a.start - b.start),
          ),
        );
        statuses[r.status] = (statuses[r.status] ?? 0) + 1;
      } else if (i === warm - 1) counted = { ...candidateCounts };
    }
  } finally {
    stopObserving();
  }
  const { all: stages, tail: tailStages } = stageTotals(times, stagesOf);
  recordStages(ctx, backend, size, stages, times.length);
  const lists = Math.max(1, candidateCounts.probes - counted.probes);
  const perProbe = (k: 'fetched' | 'scored') => Math.round(((candidateCounts[k] - counted[k]) / lists) * 10) / 10;
  const sorted = [...times].sort((a, b) => a - b);
  const goal = backend === 'postgres' && size >= 1_000_000 ? { goal: { op: '<=' as const, value: 10 } } : {};
  const extra = {
    loadSeconds: Math.round(loadSeconds),
    calls: times.length,
    candidatesFetched: perProbe('fetched'),
    candidatesScored: perProbe('scored'),
    ...Object.fromEntries(Object.entries(statuses).map(([k, v]) => [`status_${k}`, v])),
  };
  const against = (stat: 'median' | 'p99') => (baseline.length > 0 ? { baseline: trigramId(size, stat) } : {});
  return [
    ...baseline,
    {
      id: `resolve.${backend}.${size}.median`,
      label: `resolve latency median (${backend}, ${size.toLocaleString('en-US')} counterparties)`,
      value: percentile(sorted, 50),
      unit: 'ms',
      better: 'lower',
      size,
      backend,
      extra,
      stages,
      ...against('median'),
    },
    {
      id: `resolve.${backend}.${size}.p99`,
      label: `resolve latency p99 (${backend}, ${size.toLocaleString('en-US')} counterparties)`,
      value: percentile(sorted, 99),
      unit: 'ms',
      better: 'lower',
      size,
      backend,
      ...goal,
      stages: tailStages,
      ...against('p99'),
    },
  ];
}

/** Each stage's milliseconds summed over all measured resolves, and over the slowest 1 % (the p99's tail). */
function stageTotals(times: readonly number[], stagesOf: readonly Record<string, number>[]): { all: Record<string, number>; tail: Record<string, number> } {
  const sum = (picked: readonly Record<string, number>[]) => {
    const out: Record<string, number> = {};
    for (const stages of picked) for (const [k, v] of Object.entries(stages)) out[k] = (out[k] ?? 0) + v;
    return out;
  };
  const p99 = percentile(
    [...times].sort((a, b) => a - b),
    99,
  );
  return { all: sum(stagesOf), tail: sum(stagesOf.filter((_, i) => times[i]! >= p99)) };
}

/** One row per stage of a single resolve (bench/resolve-stages.ts): mean milliseconds per resolve, largest first. */
function recordStages(ctx: BenchContext, backend: 'pglite' | 'postgres', size: number, stages: Record<string, number>, calls: number): void {
  const total = Object.values(stages).reduce((a, b) => a + b, 0);
  const order = Object.entries(stages).sort((a, b) => b[1] - a[1]);
  ctx.log(`${backend} ${size}: resolve time by stage: ${order.map(([k, ms]) => `${k} ${((100 * ms) / total).toFixed(1)} %`).join(', ')}`);
  for (const [stage, ms] of order) {
    ctx.record({
      id: `resolve.${backend}.${size}.stage.${stage}`,
      label: `resolve stage ${stage}, mean ms per resolve (${((100 * ms) / total).toFixed(1)} % of the time)`,
      value: ms / Math.max(1, calls),
      unit: 'ms',
      better: 'lower',
      size,
      backend,
    });
  }
}

function trigramId(size: number, stat: 'median' | 'p99'): string {
  return `lookup.trgm.postgres.${size}.${stat}`;
}

/** The lookup baseline: PostgreSQL trigram top-10 over counterparty names (see the header). */
async function measureTrigramTop10(db: Kysely<Database>, probes: readonly GeneratedName[], warm: number, size: number): Promise<BenchRow[]> {
  const texts = probes.map((p) => analyse(p.name).normalised);
  const started = performance.now();
  await createTrigramGistIndex(db);
  const indexSeconds = (performance.now() - started) / 1000;
  try {
    // Record that the planner really walks the index (a sequential scan would make the baseline a strawman).
    const usesIndex = await trigramTop10UsesIndex(db, texts[0] ?? '');
    const times: number[] = [];
    let returned = 0;
    for (let i = 0; i < texts.length; i++) {
      const t0 = performance.now();
      const ids = await trigramTop10(db, texts[i]!);
      const ms = performance.now() - t0;
      if (i >= warm) {
        times.push(ms);
        returned += ids.length;
      }
    }
    times.sort((a, b) => a - b);
    const extra = {
      calls: times.length,
      usesGistIndex: usesIndex,
      indexBuildSeconds: Math.round(indexSeconds * 10) / 10,
      meanRowsReturned: returned / Math.max(1, times.length),
    };
    const label = (stat: string) =>
      `baseline: pg_trgm top-10 (<-> on normalised name, GiST) ${stat} (postgres, ${size.toLocaleString('en-US')} counterparties)`;
    return [
      { id: trigramId(size, 'median'), label: label('median'), value: percentile(times, 50), unit: 'ms', better: 'lower', size, backend: 'postgres', extra },
      { id: trigramId(size, 'p99'), label: label('p99'), value: percentile(times, 99), unit: 'ms', better: 'lower', size, backend: 'postgres' },
    ];
  } finally {
    await dropTrigramGistIndex(db);
  }
}

async function withPostgresDatabase<T>(adminUrl: string, fn: (url: string) => Promise<T>): Promise<T> {
  const name = `cpreg_bench_register_${process.pid}_${Date.now()}`;
  const url = await createFreshDatabase(adminUrl, name);
  try {
    return await fn(url);
  } finally {
    await dropDatabaseIfExists(adminUrl, name);
  }
}

/** Measured rows are sent with ctx.record as soon as they exist (kept if a later size fails); only a skip is returned. */
export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  for (const size of ctx.sizes.register.filter((s) => s <= 100_000)) {
    ctx.log(`PGlite: register of ${size.toLocaleString('en-US')} counterparties`);
    const opened = await openDatabase('memory:');
    try {
      await migrateToLatest(opened.db);
      for (const row of await measure(ctx, opened.db, 'pglite', size)) {
        ctx.record(row);
      }
    } finally {
      await opened.close();
    }
  }
  if (!ctx.databaseUrl) {
    rows.push({
      id: 'resolve.postgres',
      label: 'resolve latency on PostgreSQL',
      value: 0,
      unit: 'ms',
      better: 'lower',
      backend: 'postgres',
      skipped: 'DATABASE_URL not set',
    });
    return rows;
  }
  for (const size of ctx.sizes.register) {
    ctx.log(`PostgreSQL: register of ${size.toLocaleString('en-US')} counterparties`);
    await withPostgresDatabase(ctx.databaseUrl, async (url) => {
      const opened = await openDatabase(url);
      try {
        await migrateToLatest(opened.db);
        for (const row of await measure(ctx, opened.db, 'postgres', size)) {
          ctx.record(row);
        }
      } finally {
        await opened.close();
      }
    });
  }
  return rows;
}

export default run;
