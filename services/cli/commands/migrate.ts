/**
 * `cpreg migrate [--db] [--json]`: brings the database schema up to date (harmless when it already is).
 * `cpreg migrate reanalyse [--db] [--json]`: the data step after a new analysis version: rewrites the stored
 * analyses and blocking keys of stale names (services/register/reanalyse-names.ts; `cpreg verify` lists them).
 */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP } from './serve.ts';

export default function register(program: Command): void {
  const migrate = program
    .command('migrate')
    .description('apply the pending schema migrations (the service also does this when it starts)')
    .showHelpAfterError(true)
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the result as JSON')
    .action(async (options: { db?: string; json?: boolean }) => {
      const { openCommandDatabase } = await import('../open-command-database.ts');
      const { migrateToLatest } = await import('../../../db/migrate.ts');
      const database = await openCommandDatabase(options.db, 'cpreg migrate', { writes: true, migrate: false });
      try {
        const report = await migrateToLatest(database.db);
        const { keepAsTemplate } = await import('../../../db/open-database.ts');
        await keepAsTemplate(database);
        if (options.json) {
          const out = { database: database.description, backend: database.backend, ...report };
          process.stdout.write(`${JSON.stringify(out)}\n`);
        } else if (report.applied.length === 0) {
          process.stdout.write(`${database.description}: up to date (${report.all.length} migrations applied earlier)\n`);
        } else {
          process.stdout.write(`${database.description}: applied ${report.applied.length} migration(s):\n`);
          for (const name of report.applied) process.stdout.write(`  ${name}\n`);
        }
      } catch (error) {
        throw new CliError((error as Error).message, 1, { cause: error });
      } finally {
        await database.close();
      }
    });
  registerReanalyse(migrate);
}

function registerReanalyse(migrate: Command): void {
  migrate
    .command('reanalyse')
    .description('rewrite the stored analysis and blocking keys of every name analysed by an older analysis version (in chunks; safe to stop and run again)')
    .showHelpAfterError(true)
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the result as JSON')
    .action(async (options: { db?: string; json?: boolean }, command: Command) => {
      // --db and --json may have been read by `migrate` itself when given before the subcommand's name.
      const parent = command.parent?.opts<{ db?: string; json?: boolean }>() ?? {};
      const db = options.db ?? parent.db;
      const json = options.json ?? parent.json;
      const { openCommandDatabase } = await import('../open-command-database.ts');
      const { reanalyseNames } = await import('../../register/reanalyse-names.ts');
      const { createRegisterContext } = await import('../../register/context.ts');
      const database = await openCommandDatabase(db, 'cpreg migrate reanalyse', { writes: true });
      try {
        const result = await reanalyseNames(createRegisterContext(database.db), {
          progress: json ? undefined : (names) => process.stderr.write(`reanalysed ${names.toLocaleString('en-US')} names\r`),
        });
        if (json) process.stdout.write(`${JSON.stringify({ database: database.description, ...result })}\n`);
        else
          process.stdout.write(
            `${database.description}: ${result.names.toLocaleString('en-US')} stale name(s) analysed again (analysis version ${result.version}), their blocking keys rewritten\n`,
          );
      } finally {
        await database.close();
      }
    });
}
