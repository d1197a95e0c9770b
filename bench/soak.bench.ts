/**
 * Load soak on resolve (issue 10): autocannon with 50 connections posting single mentions to POST /v1/mentions of
 * a `cpreg serve` child process on PostgreSQL, for ctx.soakSeconds (quick 30 s against 10,000 counterparties;
 * default 60 s against 10,000; full 300 s against 100,000). Reports the 5xx count (goal: zero), every other non-2xx,
 * median and p99 latency, and the server's resident memory at the start and the end of the soak (a leak shows as
 * growth). PostgreSQL only; without DATABASE_URL the rows say so.
 *
 * The register is seeded through the register service (createCounterparty), 16 at a time, with the generator's
 * original names; the mentions sent are its variants, each with a new external id (a full resolution each time).
 */
import { createFreshDatabase, dropDatabaseIfExists } from '../db/queries/admin-databases.ts';
import { CONNECTIONS, resolveLoad, rssMb, seedRegister, startServer, stopServer, writeKey } from './resolve-load.ts';
import autocannon from 'autocannon';
import type { BenchContext, BenchRow } from './types.ts';

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const size = ctx.mode === 'full' ? 100_000 : 10_000;
  if (!ctx.databaseUrl) {
    return [
      {
        id: 'soak.5xx',
        label: 'soak: 5xx answers',
        value: 0,
        unit: 'count',
        better: 'lower',
        backend: 'http',
        size,
        skipped: 'DATABASE_URL not set (the soak runs on PostgreSQL)',
      },
    ];
  }
  const name = `cpreg_bench_soak_${size}`;
  const url = await createFreshDatabase(ctx.databaseUrl, name);
  const rows: BenchRow[] = [];
  try {
    ctx.log(`seeding ${size.toLocaleString('en-US')} counterparties`);
    const probes = await seedRegister(ctx, url, size, { seed: ctx.seed + 10, maxProbes: 50_000, actor: 'bench:soak' });
    const key = await writeKey(url, 'bench soak');
    const { child, base } = await startServer(url);
    try {
      // A short warm-up so that the start figure is the running service, not a cold process.
      await autocannon({ url: `${base}/healthz`, connections: 5, duration: 2 });
      const rssStart = rssMb(child.pid!);
      ctx.log(`soak: ${CONNECTIONS} connections for ${ctx.soakSeconds} s against ${size.toLocaleString('en-US')} counterparties`);
      const result = await resolveLoad(base, key, probes, { duration: ctx.soakSeconds, source: 'soak' });
      const rssEnd = rssMb(child.pid!);
      const fivexx = (result as unknown as { '5xx': number })['5xx'];
      const common = { size, backend: 'http' as const };
      rows.push(
        {
          id: 'soak.5xx',
          label: `soak ${ctx.soakSeconds} s: 5xx answers`,
          value: fivexx,
          unit: 'count',
          better: 'lower',
          goal: { op: '<=', value: 0 },
          ...common,
          extra: { total: result.requests.total, non2xx: result.non2xx, errors: result.errors, timeouts: result.timeouts },
        },
        {
          id: 'soak.p50',
          label: `soak ${ctx.soakSeconds} s: resolve median latency (50 connections)`,
          value: result.latency.p50,
          unit: 'ms',
          better: 'lower',
          ...common,
        },
        {
          id: 'soak.p99',
          label: `soak ${ctx.soakSeconds} s: resolve p99 latency (50 connections)`,
          value: result.latency.p99,
          unit: 'ms',
          better: 'lower',
          ...common,
        },
        { id: 'soak.rps', label: `soak ${ctx.soakSeconds} s: resolves per second`, value: result.requests.average, unit: 'req/s', better: 'higher', ...common },
        { id: 'soak.rss_start', label: 'soak: server RSS at the start', value: rssStart, unit: 'MB', better: 'lower', ...common },
        { id: 'soak.rss_end', label: 'soak: server RSS at the end', value: rssEnd, unit: 'MB', better: 'lower', baseline: 'soak.rss_start', ...common },
      );
    } finally {
      await stopServer(child);
    }
  } finally {
    await dropDatabaseIfExists(ctx.databaseUrl, name);
  }
  return rows;
}
