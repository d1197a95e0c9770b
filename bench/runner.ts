/**
 * The bench runner's logic: `npm run bench [-- --quick | --full] [--only <name>[,<name>]] [--sizes <n>[,<n>]]
 * [--seed <n>] [--keep]` (the options: bench/options.ts).
 *
 * Discovers every bench/*.bench.ts, runs each in its own child process (peak memory per file, a crash loses only
 * that file's rows; under --full, or with a size of 1,000,000 given, the children get a larger V8 heap and the longer
 * time limit), prints one table with ratios against the baselines measured in the same run, and writes
 * bench/results/<timestamp>.json. The contract for bench files is bench/types.ts.
 */
import { fork } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, freemem, tmpdir, totalmem, arch, platform } from 'node:os';
import { basename, dirname, join, relative } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { FILE_TIMEOUT_S, fullScale, parseArgs, parseSizes, sizesFor, SOAK_SECONDS, type Options } from './options.ts';
import type { BenchContext, BenchMode, BenchModule, BenchResults, BenchRow } from './types.ts';

export { parseArgs, sizesFor } from './options.ts';

const BENCH_DIR = dirname(fileURLToPath(import.meta.url));
const REPO = dirname(BENCH_DIR);

export function discover(only: string[]): string[] {
  const all = readdirSync(BENCH_DIR)
    .filter((f) => f.endsWith('.bench.ts'))
    .sort();
  if (only.length === 0) return all;
  const names = new Set(all.map(benchName));
  const unknown = only.filter((o) => !names.has(o));
  if (unknown.length > 0) {
    throw new Error(`--only: no bench named ${unknown.join(', ')} (available: ${[...names].join(', ') || 'none'})`);
  }
  return all.filter((f) => only.includes(benchName(f)));
}

function benchName(file: string): string {
  return basename(file, '.bench.ts');
}

/** Heap for --full children: three quarters of the machine's memory, at most 16 GB. */
function fullHeapMb(): number {
  return Math.min(16_384, Math.floor((totalmem() / 1024 / 1024) * 0.75));
}

// ---------------------------------------------------------------- parent

interface FileOutcome {
  rows: BenchRow[];
  ok: boolean;
  seconds: number;
  peakRssMb?: number;
  error?: string;
}

