/**
 * The child side of the bench runner: runs one bench file in its own process with its context (bench/types.ts) and
 * sends its rows, its peak memory or its error to the parent.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { BenchContext, BenchMode, BenchModule, BenchRow } from './types.ts';
import { BENCH_DIR, benchName } from './discover.ts';
import { parseSizes, SOAK_SECONDS, sizesFor } from './runner-options.ts';
import { rate, withPeakMemory } from './measure.ts';

export type ChildMessage = { type: 'row'; row: BenchRow } | { type: 'done'; peakRssMb: number } | { type: 'error'; error: string };

function send(message: ChildMessage): Promise<void> {
  return new Promise((resolve) => {
    if (!process.send) {
      resolve();
      return;
    }
    process.send(message, undefined, {}, () => resolve());
  });
}

export async function runChild(argv: string[]): Promise<void> {
  // The parent is gone (killed at its time limit, or interrupted): stop too rather than work on unseen.
  process.once('disconnect', () => process.exit(1));
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
    sizesGiven: sizes !== undefined,
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
