/** Helpers shared by the reliability suites: a dump of every table, the live route table, a PostgreSQL server of a test's own. */
import { sql, type Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import type { FastifyInstance } from 'fastify';
import { execFileSync } from 'node:child_process';
import { chmodSync, chownSync, existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** Every table of the public schema, every row as JSON, in a stable order. */
export async function dumpAllTables(db: Kysely<Database>): Promise<Record<string, string[]>> {
  const tables = await sql<{ table_name: string }>`
    SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE' ORDER BY table_name`.execute(db);
  const out: Record<string, string[]> = {};
  for (const { table_name } of tables.rows) {
    const rows = await sql<{ j: string }>`SELECT row_to_json(t)::text AS j FROM ${sql.table(table_name)} t`.execute(db);
    out[table_name] = rows.rows.map((r) => r.j).sort();
  }
  return out;
}

/*
 * The live route table of a built app, read from fastify's own printRoutes tree (commonPrefix off, so each
 * line is one radix-tree node whose text extends its parent's path). New routes are covered without a list.
 */
export interface LiveRoute {
  method: string;
  path: string;
}

export function liveRoutes(app: FastifyInstance): LiveRoute[] {
  const stack: string[] = [];
  const out: LiveRoute[] = [];
  for (const line of app.printRoutes({ commonPrefix: false }).split('\n')) {
    const at = line.search(/[├└]── /u);
    if (at < 0) continue;
    const depth = at / 4;
    const rest = line.slice(at + 4);
    const open = rest.lastIndexOf(' (');
    const segment = open < 0 ? rest : rest.slice(0, open);
    const path = (depth > 0 ? stack[depth - 1]! : '') + segment;
    stack[depth] = path;
    stack.length = depth + 1;
    if (open < 0) continue;
    const methods = rest.slice(open + 2, rest.length - 1).split(', ');
    for (const method of methods) if (method !== 'HEAD') out.push({ method, path });
  }
  return out;
}

/*
 * A PostgreSQL server of the test's own, in a temporary folder on a free port, that the test may stop and
 * start at will (never the shared instance). initdb refuses to run as root, so as root the server runs as
 * the postgres user (runuser). Unavailable (no binaries, no postgres user): ownPostgresUnavailable() says why.
 */
const BIN_DIRS = ['/usr/lib/postgresql/15/bin', '/usr/lib/postgresql/16/bin', '/usr/lib/postgresql/17/bin'];

function binDir(): string | undefined {
  return BIN_DIRS.find((d) => existsSync(join(d, 'initdb')) && existsSync(join(d, 'pg_ctl')));
}

function postgresUid(): { uid: number; gid: number } | undefined {
  try {
    const uid = Number(execFileSync('id', ['-u', 'postgres']).toString().trim());
    const gid = Number(execFileSync('id', ['-g', 'postgres']).toString().trim());
    return { uid, gid };
  } catch {
    return undefined;
  }
}

export function ownPostgresUnavailable(): string | undefined {
  if (!binDir()) return `no PostgreSQL server binaries in ${BIN_DIRS.join(' or ')}`;
  if (process.getuid?.() === 0 && !postgresUid()) return 'running as root and there is no postgres user to run initdb as';
  return undefined;
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => resolve(typeof address === 'object' && address ? address.port : 0));
    });
  });
}

export interface OwnPostgres {
  url: string;
  port: number;
  stop(mode?: 'fast' | 'immediate'): void;
  start(): void;
  destroy(): void;
  /** The postmaster and every backend (to freeze them with SIGSTOP). */
  pids(): number[];
}

export async function startOwnPostgres(): Promise<OwnPostgres> {
  const bin = binDir()!;
  const root = mkdtempSync(join(tmpdir(), 'cpreg-ownpg-'));
  const data = join(root, 'data');
  const asRoot = process.getuid?.() === 0;
  const ids = asRoot ? postgresUid() : undefined;
  if (ids) {
    chownSync(root, ids.uid, ids.gid);
    chmodSync(root, 0o700);
  }
  const run = (file: string, args: string[]) =>
    execFileSync(asRoot ? 'runuser' : join(bin, file), asRoot ? ['-u', 'postgres', '--', join(bin, file), ...args] : args, { stdio: 'pipe', timeout: 120_000 });
  run('initdb', ['-D', data, '-A', 'trust', '-U', 'postgres', '--no-sync', '-E', 'UTF8']);
  const port = await freePort();
  const options = `-p ${port} -k ${root} -c listen_addresses=127.0.0.1 -c fsync=on -c max_connections=100`;
  const start = () => run('pg_ctl', ['-D', data, '-o', options, '-l', join(root, 'server.log'), '-w', '-t', '60', 'start']);
  const stop = (mode: 'fast' | 'immediate' = 'fast') => run('pg_ctl', ['-D', data, '-m', mode, '-w', '-t', '60', 'stop']);
  start();
  return {
    url: `postgres://postgres@127.0.0.1:${port}/postgres`,
    port,
    start,
    stop,
    pids() {
      const main = Number(readFileSync(join(data, 'postmaster.pid'), 'utf8').split('\n')[0]);
      const children = execFileSync('pgrep', ['-P', String(main)])
        .toString()
        .trim()
        .split('\n')
        .filter(Boolean)
        .map(Number);
      return [main, ...children];
    },
    destroy() {
      try {
        stop('immediate');
      } catch {
        // already stopped
      }
      rmSync(root, { recursive: true, force: true });
    },
  };
}
