/**
 * The bench runner's options (`--quick | --full`, `--only`, `--seed`, `--keep`) and what each mode means: the sizes
 * the benches run at, the soak's length, each file's time limit and the heap of a --full child.
 */
import { totalmem } from 'node:os';
import type { BenchContext, BenchMode } from './types.ts';

export interface RunnerOptions {
  mode: BenchMode;
  only: string[];
  seed: number;
  keep: boolean;
}

/** Per-file time limits: a hung bench must not stall the run. */
export const FILE_TIMEOUT_S: Record<BenchMode, number> = { quick: 300, default: 3600, full: 4 * 3600 };

export function sizesFor(mode: BenchMode): BenchContext['sizes'] {
  if (mode === 'quick') return { register: [10_000], names: [10_000], ingest: [10_000], scaleOut: [5_000] };
  if (mode === 'default') return { register: [10_000, 100_000], names: [100_000], ingest: [100_000], scaleOut: [50_000] };
  return { register: [10_000, 100_000, 1_000_000], names: [100_000, 1_000_000], ingest: [100_000, 1_000_000], scaleOut: [1_000_000] };
}

export const SOAK_SECONDS: Record<BenchMode, number> = { quick: 30, default: 60, full: 300 };

export function parseArgs(argv: string[]): RunnerOptions {
  const options: RunnerOptions = { mode: 'default', only: [], seed: 1, keep: false };
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (arg === '--quick') options.mode = 'quick';
    else if (arg === '--full') options.mode = 'full';
    else if (arg === '--keep') options.keep = true;
    else if (arg === '--only' || arg === '--seed') {
      const value = argv[++i];
      if (value === undefined) throw new Error(`${arg}: missing value`);
      if (arg === '--only') options.only.push(...value.split(',').filter(Boolean));
      else {
        if (!/^\d+$/.test(value)) throw new Error(`--seed: expected a whole number, got "${value}"`);
        options.seed = Number(value);
      }
    } else throw new Error(`unknown option "${arg}" (valid: --quick, --full, --only <name>, --seed <n>, --keep)`);
  }
  if (argv.includes('--quick') && argv.includes('--full')) throw new Error('--quick and --full exclude each other');
  return options;
}

/** Heap for --full children: three quarters of the machine's memory, at most 16 GB. */
export function fullHeapMb(): number {
  return Math.min(16_384, Math.floor((totalmem() / 1024 / 1024) * 0.75));
}
