/**
 * What the HTTP benches share (bench/http.bench.ts, bench/soak.bench.ts): a fresh PostgreSQL database seeded with
 * a register through the register service, a `cpreg serve` child on it with a write key, autocannon posting single
 * mentions to POST /v1/mentions, and the child's resident memory.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createInterface } from 'node:readline';
import autocannon from 'autocannon';
import { openDatabase } from '../db/open-database.ts';
import { migrateToLatest } from '../db/migrate.ts';
import { createRegisterContext } from '../services/register/context.ts';
import { createCounterparty } from '../services/register/counterparties.ts';
import { createApiKey } from '../services/api/auth/keys.ts';
import type { BenchContext } from './types.ts';

export const CONNECTIONS = 50;

export interface Probe {
  name: string;
  country: string;
}

/** Resident memory of a process in MB, one decimal. */
export function rssMb(pid: number): number {
  const kb = Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? 0);
  return Math.round((kb / 1024) * 10) / 10;
}

/**
 * Seeds `size` counterparties (the generator's original names, 16 at a time through createCounterparty) and
 * returns the mentions to send: the generator's variants of the same entities (at most maxProbes), or the
 * originals when there are none.
 */
export async function seedRegister(
  ctx: BenchContext,
  url: string,
  size: number,
  options: { seed: number; maxProbes: number; actor: string },
): Promise<Probe[]> {
  const database = await openDatabase(url, { command: `${options.actor} seed` });
  await migrateToLatest(database.db);
  const reg = createRegisterContext(database.db);
  const originals: Probe[] = [];
  const probes: Probe[] = [];
  for (const n of ctx.generator.names(Math.round(size * 1.6), options.seed)) {
    if (n.variantKind === 'original' && originals.length < size) originals.push({ name: n.name, country: n.country });
    else if (probes.length < options.maxProbes) probes.push({ name: n.name, country: n.country });
  }
  let next = 0;
  const started = performance.now();
  await Promise.all(
    Array.from({ length: 16 }, async () => {
      while (next < originals.length) {
        const o = originals[next++]!;
        try {
          await createCounterparty(reg, { name: o.name, jurisdiction: o.country }, { actor: options.actor });
        } catch {
          // an invented name the register refuses (rare): the register is a little smaller
        }
        if (next % 5000 === 0) ctx.log(`seeded ${next} counterparties (${Math.round(next / ((performance.now() - started) / 1000))}/s)`);
      }
    }),
  );
  await database.close();
  return probes.length > 0 ? probes : originals;
}

export async function writeKey(url: string, label: string): Promise<string> {
  const keyDb = await openDatabase(url);
  try {
    return (await createApiKey(keyDb.db, { scope: 'write', label })).secret;
  } finally {
    await keyDb.close();
  }
}

/** `cpreg serve` on the database, rate limit off; resolves with the child and its address. */
export async function startServer(url: string): Promise<{ child: ChildProcess; base: string }> {
  const child = spawn(process.execPath, ['bin/cpreg.js', 'serve', '--port', '0', '--db', url, '--json', '--log-level', 'warn'], {
    env: { ...process.env, CPREG_RATE_LIMIT_PER_MINUTE: 'off' },
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  for await (const line of createInterface({ input: child.stdout! })) {
    if (line.startsWith('{')) return { child, base: (JSON.parse(line) as { url: string }).url };
  }
  throw new Error('cpreg serve did not print its address');
}

export async function stopServer(child: ChildProcess): Promise<void> {
  child.kill('SIGTERM');
  await new Promise((r) => child.once('exit', r));
}

/** CONNECTIONS clients (or `connections`) posting one mention each (the probes in turn, each with a new external id). */
export function resolveLoad(
  base: string,
  key: string,
  probes: readonly Probe[],
  options: { duration: number; source: string; connections?: number },
): Promise<autocannon.Result> {
  let n = 0;
  return autocannon({
    url: `${base}/v1/mentions`,
    connections: options.connections ?? CONNECTIONS,
    duration: options.duration,
    method: 'POST',
    headers: { authorization: `Bearer ${key}`, 'content-type': 'application/json' },
    requests: [
      {
        setupRequest: (request) => {
          const probe = probes[n % probes.length]!;
          n++;
          return {
            ...request,
            body: JSON.stringify({ source: options.source, externalId: `${options.source}-${n}`, text: probe.name, country: probe.country }),
          };
        },
      },
    ],
  });
}
