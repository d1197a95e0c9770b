/**
 * The data directory of the embedded database: what may be opened as one (checkEmbeddedDirectory), whether it holds
 * a complete database (holdsDatabase), and the marker that tells an interrupted first start from a finished one.
 */
import { existsSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { LOCK_FILE_NAME } from './lock.ts';
import { DatabaseOpenError } from './database-errors.ts';

/**
 * Written into a new directory before PGlite's initdb and removed once the cluster is complete: a first
 * start that was interrupted (Ctrl-C, crash) is recognised by it and initialised again, instead of
 * leaving a half-made cluster that refuses to open.
 */
export const INIT_MARKER_NAME = 'cpreg.initialising';

/** Refuses a directory that holds something other than a PGlite cluster; never writes to it. */
export function checkEmbeddedDirectory(dir: string): void {
  if (!existsSync(dir)) return;
  if (!statSync(dir).isDirectory()) {
    throw new DatabaseOpenError(`${dir} is a file, not a database directory; point --db at a directory`);
  }
  const entries = readdirSync(dir).filter((name) => name !== LOCK_FILE_NAME);
  if (entries.includes(INIT_MARKER_NAME)) return; // our own interrupted first start
  if (entries.length > 0 && !entries.includes('PG_VERSION')) {
    throw new DatabaseOpenError(
      `${dir} is not an embedded cpreg database (it is not empty and has no PG_VERSION); ` + `nothing was changed: point --db at an empty or new directory`,
    );
  }
}

/** Whether a directory holds a complete embedded database (a first start that was interrupted does not). */
export function holdsDatabase(dir: string): boolean {
  return existsSync(join(dir, 'PG_VERSION')) && !existsSync(join(dir, INIT_MARKER_NAME));
}

/**
 * Called with the lock held. Returns true when the directory holds no cluster yet (initdb will run):
 * marks it, after clearing what an interrupted earlier first start left.
 */
export function prepareFirstStart(dir: string, onMessage?: (line: string) => void): boolean {
  const entries = readdirSync(dir).filter((name) => name !== LOCK_FILE_NAME);
  if (entries.includes(INIT_MARKER_NAME)) {
    (onMessage ?? ((line: string) => process.stderr.write(`cpreg: ${line}\n`)))(
      `the first start of ${dir} was interrupted before the database was complete; creating it again`,
    );
    for (const name of entries) if (name !== INIT_MARKER_NAME) rmSync(join(dir, name), { recursive: true, force: true });
  } else if (entries.includes('PG_VERSION')) {
    return false;
  }
  writeFileSync(join(dir, INIT_MARKER_NAME), `initdb started ${new Date().toISOString()} by process ${process.pid}\n`);
  return true;
}
