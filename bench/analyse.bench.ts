/**
 * Name analysis throughput: analyses per second on one core, on invented names from a small seeded generator
 * (resolvers/prng.ts) that mixes legal forms, qualifiers, aliases, persons and role words. Goal (issue 3):
 * ≥ 200,000 analyses per second. A second row measures the scale generator's names (services/demo) for reference.
 *
 * Run alone:        node bin/run-ts.js bench/analyse.bench.ts [--seed N] [--ms MILLISECONDS]
 * Run with others:  npm run bench -- --only analyse
 */
import type { BenchContext, BenchRow } from './types.ts';
import { analyseName } from '../resolvers/analyse/index.ts';
import { seededRandom } from '../resolvers/prng.ts';
import type { Random } from '../resolvers/prng.ts';

export const GOAL_ANALYSES_PER_SECOND = 200_000; // issue 3

const SYLLABLES = ['bran', 'quil', 'vor', 'tal', 'mer', 'os', 'pen', 'hal', 'dri', 'ka', 'lun', 'sev', 'or', 'thi', 'mu', 'el', 'gar', 'rin', 'zo', 'wy'];
const WORDS = [
  'Widgets',
  'Holdings',
  'Print Works',
  'Logistics',
  'Feinmechanik',
  'Systems',
  'Trading',
  'Foods',
  'Engineering',
  'Partners',
  'Bakeries',
  'Freight',
];
const FORMS = [
  'Ltd',
  'Limited',
  'Inc.',
  'INC.',
  'LLC',
  'L.L.C.',
  'Corp.',
  'Corporation',
  'plc',
  'P.L.C.',
  'GmbH',
  'GmbH & Co. KG',
  'AG',
  'S.A.',
  'S.A. de C.V.',
  'SAS',
  'S.à r.l.',
  'B.V.',
  'N.V.',
  'Pty. Ltd.',
  'S.p.A.',
  'Oy',
  'AB',
  'A/S',
  'Sp. z o.o.',
  'LLP',
  'Co.',
];
const PREFIX_FORMS = ['ООО', 'UAB', 'SIA', 'OOO'];
const QUALIFIERS = ['(Europe)', '(UK)', '(Bristol)', '(Deutschland)'];
const ALIAS_MARKERS = ['d/b/a', 't/a', 'f/k/a', 'formerly', 'a/k/a', 'trading as'];
const GIVEN = ['Iolo', 'Hanna', 'Maria', 'Petra', 'Tomos', 'Lucas'];
const ROLES = ['the Company', 'Licensee', 'we', 'the Parties', 'By:', 'its Affiliates', 'Supplier'];

function word(rng: Random): string {
  let w = '';
  const n = 2 + rng.int(2);
  for (let i = 0; i < n; i++) w += rng.pick(SYLLABLES);
  return w.charAt(0).toUpperCase() + w.slice(1);
}

function organisation(rng: Random): string {
  let name = word(rng);
  if (rng.chance(0.5)) name += ` ${word(rng)}`;
  if (rng.chance(0.6)) name += ` ${rng.pick(WORDS)}`;
  if (rng.chance(0.1)) name += ` ${rng.pick(QUALIFIERS)}`;
  if (rng.chance(0.08)) return `${rng.pick(PREFIX_FORMS)} ${name}`;
  if (rng.chance(0.85)) name += rng.chance(0.3) ? `, ${rng.pick(FORMS)}` : ` ${rng.pick(FORMS)}`;
  return rng.chance(0.1) ? name.toUpperCase() : name;
}

/** `count` invented names: mostly organisations, some with aliases, some persons and role words. */
export function inventNames(count: number, seed: number): string[] {
  const rng = seededRandom(seed);
  const out: string[] = [];
  for (let i = 0; i < count; i++) {
    const roll = rng.next();
    if (roll < 0.75) out.push(organisation(rng));
    else if (roll < 0.85) out.push(`${organisation(rng)} ${rng.pick(ALIAS_MARKERS)} ${organisation(rng)}`);
    else if (roll < 0.95) out.push(`${rng.pick(GIVEN)} ${word(rng)}`);
    else out.push(rng.pick(ROLES));
  }
  return out;
}

