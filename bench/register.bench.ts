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
import { sql, type Kysely } from 'kysely';
import pg from 'pg';
import type { Database } from '../db/types.ts';
import { openDatabase } from '../db/open-database.ts';
import { migrateToLatest } from '../db/migrate.ts';
import { createRegisterContext, resolveMention } from '../services/register/index.ts';
import { analyse } from '../services/register/matching/analysis.ts';
import { candidateCounts } from '../services/register/matching/candidates.ts';
import { loadCounterparties, LOAD_CHUNK, type LoadRow } from '../services/register/bulk-load.ts';
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
  await loadCounterparties(createRegisterContext(db), rows(), { actor: 'bench' }, { source: 'bench', progress });
  // A register in service is vacuumed by autovacuum; a freshly loaded one is not yet: vacuum so that the key
  // lookups can use index-only scans as they would in steady state.
  await sql`VACUUM ANALYZE`.execute(db);
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
  const register = createRegisterContext(db);
  const times: number[] = [];
  const statuses: Record<string, number> = {};
  let counted = { ...candidateCounts };
  for (let i = 0; i < Math.min(queries.length, warm + count); i++) {
    const q = queries[i]!;
    const t0 = performance.now();
    const r = await resolveMention(register, { source: 'bench', externalId: `q${i}`, text: q.name, country: q.country }, { actor: 'bench' });
    const ms = performance.now() - t0;
    if (i >= warm) {
      times.push(ms);
      statuses[r.status] = (statuses[r.status] ?? 0) + 1;
    } else if (i === warm - 1) counted = { ...candidateCounts };
  }
  const lists = Math.max(1, candidateCounts.probes - counted.probes);
  const perProbe = (k: 'fetched' | 'scored') => Math.round(((candidateCounts[k] - counted[k]) / lists) * 10) / 10;
  times.sort((a, b) => a - b);
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
      value: percentile(times, 50),
      unit: 'ms',
      better: 'lower',
      size,
      backend,
      extra,
      ...against('median'),
    },
    {
      id: `resolve.${backend}.${size}.p99`,
      label: `resolve latency p99 (${backend}, ${size.toLocaleString('en-US')} counterparties)`,
      value: percentile(times, 99),
      unit: 'ms',
      better: 'lower',
      size,
      backend,
      ...goal,
      ...against('p99'),
    },
  ];
}

function trigramId(size: number, stat: 'median' | 'p99'): string {
  return `lookup.trgm.postgres.${size}.${stat}`;
}

const TRIGRAM_INDEX = 'bench_counterparty_name_trgm_gist';

/** The lookup baseline: PostgreSQL trigram top-10 over counterparty names (see the header). */
async function measureTrigramTop10(db: Kysely<Database>, probes: readonly GeneratedName[], warm: number, size: number): Promise<BenchRow[]> {
  const texts = probes.map((p) => analyse(p.name).normalised);
  const started = performance.now();
  await sql`CREATE INDEX ${sql.id(TRIGRAM_INDEX)} ON counterparty_name USING gist (normalised public.gist_trgm_ops)`.execute(db);
  await sql`ANALYZE counterparty_name`.execute(db);
  const indexSeconds = (performance.now() - started) / 1000;
  try {
    const top10 = (text: string) => sql<{ id: string }>`SELECT id FROM counterparty_name ORDER BY normalised OPERATOR(public.<->) ${text} LIMIT 10`;
    // Record that the planner really walks the index (a sequential scan would make the baseline a strawman).
    const plan = await sql<{ 'QUERY PLAN': string }>`EXPLAIN ${top10(texts[0] ?? '')}`.execute(db);
    const usesIndex = plan.rows.some((r) => r['QUERY PLAN'].includes(TRIGRAM_INDEX));
    const times: number[] = [];
    let returned = 0;
    for (let i = 0; i < texts.length; i++) {
      const t0 = performance.now();
      const result = await top10(texts[i]!).execute(db);
      const ms = performance.now() - t0;
      if (i >= warm) {
        times.push(ms);
        returned += result.rows.length;
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
    await sql`DROP INDEX IF EXISTS ${sql.id(TRIGRAM_INDEX)}`.execute(db);
  }
}

async function withPostgresDatabase<T>(adminUrl: string, fn: (url: string) => Promise<T>): Promise<T> {
  const name = `cpreg_bench_register_${process.pid}_${Date.now()}`;
  const admin = new pg.Client({ connectionString: adminUrl });
  await admin.connect();
  try {
    await admin.query(`CREATE DATABASE ${name}`);
    const url = new URL(adminUrl);
    url.pathname = `/${name}`;
    try {
      return await fn(url.toString());
    } finally {
      await admin.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    }
  } finally {
    await admin.end();
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
