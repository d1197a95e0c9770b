/**
 * `cpreg reresolve`: after thresholds or weights change, resolve again every mention that no person confirmed.
 * Every change is a history event; unchanged mentions are left untouched.
 */
import type { Command } from 'commander';
import { DB_OPTION_HELP } from './serve.ts';
import { withRegister } from './own-entities.ts';

export default function register(program: Command): void {
  program
    .command('reresolve')
    .description('resolve again every mention no person confirmed (after thresholds or weights change)')
    .option('--reason <text>', 'why (kept in the history of every change)')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the summary as JSON')
    .showHelpAfterError(true)
    .action(async (options: { reason?: string; db?: string; json?: boolean }) => {
      await withRegister(options.db, 'cpreg reresolve', 'writes', async ({ ctx }, actor) => {
        const { reresolve } = await import('../../register/reresolve.ts');
        const tty = process.stderr.isTTY && !options.json;
        const summary = await reresolve(
          ctx,
          { actor, reason: options.reason ?? 'reresolve' },
          {
            onProgress: (s) => {
              if (tty) process.stderr.write(`\rexamined ${s.examined}, changed ${s.changed}, failed ${s.failed}`);
            },
          },
        );
        if (tty) process.stderr.write('\n');
        if (options.json) process.stdout.write(`${JSON.stringify(summary)}\n`);
        else {
          process.stdout.write(`examined ${summary.examined} mentions: ${summary.changed} changed, ${summary.unchanged} unchanged, ${summary.failed} failed\n`);
          for (const [status, n] of Object.entries(summary.byStatus)) process.stdout.write(`  now ${status}: ${n}\n`);
          for (const e of summary.errors) process.stdout.write(`  mention ${e.mentionId}: ${e.message}\n`);
        }
        if (summary.failed > 0) process.exitCode = 1;
      });
    });
}