async function runFile(file: string, options: Options): Promise<FileOutcome> {
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

/** Fills `ratio` (times better than the baseline row) and `goalMet`. */
export function computeRatios(rows: BenchRow[]): BenchRow[] {
  const byKey = new Map(rows.map((r) => [`${r.bench}/${r.id}`, r]));
  return rows.map((row) => {
    const out = { ...row };
    if (row.baseline && row.skipped === undefined) {
      const base = byKey.get(`${row.bench}/${row.baseline}`);
      if (base && base.skipped === undefined && base.value > 0 && row.value > 0) {
        out.ratio = row.better === 'higher' ? row.value / base.value : base.value / row.value;
      }
    }
    if (row.goal && row.skipped === undefined) {
      out.goalMet = row.goal.op === '<=' ? row.value <= row.goal.value : row.value >= row.goal.value;
    }
    return out;
  });
}

function formatValue(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  const abs = Math.abs(v);
  if (abs >= 1000) return Math.round(v).toLocaleString('en-US');
  if (abs >= 10) return v.toFixed(1);
  return v.toPrecision(3);
}

export function formatTable(rows: BenchRow[]): string {
  const header = ['bench', 'measure', 'size', 'backend', 'value', 'unit', 'vs baseline', 'goal'];
  const lines = rows.map((r) => [
    r.bench ?? '',
    r.label,
    r.size === undefined ? '' : r.size.toLocaleString('en-US'),
    r.backend ?? '',
    r.skipped !== undefined ? 'skipped' : formatValue(r.value),
    r.skipped !== undefined ? r.skipped : r.unit,
    r.ratio === undefined ? '' : `${r.ratio.toFixed(2)}× ${r.baseline}`,
    r.goal ? `${r.goal.op} ${r.goal.value} ${r.goalMet === undefined ? '' : r.goalMet ? 'met' : 'MISSED'}` : '',
  ]);
  const widths = header.map((h, i) => Math.max(h.length, ...lines.map((l) => l[i]!.length)));
  const fmt = (cells: string[]): string =>
    cells
      .map((c, i) => c.padEnd(widths[i]!))
      .join('  ')
      .trimEnd();
  return [fmt(header), fmt(widths.map((w) => '-'.repeat(w))), ...lines.map(fmt)].join('\n');
}

function timestamp(date: Date): string {
  return date
    .toISOString()
    .replaceAll(':', '-')
    .replace(/\.\d+Z$/, 'Z');
}

async function parent(argv: string[]): Promise<number> {
  let options: Options;
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

// ---------------------------------------------------------------- child

type ChildMessage = { type: 'row'; row: BenchRow } | { type: 'done'; peakRssMb: number } | { type: 'error'; error: string };

function send(message: ChildMessage): Promise<void> {
  return new Promise((resolve) => {
    if (!process.send) {
      resolve();
      return;
    }
    process.send(message, undefined, {}, () => resolve());
  });
}

export function rate(fn: () => void, options: { minMs?: number; batch?: number } = {}): number {
  const minMs = options.minMs ?? 1000;
  const batch = Math.max(1, options.batch ?? 100);
  const warmUntil = performance.now() + Math.min(200, minMs / 5);
  while (performance.now() < warmUntil) for (let i = 0; i < batch; i++) fn();
  let calls = 0;
  const start = performance.now();
  let now = start;
  while (now - start < minMs) {
    for (let i = 0; i < batch; i++) fn();
    calls += batch;
    now = performance.now();
  }
  return (calls * 1000) / (now - start);
}

export async function withPeakMemory<T>(fn: (sample: () => void) => Promise<T>): Promise<{ result: T; peakRssMb: number; peakHeapMb: number }> {
  let peakRss = 0;
  let peakHeap = 0;
  const sample = (): void => {
    const m = process.memoryUsage();
    peakRss = Math.max(peakRss, m.rss);
    peakHeap = Math.max(peakHeap, m.heapUsed);
  };
  sample();
  const timer = setInterval(sample, 50);
  try {
    const result = await fn(sample);
    sample();
    return { result, peakRssMb: peakRss / 1024 ** 2, peakHeapMb: peakHeap / 1024 ** 2 };
  } finally {
    clearInterval(timer);
  }
}

async function child(argv: string[]): Promise<void> {
  const file = argv[argv.indexOf('--child') + 1]!;
  const mode = argv[argv.indexOf('--mode') + 1] as BenchMode;
  const seed = Number(argv[argv.indexOf('--seed') + 1]);
  const keep = argv.includes('--keep');
  const sizes = argv.includes('--sizes') ? parseSizes(argv[argv.indexOf('--sizes') + 1]!) : undefined;
  const { generateNames } = await import('../services/demo/generate-names.ts');
  const tmpDir = mkdtempSync(join(tmpdir(), `cpreg-bench-${benchName(file)}-`));
  const pending: Array<Promise<void>> = [];
  const ctx: BenchContext = {
    mode,
    databaseUrl: process.env.DATABASE_URL || undefined,
    seed,
    sizes: sizesFor(mode, sizes),
    soakSeconds: SOAK_SECONDS[mode],
    generator: { names: (count, s) => generateNames(count, s ?? seed) },
    tmpDir,
    record: (row) => {
      pending.push(send({ type: 'row', row }));
    },
    log: (message) => process.stderr.write(`  [${benchName(file)}] ${message}\n`),
    rate,
    withPeakMemory,
  };
  try {
    const mod = (await import(pathToFileURL(join(BENCH_DIR, file)).href)) as BenchModule;
    const run = mod.run ?? mod.default;
    if (typeof run !== 'function') throw new Error(`${file} exports neither run(ctx) nor a default function`);
    const rows = await run(ctx);
    if (!Array.isArray(rows)) throw new Error(`${file}: run(ctx) must resolve to an array of BenchRow`);
    for (const row of rows) pending.push(send({ type: 'row', row }));
    await Promise.all(pending);
    await send({ type: 'done', peakRssMb: process.resourceUsage().maxRSS / 1024 });
  } catch (error) {
    await Promise.all(pending);
    await send({ type: 'error', error: error instanceof Error ? error.message : String(error) });
    process.exitCode = 1;
  } finally {
    if (!keep) rmSync(tmpDir, { recursive: true, force: true });
  }
  // Bench files may leave pools or timers open; the runner's verdict is already sent.
  process.exit();
}

/** Entry point, called by bench/run.ts (kept apart so that tests can import the helpers above). */
export async function main(argv: string[]): Promise<void> {
  if (argv.includes('--child')) await child(argv);
  else process.exitCode = await parent(argv);
}
