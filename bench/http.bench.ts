/**
 * HTTP resolve latency under load (issue 7): autocannon with 50 connections posting single mentions to
 * POST /v1/mentions of a `cpreg serve` child process, against a register of ctx.sizes.register counterparties
 * (quick 10,000; default 10,000 and 100,000). Reports median and p99 latency, requests/s, errors and non-2xx
 * answers, and the server's resident memory at the start and the end of the load. PostgreSQL only (the
 * embedded database serves one process; its latency is measured by the register's own bench).
 *
 * The register is seeded through the register service (createCounterparty: names, blocking keys, history),
 * 16 at a time. The mentions sent are the generator's names of the same entities (originals and variants), each
 * with a new external id, so every request does a full resolution.
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
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0);
  return kb / 1024;
}

async function startServer(url: string): Promise<{ child: ChildProcess; base: string }> {
  const child = spawn(process.execPath, ['bin/cpreg.js', 'serve', '--port', '0', '--db', url, '--json', '--log-level', 'warn'], {
    env: { ...process.env, CPREG_RATE_LIMIT_PER_MINUTE: 'off' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const lines = createInterface({ input: child.stdout! });
  for await (const line of lines) {
    if (line.startsWith('{')) return { child, base: (JSON.parse(line) as { url: string }).url };
  }
  throw new Error('cpreg serve did not print its address');
}

async function seed(ctx: BenchContext, url: string, size: number): Promise<{ names: { name: string; country: string }[] }> {
  const database = await openDatabase(url, { command: 'bench http seed' });
  await migrateToLatest(database.db);
  const reg = createRegisterContext(database.db);
  const originals: { name: string; country: string }[] = [];
  const probes: { name: string; country: string }[] = [];
  for (const n of ctx.generator.names(Math.round(size * 1.6), ctx.seed)) {
    if (n.variantKind === 'original' && originals.length < size) originals.push({ name: n.name, country: n.country });
    else if (probes.length < 20_000) probes.push({ name: n.name, country: n.country });
  }
  let next = 0;
  const started = performance.now();
  await Promise.all(
    Array.from({ length: 16 }, async () => {
      while (next < originals.length) {
        const o = originals[next++]!;
        try {
          await createCounterparty(reg, { name: o.name, jurisdiction: o.country }, { actor: 'bench' });
        } catch {
          // an invented name the register refuses (rare): the register is a little smaller
        }
        if (next % 5000 === 0) ctx.log(`seeded ${next} counterparties (${Math.round(next / ((performance.now() - started) / 1000))}/s)`);
      }
    }),
  );
  await database.close();
  return { names: probes.length > 0 ? probes : originals };
}

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  if (!ctx.databaseUrl) {
    return [{ id: 'http.resolve.p99', label: 'HTTP resolve p99', value: 0, unit: 'ms', better: 'lower', backend: 'http', skipped: 'DATABASE_URL not set' }];
  }
  for (const size of ctx.sizes.register.filter((s) => s <= 100_000)) {
    const name = `cpreg_bench_http_${size}`;
    const admin = new pg.Client({ connectionString: ctx.databaseUrl });
    await admin.connect();
    await admin.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
    await admin.query(`CREATE DATABASE "${name}"`);
    await admin.end();
    const url = new URL(ctx.databaseUrl);
    url.pathname = `/${name}`;
    ctx.log(`seeding ${size.toLocaleString('en-US')} counterparties`);
    const { names } = await seed(ctx, url.toString(), size);
    const keyDb = await openDatabase(url.toString());
    const key = (await createApiKey(keyDb.db, { scope: 'write', label: 'bench' })).secret;
    await keyDb.close();
    const { child, base } = await startServer(url.toString());
    try {
      const rssStart = rssMb(child.pid!);
      let n = 0;
      const duration = Math.min(ctx.soakSeconds, 30);
      ctx.log(`autocannon: ${CONNECTIONS} connections for ${duration} s against ${base}`);
      const result = await autocannon({
        url: `${base}/v1/mentions`,
        connections: CONNECTIONS,
        duration,
        method: 'POST',
        headers: { authorization: `Bearer ${key}`, 'content-type': 'application/json' },
        requests: [
          {
            setupRequest: (request) => {
              const probe = names[n % names.length]!;
              n++;
              return { ...request, body: JSON.stringify({ source: 'bench', externalId: `h-${n}`, text: probe.name, country: probe.country }) };
            },
          },
        ],
      });
      const rssEnd = rssMb(child.pid!);
      const base0 = { size, backend: 'http' as const };
      rows.push(
        { id: `http.resolve.${size}.p50`, label: 'HTTP resolve median latency (50 connections)', value: result.latency.p50, unit: 'ms', better: 'lower', ...base0 },
        { id: `http.resolve.${size}.p99`, label: 'HTTP resolve p99 latency (50 connections)', value: result.latency.p99, unit: 'ms', better: 'lower', ...base0 },
        { id: `http.resolve.${size}.rps`, label: 'HTTP resolves per second', value: result.requests.average, unit: 'req/s', better: 'higher', ...base0 },
        { id: `http.resolve.${size}.errors`, label: 'errors + timeouts + non-2xx answers', value: result.errors + result.timeouts + result.non2xx, unit: 'count', better: 'lower', ...base0, extra: { errors: result.errors, timeouts: result.timeouts, non2xx: result.non2xx, total: result.requests.total } },
        { id: `http.resolve.${size}.rss_start`, label: 'server RSS at the start of the load', value: rssStart, unit: 'MB', better: 'lower', ...base0 },
        { id: `http.resolve.${size}.rss_end`, label: 'server RSS at the end of the load', value: rssEnd, unit: 'MB', better: 'lower', ...base0 },
      );
    } finally {
      child.kill('SIGTERM');
      await new Promise((r) => child.once('exit', r));
      const c = new pg.Client({ connectionString: ctx.databaseUrl });
      await c.connect();
      await c.query(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      await c.end();
    }
  }
  return rows;
}
