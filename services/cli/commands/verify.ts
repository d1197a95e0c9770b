/**
 * `cpreg verify`: checks the register's invariants and that its history replays into it; lists each
 * violation with its ids and exits 1 when anything is wrong (0 when the register is sound).
 */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP } from './serve.ts';

export default function register(program: Command): void {
  program
    .command('verify')
    .description('check the register invariants and replay the history from empty; exit 1 on any violation')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the report as JSON')
    .option('--no-replay', 'skip the history replay (the quick invariant checks only)')
    .option('--limit <n>', 'violations listed per check', '100')
    .showHelpAfterError(true)
    .action(async (options: { db?: string; json?: boolean; replay: boolean; limit: string }) => {
      const limit = Number(options.limit);
      if (!Number.isInteger(limit) || limit < 0 || limit > 1_000_000) throw new CliError(`--limit "${options.limit}" must be a whole number from 0 to 1000000`);
      const { openDatabase } = await import('../../../db/open-database.ts');
      const { DatabaseOpenError } = await import('../../../db/database-errors.ts');
      const { DatabaseLockedError } = await import('../../../db/lock.ts');
      const { verifyRegister, formatVerifyReport } = await import('../../verify/verify.ts');
      let opened;
      try {
        opened = await openDatabase(options.db, { command: 'cpreg verify' });
      } catch (error) {
        if (error instanceof DatabaseOpenError || error instanceof DatabaseLockedError) throw new CliError(error.message, 1, { cause: error });
        throw error;
      }
      try {
        const report = await verifyRegister(opened.db, { replay: options.replay, listLimit: limit });
        process.stdout.write(options.json ? `${JSON.stringify(report)}\n` : `${formatVerifyReport(report)}\n`);
        if (!report.ok) process.exitCode = 1;
      } finally {
        await opened.close();
      }
    });
}
