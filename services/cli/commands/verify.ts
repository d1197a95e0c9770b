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
      const { openCommandDatabase } = await import('../open-command-database.ts');
      const { verifyRegister, formatVerifyReport } = await import('../../verify/verify.ts');
      // Read-only: refuses a directory without a database, and checks the schema as it is (no migration).
      const opened = await openCommandDatabase(options.db, 'cpreg verify', { writes: false, migrate: false });
      try {
        const report = await verifyRegister(opened.db, { replay: options.replay, listLimit: limit });
        process.stdout.write(options.json ? `${JSON.stringify(report)}\n` : `${formatVerifyReport(report)}\n`);
        if (!report.ok) process.exitCode = 1;
      } finally {
        await opened.close();
      }
    });
}
