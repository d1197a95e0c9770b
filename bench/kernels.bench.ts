/**
 * String-kernel speed on one core: Jaro–Winkler pairs per second, ours (resolvers/compare) against natural's
 * JaroWinklerDistance, in the same process on the same pairs. Goal (issue 5): ≥ 3× natural.
 *
 * Pairs: invented names from the scale generator, lower-cased as the analysis would fold them, half of them
 * a name and another name of the same entity (the near pairs that scoring sees after blocking), half two
 * random names. The two kernels are timed in many short alternating rounds; each rate is the median over
 * rounds and the speed-up is the median of the per-round ratios, so that a warm-up, a GC pause or another
 * process on a shared machine does not favour either.
 *
 * Runs under the bench runner (`npm run bench -- --only kernels`) or alone:
 *   node bin/run-ts.js bench/kernels.bench.ts [--pairs 20000] [--rounds 7]
 */
import { createRequire } from 'node:module';
import { buildIdfTable, jaroWinkler, softTfIdfWeighted, weighTokens } from '../resolvers/compare/index.ts';
import { seededRandom } from '../resolvers/prng.ts';
import type { BenchContext, BenchRow, GeneratedName } from './types.ts';

const require = createRequire(import.meta.url);
const naturalJaroWinkler = require('natural/lib/natural/distance/jaro-winkler_distance.js') as (a: string, b: string) => number;

function makePairs(names: GeneratedName[], count: number, seed: number): Array<[string, string]> {
  const random = seededRandom(seed);
  const byEntity = new Map<string, string[]>();
  for (const n of names) {
    const list = byEntity.get(n.entityId) ?? [];
    list.push(n.name.toLowerCase());
    byEntity.set(n.entityId, list);
  }
  const groups = [...byEntity.values()].filter((g) => g.length > 1);
  const all = names.map((n) => n.name.toLowerCase());
  const pairs: Array<[string, string]> = [];
  for (let i = 0; i < count; i++) {
    if (i % 2 === 0 && groups.length > 0) {
      const g = random.pick(groups);
      const a = random.int(g.length);
      const b = (a + 1 + random.int(g.length - 1)) % g.length;
      pairs.push([g[a]!, g[b]!]);
    } else {
      pairs.push([random.pick(all), random.pick(all)]);
    }
  }
  return pairs;
}

/** Pairs per second of one pass over all pairs. The checksum keeps the calls from being optimised away. */
function timePass(fn: (a: string, b: string) => number, pairs: Array<[string, string]>): { rate: number; checksum: number } {
  let checksum = 0;
  const start = performance.now();
  for (let i = 0; i < pairs.length; i++) {
    const p = pairs[i]!;
    checksum += fn(p[0], p[1]);
  }
  const ms = performance.now() - start;
  return { rate: (pairs.length * 1000) / ms, checksum };
}

function median(values: number[]): number {
  const sorted = [...values].sort((x, y) => x - y);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}

export interface KernelOptions {
  pairs?: number;
  rounds?: number;
}

