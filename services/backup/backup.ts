/**
 * Backup and restore of the embedded database: the whole PGlite data directory as one gzip-compressed
 * archive (PGlite's own dumpDataDir, loaded back with loadDataDir), taken while this process holds the
 * directory's lock, so no other process writes meanwhile. Restore writes into a new sibling directory,
 * checks that it opens, then swaps it in: an interrupted restore never leaves a half-written target.
 * PostgreSQL is backed up with its own tools (pg_dump / pg_restore; see docs/operations.md).
 */
import { existsSync, readdirSync, readFileSync, renameSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { gunzipSync, gzipSync } from 'node:zlib';
import { dumpEmbedded, isPostgresUrl, openDatabase, resolveTarget } from '../../db/open-database.ts';
import { acquireDirectoryLock, LOCK_FILE_NAME } from '../../db/lock.ts';

export class BackupError extends Error {
  constructor(message: string, options?: { cause?: unknown }) {
    super(message, options);
    this.name = 'BackupError';
  }
}

export const PG_DUMP_HINT =
  'PostgreSQL is backed up with its own tools: pg_dump --format=custom --file=<file> <url>, and restored with pg_restore --clean --if-exists --dbname=<url> <file> (see docs/operations.md)';

export interface BackupResult {
  file: string;
  bytes: number;
  source: string;
}

/** Writes the embedded database `target` (a directory) to `outFile`. */
export async function backupEmbedded(target: string | undefined, outFile: string): Promise<BackupResult> {
  const resolved = resolveTarget(target);
  if (isPostgresUrl(resolved)) throw new BackupError(PG_DUMP_HINT);
  if (resolved === 'memory:') throw new BackupError('an in-memory database has nothing to back up; point --db at a directory');
  if (!existsSync(join(resolved, 'PG_VERSION'))) throw new BackupError(`${resolved} holds no embedded cpreg database (no PG_VERSION)`);
  const opened = await openDatabase(resolved, { command: 'cpreg backup' });
  let archive: Buffer;
  try {
    const blob = await dumpEmbedded(opened);
    archive = gzipSync(Buffer.from(await blob.arrayBuffer()));
  } finally {
    await opened.close();
  }
  // Written beside, then renamed: a backup file is either complete or absent.
  const partial = `${outFile}.partial-${process.pid}`;
  writeFileSync(partial, archive);
  renameSync(partial, outFile);
  return { file: outFile, bytes: archive.length, source: resolved };
}

export interface RestoreResult {
  target: string;
  bytes: number;
  replaced: boolean;
}

function isEmptyDir(dir: string): boolean {
  return readdirSync(dir).filter((n) => n !== LOCK_FILE_NAME).length === 0;
}

/** Restores `file` into the embedded directory `target`; refuses a non-empty target unless `force`. */
export async function restoreEmbedded(file: string, target: string | undefined, options: { force?: boolean } = {}): Promise<RestoreResult> {
  const resolved = resolveTarget(target);
  if (isPostgresUrl(resolved)) throw new BackupError(PG_DUMP_HINT);
  if (resolved === 'memory:') throw new BackupError('restore needs a directory for --db');
  const dir = resolve(resolved);
  if (!existsSync(file)) throw new BackupError(`backup file ${file} does not exist`);
  let tar: Buffer;
  try {
    tar = gunzipSync(readFileSync(file));
  } catch (error) {
    throw new BackupError(`${file} is not a cpreg backup (not gzip-compressed): ${(error as Error).message}`, { cause: error });
  }
  const exists = existsSync(dir);
  if (exists && !statSync(dir).isDirectory()) throw new BackupError(`${dir} is a file, not a database directory`);
  const occupied = exists && !isEmptyDir(dir);
  if (occupied && !options.force) {
    throw new BackupError(`${dir} is not empty: restore refuses to overwrite a database; pass --force to replace it, or restore into a new directory`);
  }
  // Nobody may hold the target while it is replaced (a running serve is refused here, by the lock).
  const lock = exists ? acquireDirectoryLock(dir, { command: 'cpreg restore' }) : undefined;
  const staging = join(dirname(dir), `.${basename(dir)}.restoring-${process.pid}`);
  rmSync(staging, { recursive: true, force: true });
  try {
    const opened = await openDatabase(staging, { command: 'cpreg restore', loadDataDir: new Blob([new Uint8Array(tar)]) });
    await opened.close(); // opened once: the archive is a database PGlite accepts
    if (exists) {
      const old = join(dirname(dir), `.${basename(dir)}.replaced-${process.pid}`);
      lock!.release();
      renameSync(dir, old);
      renameSync(staging, dir);
      rmSync(old, { recursive: true, force: true });
    } else {
      renameSync(staging, dir);
    }
  } catch (error) {
    lock?.release();
    rmSync(staging, { recursive: true, force: true });
    if (error instanceof BackupError) throw error;
    throw new BackupError(`cannot restore ${file}: ${(error as Error).message}`, { cause: error });
  }
  return { target: dir, bytes: tar.length, replaced: occupied };
}
