/**
 * `cpreg sweep`: scan the register in blocks for counterparties that look like one entity and file review items
 * (never merges; a pair that shares only contact or bank details is proposed as affiliate_of).
 */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP } from './serve.ts';
import { withRegister } from './own-entities.ts';

export default function register(program: Command): void {
  program
    .command('sweep')
    .description('look for duplicate counterparties and file review items (never merges)')
    .option('--block-size <n>', 'counterparties read per block', '200')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the summary as JSON')
    .showHelpAfterError(true)
    .action(async (options: { blockSize: string; db?: string; json?: boolean }) => {
      const blockSize = Number(options.blockSize);
      if (!Number.isInteger(blockSize) || blockSize < 1 || blockSize > 100_000) throw new CliError(`--block-size "${options.blockSize}" must be a whole number from 1 to 100000`);
      await withRegister(options.db, 'cpreg sweep', async ({ ctx }, actor) => {
        const { sweep } = await import('../../register/sweep.ts');
        const tty = process.stderr.isTTY && !options.json;
        const summary = await sweep(ctx, { actor, reason: 'duplicate sweep' }, {
          blockSize,
          onProgress: (s) => {
            if (tty) process.stderr.write(`\rscanned ${s.scanned} counterparties, filed ${s.duplicateItems + s.affiliateItems} review items`);
          },
        });
        if (tty) process.stderr.write('\n');
        if (options.json) process.stdout.write(`${JSON.stringify(summary)}\n`);
        else
          process.stdout.write(
            `scanned ${summary.scanned} counterparties: filed ${summary.duplicateItems} duplicate and ${summary.affiliateItems} affiliate review items ` +
              `(skipped ${summary.skippedExisting} already filed, ${summary.skippedCannotLink} under a cannot-link)\n`,
          );
      });
    });
}
