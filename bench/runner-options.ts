/**
 * The bench runner's command line (bench/run.ts): `[--quick | --full] [--only <name>[,<name>]] [--sizes <n>[,<n>]]
 * [--seed <n>] [--keep]`. A mode sets the sizes every bench scales with (sizesFor); `--sizes` replaces them all with
 * its own list, so one size of one bench can be run alone (`--only register --sizes 1000000`: the 1,000,000 register
 * without the 10,000 and 100,000 ones that `--full` runs first, about 45 minutes in all).
 */
import { totalmem } from 'node:os';
import type { BenchContext, BenchMode } from './types.ts';

export interface RunnerOptions {
  mode: BenchMode;
  only: string[];
  seed: number;
  keep: boolean;
  /** Replaces the mode's sizes (register, names, ingest, scale-out alike) when given. */
  sizes?: number[];
}

/** The sizes of a mode, or `sizes` for every kind when given. */
export function sizesFor(mode: BenchMode, sizes?: readonly number[]): BenchContext['sizes'] {
  if (sizes) return { register: [...sizes], names: [...sizes], ingest: [...sizes], scaleOut: [...sizes] };
  if (mode === 'quick') return { register: [10_000], names: [10_000], ingest: [10_000], scaleOut: [5_000] };
  if (mode === 'default') return { register: [10_000, 100_000], names: [100_000], ingest: [100_000], scaleOut: [50_000] };
  return { register: [10_000, 100_000, 1_000_000], names: [100_000, 1_000_000], ingest: [100_000, 1_000_000], scaleOut: [1_000_000] };
}

/** Per-file time limits: a hung bench must not stall the run. */
export const FILE_TIMEOUT_S: Record<BenchMode, number> = { quick: 300, default: 3600, full: 4 * 3600 };

export const SOAK_SECONDS: Record<BenchMode, number> = { quick: 30, default: 60, full: 300 };

/** The smallest size that gets --full's larger heap and longer time limit in any mode. */
export const FULL_SCALE_SIZE = 1_000_000;

/** Whether the bench children get --full's heap and time limit: under --full, or when a size given reaches FULL_SCALE_SIZE. */
export function fullScale(options: Pick<RunnerOptions, 'mode' | 'sizes'>): boolean {
  return options.mode === 'full' || (options.sizes ?? []).some((s) => s >= FULL_SCALE_SIZE);
}

/** `--sizes` as written: whole numbers of at least 1, separated by commas. */
export function parseSizes(value: string): number[] {
  const sizes = value.split(',').filter(Boolean);
  if (sizes.length === 0 || sizes.some((s) => !/^\d+$/.test(s) || Number(s) < 1)) {
    throw new Error(`--sizes: expected whole numbers of at least 1 separated by commas, got "${value}"`);
  }
  return sizes.map(Number);
}

export function parseArgs(argv: string[]): RunnerOptions {
  const options: RunnerOptions = { mode: 'default', only: [], seed: 1, keep: false };
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (arg === '--quick') options.mode = 'quick';
    else if (arg === '--full') options.mode = 'full';
    else if (arg === '--keep') options.keep = true;
    else if (arg === '--only' || arg === '--seed' || arg === '--sizes') {
      const value = argv[++i];
      if (value === undefined) throw new Error(`${arg}: missing value`);
      if (arg === '--only') options.only.push(...value.split(',').filter(Boolean));
      else if (arg === '--sizes') options.sizes = [...(options.sizes ?? []), ...parseSizes(value)];
      else {
        if (!/^\d+$/.test(value)) throw new Error(`--seed: expected a whole number, got "${value}"`);
        options.seed = Number(value);
      }
    } else throw new Error(`unknown option "${arg}" (valid: --quick, --full, --only <name>, --sizes <n>, --seed <n>, --keep)`);
  }
  if (argv.includes('--quick') && argv.includes('--full')) throw new Error('--quick and --full exclude each other');
  return options;
}

/** Heap for --full children: three quarters of the machine's memory, at most 16 GB. */
export function fullHeapMb(): number {
  return Math.min(16_384, Math.floor((totalmem() / 1024 / 1024) * 0.75));
}
