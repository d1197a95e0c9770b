/** `cpreg backup --out <file>`: the embedded database as one archive (PostgreSQL: pg_dump, see docs/operations.md). */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP } from './serve.ts';

export default function register(program: Command): void {
  program
    .command('backup')
    .description('write the embedded database to one archive file (stop the service first: it holds the database)')
    .requiredOption('--out <file>', 'the archive to write')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--json', 'print the result as JSON')
    .showHelpAfterError(true)
    .action(async (options: { out: string; db?: string; json?: boolean }) => {
      const { backupEmbedded, BackupError } = await import('../../backup/backup.ts');
      const { DatabaseOpenError } = await import('../../../db/database-errors.ts');
      const { DatabaseLockedError } = await import('../../../db/lock.ts');
      try {
        const result = await backupEmbedded(options.db, options.out);
        process.stdout.write(options.json ? `${JSON.stringify(result)}\n` : `backed up ${result.source} to ${result.file} (${result.bytes} bytes)\n`);
      } catch (error) {
        if (error instanceof BackupError || error instanceof DatabaseOpenError || error instanceof DatabaseLockedError)
          throw new CliError(error.message, 1, { cause: error });
        throw error;
      }
    });
}
