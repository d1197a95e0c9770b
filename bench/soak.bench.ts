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
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createInterface } from 'node:readline';
import autocannon from 'autocannon';
import pg from 'pg';
import { openDatabase } from '../db/open-database.ts';
import { migrateToLatest } from '../db/migrate.ts';
import { createRegisterContext } from '../services/register/context.ts';
import { createCounterparty } from '../services/register/counterparties.ts';
import { createApiKey } from '../services/api/auth/keys.ts';
import type { BenchContext, BenchRow } from './types.ts';

const CONNECTIONS = 50;

function rssMb(pid: number): number {
  const kb = Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? 0);
  return Math.round((kb / 1024) * 10) / 10;
}

async function startServer(url: string): Promise<{ child: ChildProcess; base: string }> {
  const child = spawn(process.execPath, ['bin/cpreg.js', 'serve', '--port', '0', '--db', url, '--json', '--log-level', 'warn'], {
    env: { ...process.env, CPREG_RATE_LIMIT_PER_MINUTE: 'off' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  for await (const line of createInterface({ input: child.stdout! })) {
    if (line.startsWith('{')) return { child, base: (JSON.parse(line) as { url: string }).url };
  }
  throw new Error('cpreg serve did not print its address');
}

async function seed(ctx: BenchContext, url: string, size: number): Promise<{ name: string; country: string }[]> {
  const database = await openDatabase(url, { command: 'bench soak seed' });
  await migrateToLatest(database.db);
  const reg = createRegisterContext(database.db);
  const originals: { name: string; country: string }[] = [];
  const probes: { name: string; country: string }[] = [];
  for (const n of ctx.generator.names(Math.round(size * 1.6), ctx.seed + 10)) {
    if (n.variantKind === 'original' && originals.length < size) originals.push({ name: n.name, country: n.country });
    else if (probes.length < 50_000) probes.push({ name: n.name, country: n.country });
  }
  let next = 0;
  await Promise.all(
    Array.from({ length: 16 }, async () => {
      while (next < originals.length) {
        const o = originals[next++]!;
        try {
          await createCounterparty(reg, { name: o.name, jurisdiction: o.country }, { actor: 'bench:soak' });
        } catch {
          // a name the register refuses (rare): the register is a little smaller
        }
        if (next % 5000 === 0) ctx.log(`seeded ${next} counterparties`);
      }
    }),
  );
  await database.close();
  return probes.length > 0 ? probes : originals;
}

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const size = ctx.mode === 'full' ? 100_000 : 10_000;
  if (!ctx.databaseUrl) {
    return [{ id: 'soak.5xx', label: 'soak: 5xx answers', value: 0, unit: 'count', better: 'lower', backend: 'http', size, skipped: 'DATABASE_URL not set (the soak runs on PostgreSQL)' }];
  }
  const name = `cpreg_bench_soak_${size}`;
  const admin = new pg.Client({ connectionString: ctx.databaseUrl });
  await admin.connect();
  await admin.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  await admin.query(`CREATE DATABASE "${name}"`);
  await admin.end();
  const url = new URL(ctx.databaseUrl);
  url.pathname = `/${name}`;
  const rows: BenchRow[] = [];
  try {
    ctx.log(`seeding ${size.toLocaleString('en-US')} counterparties`);
    const probes = await seed(ctx, url.toString(), size);
    const keyDb = await openDatabase(url.toString());
    const key = (await createApiKey(keyDb.db, { scope: 'write', label: 'bench soak' })).secret;
    await keyDb.close();
    const { child, base } = await startServer(url.toString());
    try {
      // A short warm-up so that the start figure is the running service, not a cold process.
      await autocannon({ url: `${base}/healthz`, connections: 5, duration: 2 });
      const rssStart = rssMb(child.pid!);
      let n = 0;
      ctx.log(`soak: ${CONNECTIONS} connections for ${ctx.soakSeconds} s against ${size.toLocaleString('en-US')} counterparties`);
      const result = await autocannon({
        url: `${base}/v1/mentions`,
        connections: CONNECTIONS,
        duration: ctx.soakSeconds,
        method: 'POST',
        headers: { authorization: `Bearer ${key}`, 'content-type': 'application/json' },
        requests: [
          {
            setupRequest: (request) => {
              const probe = probes[n % probes.length]!;
              n++;
              return { ...request, body: JSON.stringify({ source: 'soak', externalId: `s-${n}`, text: probe.name, country: probe.country }) };
            },
          },
        ],
      });
      const rssEnd = rssMb(child.pid!);
      const fivexx = (result as unknown as { '5xx': number })['5xx'];
      const common = { size, backend: 'http' as const };
      rows.push(
        { id: 'soak.5xx', label: `soak ${ctx.soakSeconds} s: 5xx answers`, value: fivexx, unit: 'count', better: 'lower', goal: { op: '<=', value: 0 }, ...common, extra: { total: result.requests.total, non2xx: result.non2xx, errors: result.errors, timeouts: result.timeouts } },
        { id: 'soak.p50', label: `soak ${ctx.soakSeconds} s: resolve median latency (50 connections)`, value: result.latency.p50, unit: 'ms', better: 'lower', ...common },
        { id: 'soak.p99', label: `soak ${ctx.soakSeconds} s: resolve p99 latency (50 connections)`, value: result.latency.p99, unit: 'ms', better: 'lower', ...common },
        { id: 'soak.rps', label: `soak ${ctx.soakSeconds} s: resolves per second`, value: result.requests.average, unit: 'req/s', better: 'higher', ...common },
        { id: 'soak.rss_start', label: 'soak: server RSS at the start', value: rssStart, unit: 'MB', better: 'lower', ...common },
        { id: 'soak.rss_end', label: 'soak: server RSS at the end', value: rssEnd, unit: 'MB', better: 'lower', baseline: 'soak.rss_start', ...common },
      );
    } finally {
      child.kill('SIGTERM');
      await new Promise((r) => child.once('exit', r));
    }
  } finally {
    const c = new pg.Client({ connectionString: ctx.databaseUrl });
    await c.connect();
    await c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
    await c.end();
  }
  return rows;
}
