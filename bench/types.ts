/**
 * The contract between the bench runner (bench/run.ts) and every benchmark file (bench/*.bench.ts).
 *
 * A benchmark file exports `run` (named or default):
 *
 *   import type { BenchContext, BenchRow } from './types.ts';
 *   export async function run(ctx: BenchContext): Promise<BenchRow[]> { ... }
 *
 * The runner starts each file in its own child process (so its peak memory is its own and a crash
 * loses only that file's rows), passes a BenchContext, collects the returned rows plus every row
 * sent earlier through `ctx.record`, prints one table, and writes bench/results/<timestamp>.json.
 * Benchmarks never run in `npm test`.
 */

/** quick: smoke run under two minutes (registers of 10,000, 30 s soak). default: the sizes the
 * issues ask for (10,000 and 100,000). full: adds the 1,000,000 sizes, PostgreSQL only. */
export type BenchMode = 'quick' | 'default' | 'full';

/** Where a measurement ran. `memory` = pure in-process code (no database). */
export type BenchBackend = 'memory' | 'pglite' | 'postgres' | 'http';

/** One invented organisation name with its true entity (see services/demo/generate-names.ts). */
export interface GeneratedName {
  /** Entity id: every variant of one invented organisation shares it (ground truth). */
  entityId: string;
  name: string;
  /** ISO 3166-1 alpha-2 or ISO 3166-2 (US states, e.g. "US-DE"). */
  country: string;
  /** `original` for the clean name, otherwise the corruption applied (see docs/generator.md). */
  variantKind: string;
}

/** Seeded source of invented names with ground truth; streaming, so 1M names never sit in memory. */
export interface NameSource {
  /** `count` names (originals and variants mixed as docs/generator.md describes). Same seed, same names. */
  names(count: number, seed?: number): Iterable<GeneratedName>;
}

export interface BenchContext {
  mode: BenchMode;
  /** PostgreSQL connection string from DATABASE_URL, when set. PostgreSQL benches skip without it. */
  databaseUrl?: string;
  /** The run's seed (`--seed`, default 1). Use it (or seed + a constant) for every random choice. */
  seed: number;
  /** Sizes for this mode, so that every bench scales the same way. */
  sizes: {
    /** Register sizes (counterparties): quick [10_000]; default [10_000, 100_000]; full adds 1_000_000. */
    register: number[];
    /** Names to cluster/analyse: quick [10_000]; default [100_000]; full [100_000, 1_000_000]. */
    names: number[];
    /** Mentions for batch ingest: quick [10_000]; default [100_000]; full [100_000, 1_000_000]. */
    ingest: number[];
    /** Mentions of one partitioned ingest job run by 1 and 2 workers: quick [5_000]; default [50_000]; full [1_000_000].
     * Optional so that contexts built outside the runner (bench/kernels.bench.ts run alone) need not list it. */
    scaleOut?: number[];
  };
  /** True when `--sizes` replaced the mode's sizes: a bench may then run at those sizes what its mode keeps for
   * --full (bench/ingest.bench.ts: the ingest into a loaded register). */
  sizesGiven?: boolean;
  /** Soak duration in seconds: quick 30; default 60; full 300. */
  soakSeconds: number;
  /** Seeded name generator with ground truth. */
  generator: NameSource;
  /** A scratch directory for this bench file (created, removed after the run unless --keep). */
  tmpDir: string;
  /** Send one row now (kept even if the bench later fails). Rows returned from `run` are added too. */
  record(row: BenchRow): void;
  /** Progress line on stderr (not part of the results). */
  log(message: string): void;
  /** Operations per second of `fn`, called repeatedly for at least `minMs` (default 1000) after a warm-up. */
  rate(fn: () => void, options?: { minMs?: number; batch?: number }): number;
  /**
   * Runs `fn` while sampling memory every 50 ms; returns its result and the peaks seen (MB). Timers only
   * fire when `fn` awaits: a long synchronous loop should call the `sample` it is given now and then.
   * (The runner also reports each file's true peak RSS, from the OS, in the results file.)
   */
  withPeakMemory<T>(fn: (sample: () => void) => Promise<T>): Promise<{ result: T; peakRssMb: number; peakHeapMb: number }>;
}

/**
 * One measured figure. `id` is unique within its bench file; `baseline` names the id of another row in
 * the SAME file measured in the SAME run, and the runner reports `ratio` = how many times better this
 * row is than that one (value/baseline when higher is better, baseline/value when lower is better).
 */
export interface BenchRow {
  /** Unique within the file, e.g. "jw.cpreg", "jw.natural", "resolve.pglite.10000.p99". */
  id: string;
  /** What a person reads in the table, e.g. "Jaro–Winkler pairs/s (cpreg)". */
  label: string;
  value: number;
  /** "ops/s", "pairs/s", "mentions/s", "ms", "MB", "ratio", "f1", "count"… */
  unit: string;
  better: 'higher' | 'lower';
  /** Register or input size this figure was measured at. */
  size?: number;
  backend?: BenchBackend;
  /** Id of the baseline row in the same file (see above). */
  baseline?: string;
  /** The goal from the issue, if any: e.g. { op: '<=', value: 10 } for "p99 ≤ 10 ms". */
  goal?: { op: '<=' | '>='; value: number };
  /**
   * Where the measured work's time went, by stage (milliseconds, or any one unit within the row): where the goal is
   * missed, the table names the largest stage and its share.
   */
  stages?: Record<string, number>;
  /** Set (instead of a measurement) when the bench could not run here, e.g. "DATABASE_URL not set". */
  skipped?: string;
  /** Anything else worth keeping in the JSON (comparisons made, errors, counts). */
  extra?: Record<string, number | string | boolean>;
  /** Filled by the runner: the file this row came from ("generator" for bench/generator.bench.ts). */
  bench?: string;
  /** Filled by the runner from `baseline`. */
  ratio?: number;
  /** Filled by the runner from `goal`: whether the value meets it. */
  goalMet?: boolean;
}

/** What a bench file exports. */
export interface BenchModule {
  run?: (ctx: BenchContext) => Promise<BenchRow[]>;
  default?: (ctx: BenchContext) => Promise<BenchRow[]>;
}

/** The file bench/results/<timestamp>.json. */
export interface BenchResults {
  startedAt: string;
  finishedAt: string;
  mode: BenchMode;
  seed: number;
  argv: string[];
  machine: {
    platform: string;
    arch: string;
    cpuModel: string;
    cpus: number;
    memoryGb: number;
    node: string;
    maxOldSpaceMb?: number;
    postgres: boolean;
  };
  files: Array<{ bench: string; ok: boolean; seconds: number; peakRssMb?: number; error?: string }>;
  rows: BenchRow[];
}
