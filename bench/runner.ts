/**
 * The bench runner's logic: `npm run bench [-- --quick | --full] [--only <name>[,<name>]] [--sizes <n>[,<n>]]
 * [--seed <n>] [--keep]` (the options: bench/runner-options.ts).
 *
 * Discovers every bench/*.bench.ts, runs each in its own child process (peak memory per file, a crash
 * loses only that file's rows; under --full, or with a size of 1,000,000 given, the children get a larger V8 heap
 * and the longer time limit), prints one table with
 * ratios against the baselines measured in the same run, and writes bench/results/<timestamp>.json.
 * The contract for bench files is bench/types.ts.
 */
import { fork } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { cpus, freemem, totalmem, arch, platform } from 'node:os';
import { join, relative } from 'node:path';
import type { BenchResults, BenchRow } from './types.ts';
import { FILE_TIMEOUT_S, fullHeapMb, fullScale, parseArgs, type RunnerOptions } from './runner-options.ts';
import { BENCH_DIR, REPO, benchName, discover } from './discover.ts';
import { computeRatios, formatTable } from './format-table.ts';
import { runChild, type ChildMessage } from './run-child.ts';

interface FileOutcome {
  rows: BenchRow[];
  ok: boolean;
  seconds: number;
  peakRssMb?: number;
  error?: string;
}

async function runFile(file: string, options: RunnerOptions): Promise<FileOutcome> {
  const started = Date.now();
  const rows: BenchRow[] = [];
  const execArgv = fullScale(options) ? [`--max-old-space-size=${fullHeapMb()}`] : [];
  const limitS = FILE_TIMEOUT_S[fullScale(options) ? 'full' : options.mode];
  const args = ['bench/run.ts', '--child', file, '--mode', options.mode, '--seed', String(options.seed)];
  if (options.sizes) args.push('--sizes', options.sizes.join(','));
  if (options.keep) args.push('--keep');
  const child = fork(join(REPO, 'bin/run-ts.js'), args, { cwd: REPO, execArgv, stdio: ['ignore', 'inherit', 'inherit', 'ipc'] });
  let peakRssMb: number | undefined;
  let reportedError: string | undefined;
  let done = false;
  child.on('message', (message: ChildMessage) => {
    if (message.type === 'row') rows.push(message.row);
    else if (message.type === 'done') {
      done = true;
      peakRssMb = message.peakRssMb;
    } else if (message.type === 'error') reportedError = message.error;
  });
  const timer = setTimeout(() => child.kill('SIGKILL'), limitS * 1000);
  const [code, signal] = (await new Promise((resolve) => child.on('exit', (c, s) => resolve([c, s])))) as [number | null, string | null];
  clearTimeout(timer);
  const seconds = (Date.now() - started) / 1000;
  const ok = done && code === 0;
  const error = ok
    ? undefined
    : (reportedError ?? (signal === 'SIGKILL' ? `killed after the ${limitS} s limit` : `exited with ${signal ?? code} before finishing`));
  return { rows: rows.map((r) => ({ ...r, bench: benchName(file) })), ok, seconds, peakRssMb, error };
}

function timestamp(date: Date): string {
  return date
    .toISOString()
    .replaceAll(':', '-')
    .replace(/\.\d+Z$/, 'Z');
}

async function parent(argv: string[]): Promise<number> {
  let options: RunnerOptions;
  let files: string[];
  try {
    options = parseArgs(argv);
    files = discover(options.only);
  } catch (error) {
    process.stderr.write(`bench: ${(error as Error).message}\n`);
    return 2;
  }
  const startedAt = new Date();
  const databaseUrl = process.env.DATABASE_URL || undefined;
  process.stderr.write(
    `bench: ${files.length} file(s), mode ${options.mode}${options.sizes ? ` (sizes ${options.sizes.join(', ')} only)` : ''}, seed ${options.seed}, PostgreSQL ${databaseUrl ? 'from DATABASE_URL' : 'not set (PostgreSQL rows skip)'}\n`,
  );
  const outcomes: Array<{ file: string } & FileOutcome> = [];
  for (const file of files) {
    process.stderr.write(`bench: running ${benchName(file)}…\n`);
    const outcome = await runFile(file, options);
    process.stderr.write(`bench: ${benchName(file)} ${outcome.ok ? 'done' : `FAILED: ${outcome.error}`} in ${outcome.seconds.toFixed(1)} s\n`);
    outcomes.push({ file, ...outcome });
  }
  const rows = computeRatios(outcomes.flatMap((o) => o.rows));
  const finishedAt = new Date();
  const results: BenchResults = {
    startedAt: startedAt.toISOString(),
    finishedAt: finishedAt.toISOString(),
    mode: options.mode,
    seed: options.seed,
    argv,
    machine: {
      platform: platform(),
      arch: arch(),
      cpuModel: cpus()[0]?.model ?? 'unknown',
      cpus: cpus().length,
      memoryGb: Math.round((totalmem() / 1024 ** 3) * 10) / 10,
      node: process.version,
      maxOldSpaceMb: fullScale(options) ? fullHeapMb() : undefined,
      postgres: databaseUrl !== undefined,
    },
    files: outcomes.map((o) => ({ bench: benchName(o.file), ok: o.ok, seconds: o.seconds, peakRssMb: o.peakRssMb, error: o.error })),
    rows,
  };
  const resultsDir = join(BENCH_DIR, 'results');
  mkdirSync(resultsDir, { recursive: true });
  const out = join(resultsDir, `${timestamp(startedAt)}.json`);
  writeFileSync(out, `${JSON.stringify(results, null, 2)}\n`);
  process.stdout.write(`\n${formatTable(rows)}\n\n`);
  const elapsed = (finishedAt.getTime() - startedAt.getTime()) / 1000;
  process.stdout.write(
    `machine: ${results.machine.cpuModel}, ${results.machine.cpus} CPUs, ${results.machine.memoryGb} GB, node ${results.machine.node} ` +
      `(free ${Math.round(freemem() / 1024 ** 2)} MB)\n` +
      `${rows.length} rows from ${files.length} file(s) in ${elapsed.toFixed(1)} s; results: ${relative(REPO, out)}\n`,
  );
  const failed = outcomes.filter((o) => !o.ok);
  if (failed.length > 0) process.stdout.write(`FAILED: ${failed.map((o) => `${benchName(o.file)} (${o.error})`).join('; ')}\n`);
  if (options.mode === 'quick' && elapsed > 120) process.stdout.write(`note: the quick run took ${elapsed.toFixed(0)} s, over its 120 s budget\n`);
  return failed.length > 0 ? 1 : 0;
}

/** Entry point, called by bench/run.ts (kept apart so that tests can import the helpers of the runner's modules). */
export async function main(argv: string[]): Promise<void> {
  if (argv.includes('--child')) await runChild(argv);
  else process.exitCode = await parent(argv);
}
