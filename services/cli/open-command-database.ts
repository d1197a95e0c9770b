/**
 * How every command opens its database, so that one rule holds everywhere: `--db`, else DATABASE_URL, else
 * ./data/cpreg (the demo's directory too). A command that writes says on stderr which database it opened; a
 * new empty database is never made silently ("created a new empty database at …"), and a command that only
 * reads refuses a directory that holds no database instead of making one.
 */
import { resolve } from 'node:path';
import type { OpenedDatabase } from '../../db/open-database.ts';
import { CliError } from './cli-error.ts';

export interface CommandDatabaseOptions {
  /** The command writes (or may write): it may create a new empty database and names the one it opened. */
  writes: boolean;
  /** Bring the schema up to date after opening (default true). */
  migrate?: boolean;
  /**
   * A reading command that matches names (cpreg reconcile): the candidate lookup ranks by trigram similarity
   * (db/queries/candidate-rank.ts), so the embedded database is opened with its search extensions.
   */
  matches?: boolean;
  /** Where the lines go (default stderr). */
  say?: (line: string) => void;
}

/** Where a command's database comes from, in words, for the line that names it. */
export function targetOrigin(given: string | undefined): string {
  if (given && given.trim() !== '') return 'from --db';
  const fromEnv = process.env.DATABASE_URL;
  if (fromEnv && fromEnv.trim() !== '') return 'from DATABASE_URL';
  return 'the default';
}

/** The line a writing command prints: which database, what kind, and why that one. */
export function openedLine(opened: OpenedDatabase, given: string | undefined): string {
  if (opened.created) return `cpreg: created a new empty database at ${resolve(opened.description)}`;
  const kind = opened.backend === 'postgres' ? 'PostgreSQL' : 'embedded';
  return `cpreg: database ${opened.description} (${kind}; ${targetOrigin(given)})`;
}

export async function openCommandDatabase(given: string | undefined, command: string, options: CommandDatabaseOptions): Promise<OpenedDatabase> {
  const say = options.say ?? ((line: string) => void process.stderr.write(`${line}\n`));
  // A command that only reads opens the embedded database without its search extensions (a third of the start) and
  // with a small buffer pool; should the schema need a migration, it is opened again as a writer and migrated.
  if (!options.writes && options.migrate !== false) {
    const opened = await openOrExplain(given, command, { writes: false, extensions: options.matches === true, smallBufferPool: true }, say);
    const { schemaState } = await import('../../db/migrate.ts');
    if ((await schemaState(opened.db)).upToDate) return opened;
    await opened.close();
  }
  return openAndMigrate(given, command, options, say);
}

async function openAndMigrate(
  given: string | undefined,
  command: string,
  options: CommandDatabaseOptions,
  say: (line: string) => void,
): Promise<OpenedDatabase> {
  const opened = await openOrExplain(given, command, { writes: options.writes, extensions: true }, say);
  if (options.writes || opened.created) say(openedLine(opened, given));
  if (options.migrate === false) return opened;
  try {
    const { migrateToLatest } = await import('../../db/migrate.ts');
    await migrateToLatest(opened.db);
    // A database made the long way becomes the template the next new one is copied from (seconds faster).
    const { keepAsTemplate } = await import('../../db/open-database.ts');
    await keepAsTemplate(opened);
  } catch (error) {
    await opened.close();
    throw new CliError((error as Error).message, 1, { cause: error });
  }
  return opened;
}

/** Opens, turning the database's refusals into one-line CLI errors (no database here, locked, unreachable). */
async function openOrExplain(
  given: string | undefined,
  command: string,
  how: { writes: boolean; extensions: boolean; smallBufferPool?: boolean },
  say: (line: string) => void,
): Promise<OpenedDatabase> {
  const { openDatabase, resolveTarget } = await import('../../db/open-database.ts');
  const { DatabaseOpenError, NoDatabaseError } = await import('../../db/database-errors.ts');
  const { DatabaseLockedError } = await import('../../db/lock.ts');
  try {
    return await openDatabase(given, {
      command,
      create: how.writes,
      extensions: how.extensions,
      smallBufferPool: how.smallBufferPool === true,
      onMessage: (line) => say(`cpreg: ${line}`),
    });
  } catch (error) {
    if (error instanceof NoDatabaseError) {
      throw new CliError(
        `there is no database at ${resolveTarget(given)} (${targetOrigin(given)}); nothing was created. ` +
          'Build the demo there with `npm start`, create an empty one with `cpreg migrate`, or name another with --db',
        1,
        { cause: error },
      );
    }
    if (error instanceof DatabaseOpenError || error instanceof DatabaseLockedError) throw new CliError(error.message, 1, { cause: error });
    throw error;
  }
}
