/**
 * How long a command takes as a user starts it (issue 19 item 3): wall time of `node bin/cpreg.js …` child
 * processes, from spawn to exit. Goals: a read-only command on an existing embedded database answers in ≤ 2 s;
 * a new embedded database is ready in ≤ 5 s (on a quiet machine: the figures of a shared machine are upper bounds).
 * `--help` (no database) is the floor: node, the TypeScript loader and the command table.
 *
 * Run alone:        node bin/run-ts.js bench/cli-open.bench.ts [--db <existing embedded directory>] [--runs N]
 * Run with others:  npm run bench -- --only cli-open
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { BenchContext, BenchRow } from './types.ts';

const BIN = fileURLToPath(new URL('../bin/cpreg.js', import.meta.url));
export const GOAL_READ_ONLY_MS = 2000;
export const GOAL_NEW_DATABASE_MS = 5000;

/** GNU time, when installed: the child's CPU time, which is what a quiet machine would take in wall time. */
const GNU_TIME = existsSync('/usr/bin/time') ? '/usr/bin/time' : undefined;

interface Timing {
  wallMs: number;
  /** User + system CPU of the command (NaN without GNU time). */
  cpuMs: number;
}

/** Wall and CPU milliseconds of one command; throws with its stderr when it fails. */
function timed(args: string[], cwd: string, cacheDir?: string): Timing {
  const env = { ...process.env };
  delete env.DATABASE_URL;
  if (cacheDir) env.CPREG_CACHE_DIR = cacheDir;
  const command = GNU_TIME ? [GNU_TIME, '-f', 'cpu-seconds %U %S', process.execPath, BIN, ...args] : [process.execPath, BIN, ...args];
  const started = performance.now();
  const run = spawnSync(command[0]!, command.slice(1), { cwd, env, encoding: 'utf8' });
  const wallMs = performance.now() - started;
  if (run.status !== 0) throw new Error(`cpreg ${args.join(' ')} failed (${run.status}): ${run.stderr}`);
  const cpu = /cpu-seconds ([\d.]+) ([\d.]+)\s*$/.exec(run.stderr);
  return { wallMs, cpuMs: cpu ? (Number(cpu[1]) + Number(cpu[2])) * 1000 : NaN };
}

/** Medians of wall and CPU time over `runs` runs. */
function medianOf(runs: number, fn: () => Timing): Timing {
  const all = Array.from({ length: runs }, fn);
  return { wallMs: median(all.map((t) => t.wallMs)), cpuMs: median(all.map((t) => t.cpuMs)) };
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

export interface CliTimings {
  help: Timing;
  /** The first new database on a machine: no migrated template yet (initdb and every migration), which makes one. */
  newDatabaseCold: Timing;
  /** Every later new database: a copy of that template (db/embedded-template.ts). */
  newDatabase: Timing;
  /** Median per read-only command, on the database the new-database run made (or `db` when given). */
  readOnly: Record<string, Timing>;
}

export function measureCli(options: { runs: number; db?: string; log?: (line: string) => void }): CliTimings {
  const home = mkdtempSync(join(tmpdir(), 'cpreg-cli-open-'));
  try {
    const help = medianOf(options.runs, () => timed(['--help'], home));
    // A cache folder of its own: the first new database finds no template (as on a new machine) and makes it.
    const cache = join(home, 'cache');
    options.log?.('creating a new embedded database with no template yet');
    const newDatabaseCold = timed(['own-entities', 'add', 'Example Holdings GmbH', '--db', './data/first'], home, cache);
    options.log?.('creating a new embedded database from the template');
    const newDatabase = timed(['own-entities', 'add', 'Example Holdings GmbH', '--db', './data/cpreg'], home, cache);
    const db = options.db ?? join(home, 'data', 'cpreg');
    const readOnly: Record<string, Timing> = {};
    for (const command of [
      ['own-entities', 'list'],
      ['keys', 'list'],
      ['export', 'review', '--format', 'csv', '--out', join(home, 'review.csv')],
    ]) {
      options.log?.(`cpreg ${command.join(' ')} × ${options.runs}`);
      readOnly[command.slice(0, 2).join(' ')] = medianOf(options.runs, () => timed([...command, '--db', db], home));
    }
    return { help, newDatabaseCold, newDatabase, readOnly };
  } finally {
    rmSync(home, { recursive: true, force: true });
  }
}

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const t = measureCli({ runs: ctx.mode === 'quick' ? 3 : 5, log: ctx.log });
  const cpu = (x: Timing) => (Number.isNaN(x.cpuMs) ? {} : { extra: { cpuMs: Math.round(x.cpuMs) } });
  const rows: BenchRow[] = [
    {
      id: 'cli.help',
      label: 'cpreg --help (no database), median wall time',
      value: t.help.wallMs,
      unit: 'ms',
      better: 'lower',
      backend: 'memory',
      ...cpu(t.help),
    },
    {
      id: 'cli.new_database_first',
      label: 'first command on the first new embedded database of a machine (no template yet: initdb and migrations), wall time',
      value: t.newDatabaseCold.wallMs,
      unit: 'ms',
      better: 'lower',
      backend: 'pglite',
      ...cpu(t.newDatabaseCold),
    },
    {
      id: 'cli.new_database',
      label: 'first command on a new embedded database (own-entities add; a copy of the migrated template), wall time',
      value: t.newDatabase.wallMs,
      unit: 'ms',
      better: 'lower',
      backend: 'pglite',
      goal: { op: '<=', value: GOAL_NEW_DATABASE_MS },
      ...cpu(t.newDatabase),
    },
  ];
  for (const [command, x] of Object.entries(t.readOnly)) {
    rows.push({
      id: `cli.read.${command.replace(' ', '_')}`,
      label: `cpreg ${command} on an existing embedded database, median wall time`,
      value: x.wallMs,
      unit: 'ms',
      better: 'lower',
      backend: 'pglite',
      goal: { op: '<=', value: GOAL_READ_ONLY_MS },
      ...cpu(x),
    });
  }
  return rows;
}

if (!process.argv.includes('--child') && /run-ts\.js$/.test(process.argv[1] ?? '')) {
  const argv = process.argv.slice(2);
  const at = (name: string): string | undefined => (argv.includes(name) ? argv[argv.indexOf(name) + 1] : undefined);
  const runs = Number(at('--runs') ?? 5);
  const t = measureCli({ runs, db: at('--db'), log: (line) => process.stderr.write(`${line}\n`) });
  const s = (x: Timing): string => `${(x.wallMs / 1000).toFixed(2)} s wall, ${(x.cpuMs / 1000).toFixed(2)} s CPU`;
  console.log(`cpreg --help ${s(t.help)}; the first new database (no template yet) ${s(t.newDatabaseCold)}; new database ${s(t.newDatabase)} (goal ≤ 5 s)`);
  for (const [command, x] of Object.entries(t.readOnly)) console.log(`cpreg ${command} ${s(x)} (median of ${runs}; goal ≤ 2 s)`);
}