export interface AnalyseRates {
  /** Analyses per second of CPU time used by this process: the per-core figure, unaffected by other processes. */
  perCpuSecond: number;
  /** Analyses per second of elapsed time: lower than perCpuSecond when the machine is shared. */
  perWallSecond: number;
  analyses: number;
}

/**
 * Analyses `names` in a loop for at least `minMs` after a warm-up. CPU time is process.cpuUsage (all threads of
 * this process, so the garbage collector's helpers count against us: a conservative per-core figure).
 */
export function measureAnalyses(names: readonly string[], minMs: number): AnalyseRates {
  let sink = 0;
  // Warm-up by work done, not by time: on a loaded machine 300 ms of wall time may be too little CPU for the JIT.
  const warmUntil = performance.now() + Math.min(300, minMs / 4);
  for (let pass = 0; pass < 2 || performance.now() < warmUntil; pass++) {
    for (const name of names) sink += analyseName(name).tokens.length;
  }
  const cpu0 = process.cpuUsage();
  const start = performance.now();
  let analyses = 0;
  let now = start;
  while (now - start < minMs) {
    for (const name of names) sink += analyseName(name).tokens.length;
    analyses += names.length;
    now = performance.now();
  }
  const cpu = process.cpuUsage(cpu0);
  if (sink < 0) throw new Error('unreachable'); // keeps the results alive
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  return { perCpuSecond: analyses / cpuSeconds, perWallSecond: (analyses * 1000) / (now - start), analyses };
}

function rows(prefix: string, label: string, rates: AnalyseRates, size: number, goal: boolean): BenchRow[] {
  return [
    {
      id: `${prefix}.per_cpu_second`,
      label: `name analyses per CPU-second, one core (${label})`,
      value: rates.perCpuSecond,
      unit: 'ops/s',
      better: 'higher',
      size,
      backend: 'memory',
      ...(goal ? { goal: { op: '>=' as const, value: GOAL_ANALYSES_PER_SECOND } } : {}),
      extra: { analyses: rates.analyses },
    },
    {
      id: `${prefix}.per_wall_second`,
      label: `name analyses per elapsed second (${label}; lower on a shared machine)`,
      value: rates.perWallSecond,
      unit: 'ops/s',
      better: 'higher',
      size,
      backend: 'memory',
    },
  ];
}

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const names = inventNames(20_000, ctx.seed);
  const minMs = ctx.mode === 'quick' ? 1000 : 3000;
  ctx.log(`analysing ${names.length.toLocaleString('en-US')} invented names in a loop for ${minMs} ms`);
  const out = rows('analyse.invented', 'bench/analyse.bench.ts generator', measureAnalyses(names, minMs), names.length, true);
  const demo = Array.from(ctx.generator.names(20_000, ctx.seed), (g) => g.name);
  out.push(...rows('analyse.demo_generator', 'scale generator names', measureAnalyses(demo, minMs), demo.length, false));
  return out;
}

/** Stand-alone run: `node bin/run-ts.js bench/analyse.bench.ts [--seed N] [--ms M]` (not under the runner). */
async function standalone(argv: string[]): Promise<void> {
  const flag = (name: string, fallback: number): number => {
    const at = argv.indexOf(name);
    const value = at >= 0 ? Number(argv[at + 1]) : fallback;
    if (!Number.isFinite(value) || value < 0) throw new Error(`${name}: expected a non-negative number`);
    return value;
  };
  const seed = flag('--seed', 1);
  const minMs = flag('--ms', 3000);
  const names = inventNames(20_000, seed);
  const rates = measureAnalyses(names, minMs);
  const verdict = rates.perCpuSecond >= GOAL_ANALYSES_PER_SECOND ? 'meets' : 'misses';
  const fmt = (n: number): string => Math.round(n).toLocaleString('en-US');
  console.log(
    `analyse: ${fmt(rates.perCpuSecond)} analyses per CPU-second (one core; goal >= ${fmt(GOAL_ANALYSES_PER_SECOND)}: ${verdict}), ` +
      `${fmt(rates.perWallSecond)} per elapsed second; ${fmt(rates.analyses)} analyses of ${names.length.toLocaleString('en-US')} invented names, seed ${seed}`,
  );
}

if (!process.argv.includes('--child') && /run-ts\.js$/.test(process.argv[1] ?? '')) {
  await standalone(process.argv.slice(2));
}
