/**
 * `cpreg generate --names N --seed S --out file.csv`: invented organisation names with ground-truth entity ids,
 * streamed to a CSV file (columns entity_id,name,country,variant_kind,sibling_of). See docs/generator.md.
 */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';

export default function register(program: Command): void {
  program
    .command('generate')
    .description('write invented organisation names with known entity ids and realistic variants (ground truth for benchmarks)')
    .requiredOption('--names <n>', 'number of name rows to write (originals and variants), e.g. 100000')
    .option('--seed <s>', 'seed: the same seed writes the same file', '1')
    .requiredOption('--out <file>', 'CSV file to write (replaced if it exists)')
    .option('--json', 'print the summary as JSON')
    .action(async (options: { names: string; seed: string; out: string; json?: boolean }) => {
      const { MAX_NAMES } = await import('../../demo/generate-names.ts');
      const names = parseWhole('--names', options.names, 0, MAX_NAMES);
      const seed = parseWhole('--seed', options.seed, 0, 2 ** 32 - 1);
      const { writeNamesCsv } = await import('../../demo/write-names.ts');
      const started = Date.now();
      const summary = await writeNamesCsv(options.out, names, seed).catch((error: unknown) => {
        throw new CliError(`--out ${options.out}: ${error instanceof Error ? error.message : String(error)}`, 1, { cause: error });
      });
      const seconds = (Date.now() - started) / 1000;
      if (options.json) {
        process.stdout.write(`${JSON.stringify({ ...summary, seed, seconds })}\n`);
      } else {
        process.stdout.write(
          `wrote ${summary.rows} names of ${summary.entities} entities (${summary.originals} originals, ` +
            `${summary.rows - summary.originals} variants) to ${summary.file} in ${seconds.toFixed(1)} s (seed ${seed})\n`,
        );
      }
    });
}

function parseWhole(flag: string, raw: string, min: number, max: number): number {
  const value = /^\d+$/.test(raw.trim()) ? Number(raw.trim()) : Number.NaN;
  if (!Number.isSafeInteger(value) || value < min || value > max) {
    throw new CliError(`${flag}: expected a whole number from ${min} to ${max}, got "${raw}"`);
  }
  return value;
}
