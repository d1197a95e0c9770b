/**
 * `cpreg sweep [--as-job [--partition-size 2000] [--no-wait]]`: scan the register in blocks for counterparties that look like one entity and file review items
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
    .option('--as-job', 'run as a partitioned job: on PostgreSQL `cpreg worker` processes sweep the partitions')
    .option('--partition-size <n>', 'with --as-job: counterparties per partition', '2000')
    .option('--no-wait', 'with --as-job: print the job id and return at once')
    .showHelpAfterError(true)
    .action(async (options: { blockSize: string; db?: string; json?: boolean; asJob?: boolean; partitionSize: string; wait: boolean }) => {
      const blockSize = Number(options.blockSize);
      if (!Number.isInteger(blockSize) || blockSize < 1 || blockSize > 100_000)
        throw new CliError(`--block-size "${options.blockSize}" must be a whole number from 1 to 100000`);
      if (options.asJob) {
        const partitionSize = Number(options.partitionSize);
        if (!Number.isInteger(partitionSize) || partitionSize < 1 || partitionSize > 1_000_000)
          throw new CliError(`--partition-size "${options.partitionSize}" must be a whole number from 1 to 1000000`);
        const { cliActor } = await import('../../ingest/cli-support.ts');
        const { submitSweepJob } = await import('../../jobs/steps.ts');
        const { submitAndFollow } = await import('./jobs.ts');
        await submitAndFollow(options.db, 'cpreg sweep', { json: options.json, wait: options.wait, label: 'sweep' }, (deps) =>
          submitSweepJob(deps, { actor: cliActor(), partitionSize }),
        );
        return;
      }
      await withRegister(options.db, 'cpreg sweep', 'writes', async ({ ctx }, actor) => {
        const { sweep } = await import('../../register/sweep.ts');
        const { countOf } = await import('../../ingest/cli-support.ts');
        const tty = process.stderr.isTTY && !options.json;
        const summary = await sweep(
          ctx,
          { actor, reason: 'duplicate sweep' },
          {
            blockSize,
            onProgress: (s) => {
              if (tty)
                process.stderr.write(`\rscanned ${countOf(s.scanned, 'counterparty')}, filed ${countOf(s.duplicateItems + s.affiliateItems, 'review item')}`);
            },
          },
        );
        if (tty) process.stderr.write('\n');
        if (options.json) process.stdout.write(`${JSON.stringify(summary)}\n`);
        else
          process.stdout.write(
            `scanned ${countOf(summary.scanned, 'counterparty')}: filed ${countOf(summary.duplicateItems, 'duplicate review item')} and ` +
              `${countOf(summary.affiliateItems, 'affiliate review item')} ` +
              `(skipped ${summary.skippedExisting.toLocaleString('en-US')} already filed, ${summary.skippedCannotLink.toLocaleString('en-US')} under a cannot-link)\n`,
          );
      });
    });
}
