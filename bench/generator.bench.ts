/**
 * Example bench file: how fast the scale generator produces names (services/demo/generate-names.ts), and the
 * share of originals, so that a change of the mix shows in the results.
 */
import type { BenchContext, BenchRow } from './types.ts';

export async function run(ctx: BenchContext): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  for (const size of ctx.sizes.names) {
    ctx.log(`generating ${size.toLocaleString('en-US')} names`);
    const { result, peakRssMb } = await ctx.withPeakMemory(async () => {
      const started = performance.now();
      let originals = 0;
      let chars = 0;
      for (const row of ctx.generator.names(size, ctx.seed)) {
        if (row.variantKind === 'original') originals++;
        chars += row.name.length;
      }
      return { seconds: (performance.now() - started) / 1000, originals, chars };
    });
    rows.push(
      { id: `names.${size}.rate`, label: 'names generated per second', value: size / result.seconds, unit: 'names/s', better: 'higher', size, backend: 'memory', extra: { seconds: result.seconds, meanLength: result.chars / size } },
      { id: `names.${size}.originals`, label: 'share of originals (rest are variants)', value: result.originals / size, unit: 'ratio', better: 'higher', size, backend: 'memory' },
      // Streaming: peak memory should not grow with the size (compare the sizes of one run).
      { id: `names.${size}.peak_rss`, label: 'peak resident memory while generating', value: peakRssMb, unit: 'MB', better: 'lower', size, backend: 'memory' },
    );
  }
  // The same number of names as a plain array-building loop would need: a baseline for the streaming cost.
  const size = ctx.sizes.names[0]!;
  const started = performance.now();
  const all = Array.from(ctx.generator.names(size, ctx.seed + 1));
  const seconds = (performance.now() - started) / 1000;
  rows.push({ id: 'names.materialised.rate', label: 'names/s when collected into one array', value: all.length / seconds, unit: 'names/s', better: 'higher', size, backend: 'memory' });
  rows[0]!.baseline = 'names.materialised.rate';
  return rows;
}
