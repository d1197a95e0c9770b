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
const WORDS = ['Widgets', 'Holdings', 'Print Works', 'Logistics', 'Feinmechanik', 'Systems', 'Trading', 'Foods', 'Engineering', 'Partners', 'Bakeries', 'Freight'];
const FORMS = ['Ltd', 'Limited', 'Inc.', 'INC.', 'LLC', 'L.L.C.', 'Corp.', 'Corporation', 'plc', 'P.L.C.', 'GmbH', 'GmbH & Co. KG', 'AG', 'S.A.', 'S.A. de C.V.', 'SAS', 'S.à r.l.', 'B.V.', 'N.V.', 'Pty. Ltd.', 'S.p.A.', 'Oy', 'AB', 'A/S', 'Sp. z o.o.', 'LLP', 'Co.'];
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

type Rate = (fn: () => void, options?: { minMs?: number; batch?: number }) => number;

function analysesPerSecond(names: readonly string[], rate: Rate, minMs: number): number {
  let i = 0;
  let sink = 0;
  const perSecond = rate(
    () => {
      sink += analyseName(names[i] as string).tokens.length;
      i = i + 1 === names.length ? 0 : i + 1;
    },
    { minMs, batch: 1000 },
  );
  if (sink < 0) throw new Error('unreachable'); // keeps the result alive
  return perSecond;
}

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const names = inventNames(20_000, ctx.seed);
  const minMs = ctx.mode === 'quick' ? 1000 : 3000;
  ctx.log(`analysing ${names.length.toLocaleString('en-US')} invented names in a loop for ${minMs} ms`);
  const rows: BenchRow[] = [
    {
      id: 'analyse.invented',
      label: 'name analyses per second (bench/analyse.bench.ts generator, one core)',
      value: analysesPerSecond(names, ctx.rate, minMs),
      unit: 'ops/s',
      better: 'higher',
      size: names.length,
      backend: 'memory',
      goal: { op: '>=', value: GOAL_ANALYSES_PER_SECOND },
    },
  ];
  const demo = Array.from(ctx.generator.names(20_000, ctx.seed), (g) => g.name);
  rows.push({
    id: 'analyse.demo_generator',
    label: 'name analyses per second (scale generator names, one core)',
    value: analysesPerSecond(demo, ctx.rate, minMs),
    unit: 'ops/s',
    better: 'higher',
    size: demo.length,
    backend: 'memory',
  });
  return rows;
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
  const { rate } = await import('./runner.ts');
  const names = inventNames(20_000, seed);
  const value = analysesPerSecond(names, rate, minMs);
  const verdict = value >= GOAL_ANALYSES_PER_SECOND ? 'meets' : 'misses';
  console.log(
    `analyse: ${Math.round(value).toLocaleString('en-US')} analyses/s on ${names.length.toLocaleString('en-US')} invented names ` +
      `(seed ${seed}, ${minMs} ms; goal ≥ ${GOAL_ANALYSES_PER_SECOND.toLocaleString('en-US')}: ${verdict})`,
  );
}

if (!process.argv.includes('--child') && /run-ts\.js$/.test(process.argv[1] ?? '')) {
  await standalone(process.argv.slice(2));
}
