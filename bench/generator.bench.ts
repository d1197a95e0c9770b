/**
 * Example bench file: how fast the scale generator produces names (services/demo/generate-names.ts), and the
 * share of originals, so that a change of the mix shows in the results.
 */
import { getHeapStatistics } from 'node:v8';
import type { BenchContext, BenchRow } from './types.ts';

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  for (const size of ctx.sizes.names) {
    ctx.log(`generating ${size.toLocaleString('en-US')} names`);
    const { result, peakHeapMb } = await ctx.withPeakMemory(async (sample) => {
      const started = performance.now();
      let originals = 0;
      let chars = 0;
      let n = 0;
      for (const row of ctx.generator.names(size, ctx.seed)) {
        if (++n % 10_000 === 0) sample();
        if (row.variantKind === 'original') originals++;
        chars += row.name.length;
      }
      return { seconds: (performance.now() - started) / 1000, originals, chars };
    });
    rows.push(
      {
        id: `names.${size}.rate`,
        label: 'names generated per second',
        value: size / result.seconds,
        unit: 'names/s',
        better: 'higher',
        size,
        backend: 'memory',
        extra: { seconds: result.seconds, meanLength: result.chars / size, heapLimitMb: Math.round(getHeapStatistics().heap_size_limit / 1024 ** 2) },
      },
      {
        id: `names.${size}.originals`,
        label: 'share of originals (rest are variants)',
        value: result.originals / size,
        unit: 'ratio',
        better: 'higher',
        size,
        backend: 'memory',
      },
      // Streaming: peak memory should not grow with the size (compare the sizes of one run).
      { id: `names.${size}.peak_heap`, label: 'peak heap used while generating', value: peakHeapMb, unit: 'MB', better: 'lower', size, backend: 'memory' },
    );
  }
  // Baseline: the same names collected into one array, as a non-streaming generator would hold them.
  // Heap, not RSS: RSS rarely shrinks within one process, so the second measurement would inherit the first.
  // The streamed peak heap should be well below it (and not grow with the size).
  const size = ctx.sizes.names[0]!;
  const { result: materialised, peakHeapMb } = await ctx.withPeakMemory(async (sample) => {
    const started = performance.now();
    const all = Array.from(ctx.generator.names(size, ctx.seed));
    sample();
    return { count: all.length, seconds: (performance.now() - started) / 1000 };
  });
  rows.push(
    {
      id: 'names.materialised.rate',
      label: 'names/s when collected into one array',
      value: materialised.count / materialised.seconds,
      unit: 'names/s',
      better: 'higher',
      size,
      backend: 'memory',
    },
    {
      id: 'names.materialised.peak_heap',
      label: 'peak heap used, collected into one array',
      value: peakHeapMb,
      unit: 'MB',
      better: 'lower',
      size,
      backend: 'memory',
    },
  );
  rows.find((r) => r.id === `names.${size}.rate`)!.baseline = 'names.materialised.rate';
  rows.find((r) => r.id === `names.${size}.peak_heap`)!.baseline = 'names.materialised.peak_heap';
  return rows;
}
