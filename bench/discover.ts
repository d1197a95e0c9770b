/**
 * The bench files the runner runs: every bench/*.bench.ts, or those named by --only, each known by its name without
 * the suffix.
 */
import { readdirSync } from 'node:fs';
import { basename, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';

export const BENCH_DIR = dirname(fileURLToPath(import.meta.url));
export const REPO = dirname(BENCH_DIR);

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

export function benchName(file: string): string {
  return basename(file, '.bench.ts');
}
