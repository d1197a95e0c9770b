/** `cpreg restore <file>`: an archive made by `cpreg backup` back into an embedded database directory. */
import type { Command } from 'commander';
import { CliError } from '../cli-error.ts';
import { DB_OPTION_HELP } from './serve.ts';

export default function register(program: Command): void {
  program
    .command('restore')
    .description('restore an archive made by cpreg backup into an embedded database directory (refuses a non-empty one without --force)')
    .argument('<file>', 'the archive to restore')
    .option('--db <target>', DB_OPTION_HELP)
    .option('--force', 'replace a database that is already there')
    .option('--json', 'print the result as JSON')
    .showHelpAfterError(true)
    .action(async (file: string, options: { db?: string; force?: boolean; json?: boolean }) => {
      const { restoreEmbedded, BackupError } = await import('../../backup/backup.ts');
      const { DatabaseOpenError } = await import('../../../db/database-errors.ts');
      const { DatabaseLockedError } = await import('../../../db/lock.ts');
      try {
        const result = await restoreEmbedded(file, options.db, { force: options.force ?? false });
        process.stdout.write(
          options.json
            ? `${JSON.stringify(result)}\n`
            : `restored ${file} into ${result.target}${result.replaced ? ' (replacing the database that was there)' : ''}\n`,
        );
      } catch (error) {
        if (error instanceof BackupError || error instanceof DatabaseOpenError || error instanceof DatabaseLockedError)
          throw new CliError(error.message, 1, { cause: error });
        throw error;
      }
    });
}
