/**
 * HTTP resolve latency under load (issue 7): autocannon with 50 connections posting single mentions to
 * POST /v1/mentions of a `cpreg serve` child process, against a register of ctx.sizes.register counterparties
 * (quick 10,000; default 10,000 and 100,000). Reports median and p99 latency, requests/s, errors and non-2xx
 * answers, and the server's resident memory at the start and the end of the load. PostgreSQL only (the
 * embedded database serves one process; its latency is measured by the register's own bench).
 *
 * Goal (issue 18): median ≤ 50 ms at 50 connections. Where the time goes: after the load, one connection posts
 * alone for a few seconds; its median is the time a resolve takes without waiting (HTTP, the resolve, its
 * database work), and the rest of the loaded median is queueing behind the other connections (for the CPU, the
 * database pool). The median row carries the two as its stages, so a missed goal names the larger.
 *
 * The register is seeded through the register service (createCounterparty: names, blocking keys, history),
 * 16 at a time. The mentions sent are the generator's names of the same entities (originals and variants), each
 * with a new external id, so every request does a full resolution.
 */
import { createFreshDatabase, dropDatabaseIfExists } from '../db/queries/admin-databases.ts';
import { CONNECTIONS, resolveLoad, rssMb, seedRegister, startServer, stopServer, writeKey } from './resolve-load.ts';
import type { BenchContext, BenchRow } from './types.ts';

/** Seconds of the one-connection run after the load. */
const ALONE_S = 5;

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  if (!ctx.databaseUrl) {
    return [{ id: 'http.resolve.p99', label: 'HTTP resolve p99', value: 0, unit: 'ms', better: 'lower', backend: 'http', skipped: 'DATABASE_URL not set' }];
  }
  for (const size of ctx.sizes.register.filter((s) => s <= 100_000)) {
    const name = `cpreg_bench_http_${size}_${process.pid}`; // the pid: two runs on one server keep apart
    const url = await createFreshDatabase(ctx.databaseUrl, name);
    ctx.log(`seeding ${size.toLocaleString('en-US')} counterparties`);
    const names = await seedRegister(ctx, url, size, { seed: ctx.seed, maxProbes: 20_000, actor: 'bench' });
    const key = await writeKey(url, 'bench');
    const { child, base } = await startServer(url);
    try {
      const rssStart = rssMb(child.pid!);
      const duration = Math.min(ctx.soakSeconds, 30);
      ctx.log(`autocannon: ${CONNECTIONS} connections for ${duration} s against ${base}`);
      const result = await resolveLoad(base, key, names, { duration, source: 'bench' });
      const rssEnd = rssMb(child.pid!);
      ctx.log(`autocannon: 1 connection for ${ALONE_S} s (the time of a resolve without queueing)`);
      const alone = await resolveLoad(base, key, names, { duration: ALONE_S, source: 'bench-alone', connections: 1 });
      const stages = { resolve: alone.latency.p50, queueing: Math.max(0, result.latency.p50 - alone.latency.p50) };
      const base0 = { size, backend: 'http' as const };
      rows.push(
        {
          id: `http.resolve.${size}.p50`,
          label: 'HTTP resolve median latency (50 connections)',
          value: result.latency.p50,
          unit: 'ms',
          better: 'lower',
          ...base0,
          goal: { op: '<=', value: 50 },
          stages,
        },
        {
          id: `http.resolve.${size}.p50_alone`,
          label: 'HTTP resolve median latency, one connection alone (no queueing)',
          value: alone.latency.p50,
          unit: 'ms',
          better: 'lower',
          ...base0,
          extra: { requests: alone.requests.total, non2xx: alone.non2xx, errors: alone.errors },
        },
        {
          id: `http.resolve.${size}.p99`,
          label: 'HTTP resolve p99 latency (50 connections)',
          value: result.latency.p99,
          unit: 'ms',
          better: 'lower',
          ...base0,
        },
        { id: `http.resolve.${size}.rps`, label: 'HTTP resolves per second', value: result.requests.average, unit: 'req/s', better: 'higher', ...base0 },
        {
          id: `http.resolve.${size}.errors`,
          label: 'errors + timeouts + non-2xx answers',
          value: result.errors + result.timeouts + result.non2xx,
          unit: 'count',
          better: 'lower',
          ...base0,
          extra: { errors: result.errors, timeouts: result.timeouts, non2xx: result.non2xx, total: result.requests.total },
        },
        { id: `http.resolve.${size}.rss_start`, label: 'server RSS at the start of the load', value: rssStart, unit: 'MB', better: 'lower', ...base0 },
        { id: `http.resolve.${size}.rss_end`, label: 'server RSS at the end of the load', value: rssEnd, unit: 'MB', better: 'lower', ...base0 },
      );
    } finally {
      await stopServer(child);
      await dropDatabaseIfExists(ctx.databaseUrl, name);
    }
  }
  return rows;
}