export async function run(ctx: BenchContext, options: KernelOptions = {}): Promise<BenchRow[]> {
  const pairCount = options.pairs ?? 20_000;
  const rounds = options.rounds ?? (ctx.mode === 'quick' ? 15 : 41);
  const names = Array.from(ctx.generator.names(Math.max(10_000, pairCount / 2), ctx.seed));
  const pairs = makePairs(names, pairCount, ctx.seed + 5);
  let longest = 0;
  let over32 = 0;
  let totalLength = 0;
  let maxDifference = 0;
  for (const [a, b] of pairs) {
    longest = Math.max(longest, a.length, b.length);
    if (b.length > 32) over32++;
    totalLength += a.length + b.length;
    maxDifference = Math.max(maxDifference, Math.abs(jaroWinkler(a, b) - naturalJaroWinkler(a, b)));
  }
  ctx.log(`${pairs.length} pairs, mean length ${(totalLength / pairs.length / 2).toFixed(1)}, ${over32} with |b| > 32 (multi-word kernel)`);
  // Warm both up before measuring.
  for (let i = 0; i < 3; i++) {
    timePass(jaroWinkler, pairs);
    timePass(naturalJaroWinkler, pairs);
  }
  const ours: number[] = [];
  const theirs: number[] = [];
  const ratios: number[] = [];
  for (let r = 0; r < rounds; r++) {
    // Alternate which goes first, so neither always runs right after the other's garbage.
    const first = r % 2 === 0;
    const x = first ? timePass(jaroWinkler, pairs).rate : 0;
    const y = timePass(naturalJaroWinkler, pairs).rate;
    const z = first ? x : timePass(jaroWinkler, pairs).rate;
    ours.push(z);
    theirs.push(y);
    ratios.push(z / y);
  }
  const oursRate = median(ours);
  const naturalRate = median(theirs);
  const speedUp = median(ratios);
  const extra = {
    pairs: pairs.length,
    rounds,
    speedUpMin: Number(Math.min(...ratios).toFixed(3)),
    speedUpMax: Number(Math.max(...ratios).toFixed(3)),
    meanLength: Number((totalLength / pairs.length / 2).toFixed(2)),
    longest,
    shareLongKernel: Number((over32 / pairs.length).toFixed(4)),
    maxAbsDifferenceFromNatural: maxDifference,
  };
  // Soft TF-IDF on the same pairs (tokens weighed beforehand, as a register does per record): for scale only.
  const tokenise = (name: string): string[] => name.split(/[^\p{L}\p{N}]+/u).filter((t) => t.length > 0);
  const idf = buildIdfTable(names.map((n) => tokenise(n.name.toLowerCase())));
  const weighed = pairs.map(([a, b]) => [weighTokens(tokenise(a), idf), weighTokens(tokenise(b), idf)] as const);
  const softRates: number[] = [];
  let softChecksum = 0;
  for (let r = 0; r < 5; r++) {
    const start = performance.now();
    let sum = 0;
    for (const [a, b] of weighed) sum += softTfIdfWeighted(a, b);
    softRates.push((weighed.length * 1000) / (performance.now() - start));
    softChecksum = sum;
  }
  return [
    {
      id: 'softtfidf.cpreg',
      label: 'soft TF-IDF pairs/s (JW ≥ 0.9 between tokens, weights precomputed)',
      value: median(softRates),
      unit: 'pairs/s',
      better: 'higher',
      backend: 'memory',
      extra: { pairs: weighed.length, meanScore: Number((softChecksum / weighed.length).toFixed(4)) },
    },
    {
      id: 'jw.natural',
      label: 'Jaro–Winkler pairs/s (natural JaroWinklerDistance)',
      value: naturalRate,
      unit: 'pairs/s',
      better: 'higher',
      backend: 'memory',
      extra,
    },
    {
      id: 'jw.cpreg',
      label: 'Jaro–Winkler pairs/s (cpreg, plain JW)',
      value: oursRate,
      unit: 'pairs/s',
      better: 'higher',
      backend: 'memory',
      baseline: 'jw.natural',
      extra,
    },
    {
      id: 'jw.speedup',
      label: 'Jaro–Winkler speed-up over natural (goal ≥ 3×)',
      value: speedUp,
      unit: 'ratio',
      better: 'higher',
      backend: 'memory',
      goal: { op: '>=', value: 3 },
      extra,
    },
  ];
}

/** Alone (not under the bench runner's child process): a minimal context, results printed. */
async function runAlone(): Promise<void> {
  const argv = process.argv;
  const option = (name: string): number | undefined => {
    const i = argv.indexOf(name);
    return i >= 0 ? Number(argv[i + 1]) : undefined;
  };
  const { generateNames } = await import('../services/demo/generate-names.ts');
  const { rate, withPeakMemory } = await import('./measure.ts');
  const seed = option('--seed') ?? 1;
  const ctx: BenchContext = {
    mode: 'default',
    seed,
    sizes: { register: [10_000, 100_000], names: [100_000], ingest: [100_000] },
    soakSeconds: 60,
    generator: { names: (count, s) => generateNames(count, s ?? seed) },
    tmpDir: '',
    record: () => undefined,
    log: (message) => process.stderr.write(`  [kernels] ${message}\n`),
    rate,
    withPeakMemory,
  };
  const rows = await run(ctx, { pairs: option('--pairs'), rounds: option('--rounds') });
  for (const row of rows) {
    console.log(`${row.label.padEnd(55)} ${row.value.toLocaleString('en-US', { maximumFractionDigits: 2 })} ${row.unit}`);
  }
  console.log(JSON.stringify(rows.find((row) => row.id === 'jw.speedup')?.extra));
}

if (!process.argv.includes('--child')) await runAlone();
