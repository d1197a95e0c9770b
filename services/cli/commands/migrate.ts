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
}
