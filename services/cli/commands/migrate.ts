/** `cpreg migrate [--db] [--json]`: brings the database schema up to date (harmless when it already is). */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP } from './serve.ts';

export default function register(program: Command): void {
  program
    .command('migrate')
    .description('apply the pending schema migrations (the service also does this when it starts)')
    .showHelpAfterError(true)
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the result as JSON')
    .action(async (options: { db?: string; json?: boolean }) => {
      const { openDatabase } = await import('../../../db/open-database.ts');
      const { migrateToLatest } = await import('../../../db/migrate.ts');
      const { DatabaseOpenError } = await import('../../../db/database-errors.ts');
      const { DatabaseLockedError } = await import('../../../db/lock.ts');
      let database;
      try {
        database = await openDatabase(options.db, { command: 'cpreg migrate' });
      } catch (error) {
        if (error instanceof DatabaseOpenError || error instanceof DatabaseLockedError) {
          throw new CliError(error.message, 1, { cause: error });
        }
        throw error;
      }
      try {
        const report = await migrateToLatest(database.db);
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
}
