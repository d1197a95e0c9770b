/**
 * Defined-terms reader speed: contracts parsed per second on the invented corpus passages
 * (tests/resolvers/terms/corpus), mentions resolved per second, and one 1 MB contract.
 * Runs under bench/run.ts (`npm run bench -- --only terms`) or alone: `node bin/run-ts.js bench/terms.bench.ts`.
 */
import { parseParties, resolveInContract } from '../resolvers/terms/index.ts';
import { CORPUS } from '../tests/resolvers/terms/corpus/contracts.ts';
import type { BenchContext, BenchRow } from './types.ts';

type Rate = BenchContext['rate'];

/** Standalone fallback for ctx.rate: operations per second over at least minMs after a warm-up. */
const simpleRate: Rate = (fn, options) => {
  const minMs = options?.minMs ?? 1000;
  for (let i = 0; i < 20; i++) fn();
  let n = 0;
  const started = performance.now();
  while (performance.now() - started < minMs) {
    fn();
    n++;
  }
  return n / ((performance.now() - started) / 1000);
};

/** A 1 MB contract: the corpus passages repeated, with recital prose in between. */
function bigContract(): string {
  const unit = `${CORPUS.map((c) => c.text).join('\n\nWHEREAS the parties wish to record their agreement in writing.\n\n')}\n\n`;
  const times = Math.floor((1024 * 1024 - 1024) / Buffer.byteLength(unit));
  return unit.repeat(Math.max(1, times));
}

export async function run(ctx: Pick<BenchContext, 'rate' | 'log'>): Promise<BenchRow[]> {
  const texts = CORPUS.map((c) => c.text);
  let k = 0;
  ctx.log(`parsing ${texts.length} corpus passages in a loop`);
  const parseRate = ctx.rate(() => {
    parseParties(texts[k++ % texts.length] as string);
  });
  const parsed = texts.map((t) => parseParties(t));
  const mentions = ['the Licensee', 'the Company', 'Parties', 'we', 'Harbourside Freight plc'];
  let m = 0;
  const resolveRate = ctx.rate(() => {
    resolveInContract(parsed[m % parsed.length]!, mentions[m++ % mentions.length]!);
  });
  const big = bigContract();
  ctx.log(`parsing one ${Buffer.byteLength(big)}-byte contract`);
  // batch 1: the runner's default batch of 100 calls per timing step meant 200+ parses of 1 MB (minutes).
  const bigRate = ctx.rate(
    () => {
      parseParties(big);
    },
    { minMs: 3000, batch: 1 },
  );
  return [
    {
      id: 'terms.parse.corpus',
      label: 'contracts parsed per second (corpus passages, ~500 chars)',
      value: parseRate,
      unit: 'contracts/s',
      better: 'higher',
      size: texts.length,
      backend: 'memory',
    },
    {
      id: 'terms.resolve',
      label: 'mentions resolved per second inside a parsed contract',
      value: resolveRate,
      unit: 'mentions/s',
      better: 'higher',
      backend: 'memory',
    },
    {
      id: 'terms.parse.1mb',
      label: '1 MB contracts parsed per second',
      value: bigRate,
      unit: 'contracts/s',
      better: 'higher',
      size: Buffer.byteLength(big),
      backend: 'memory',
    },
  ];
}

// Alone: `node bin/run-ts.js bench/terms.bench.ts` prints the rows (the runner passes --child instead).
if (!process.argv.includes('--child')) {
  const rows = await run({ rate: simpleRate, log: (message) => process.stderr.write(`${message}\n`) });
  for (const r of rows) console.log(`${r.label}: ${r.value.toFixed(1)} ${r.unit}`);
}
