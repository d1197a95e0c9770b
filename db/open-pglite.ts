/**
 * Opens the embedded PGlite engine (see db/open-database.ts) in a directory or in memory: the directory locked, a
 * new one copied from the migrated template when there is one, the extensions loaded unless the command needs none.
 */
import { mkdirSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { Kysely, sql } from 'kysely';
import { PgliteDialect } from './pglite-dialect.ts';
import { plannerStartParams } from './planner-settings.ts';
import type { PGlite as PGliteClass } from '@electric-sql/pglite';
import type { Database } from './types.ts';
import { acquireDirectoryLock, type DirectoryLock } from './lock.ts';
import { DatabaseOpenError, NoDatabaseError } from './database-errors.ts';
import { checkEmbeddedDirectory, holdsDatabase, INIT_MARKER_NAME, prepareFirstStart } from './embedded-directory.ts';
import type { OpenDatabaseOptions, OpenedDatabase } from './opened-database.ts';

export const MEMORY_TARGET = 'memory:';

/** The buffer pool of a `smallBufferPool` start (see OpenDatabaseOptions). */
export const SMALL_BUFFER_POOL = '16MB';

async function loadPglite(
  withExtensions: boolean,
  smallBufferPool: boolean,
): Promise<{ create: (dir: string | undefined, loadDataDir?: Blob) => Promise<PGliteLike> }> {
  const [{ PGlite }, extensions] = await Promise.all([import('@electric-sql/pglite'), withExtensions ? loadExtensions() : undefined]);
  return {
    create: async (dir, loadDataDir) =>
      PGlite.create({
        ...(dir ? { dataDir: dir } : {}),
        ...(loadDataDir ? { loadDataDir } : {}),
        // Loaded here; CREATE EXTENSION IF NOT EXISTS in the migrations then enables them.
        ...(extensions ? { extensions } : {}),
        // The engine's own start parameters, plus a setting for this start only (the cluster's file is untouched).
        startParams: [...PGlite.defaultStartParams, ...plannerStartParams(), ...(smallBufferPool ? ['-c', `shared_buffers=${SMALL_BUFFER_POOL}`] : [])],
      }),
  };
}

async function loadExtensions() {
  const [{ pg_trgm }, { fuzzystrmatch }, { unaccent }] = await Promise.all([
    import('@electric-sql/pglite/contrib/pg_trgm'),
    import('@electric-sql/pglite/contrib/fuzzystrmatch'),
    import('@electric-sql/pglite/contrib/unaccent'),
  ]);
  return { pg_trgm, fuzzystrmatch, unaccent };
}

const PGLITE_HANDLES = new WeakMap<Kysely<Database>, PGliteLike>();

type PGliteLike = Awaited<ReturnType<typeof PGliteClass.create>>;

export async function openPglite(target: string, options: OpenDatabaseOptions): Promise<OpenedDatabase> {
  const memory = target === MEMORY_TARGET;
  const dir = memory ? undefined : resolve(target);
  let lock: DirectoryLock | undefined;
  if (dir) {
    checkEmbeddedDirectory(dir);
    if (options.create === false && !holdsDatabase(dir)) throw new NoDatabaseError(target);
    mkdirSync(dir, { recursive: true });
    lock = acquireDirectoryLock(dir, { command: options.command, onMessage: options.onMessage });
  }
  let pglite: PGliteLike;
  let fresh = false;
  let fromTemplate = false;
  try {
    if (dir) fresh = prepareFirstStart(dir, options.onMessage);
    // A copy of the migrated template when there is one (seconds faster than initdb and the migrations).
    if (dir && fresh && !options.loadDataDir) {
      const { copyTemplateInto, hasTemplate } = await import('./embedded-template.ts');
      // Said before the copy and the engine's start (seconds together), so that the command is not silent meanwhile.
      if (hasTemplate()) {
        options.onMessage?.(`creating a new empty database in ${dir} (a copy of the migrated template)`);
        fromTemplate = copyTemplateInto(dir);
      }
    }
    // The embedded engine's first start (initdb) takes several seconds: say so before, not only after.
    if (fresh && !fromTemplate && !options.loadDataDir) options.onMessage?.(`creating a new empty database in ${dir} (its first start takes several seconds)`);
    // A new cluster always gets them: its first migration enables them.
    const { create } = await loadPglite(options.extensions !== false || fresh, options.smallBufferPool === true && !fresh);
    pglite = await create(dir, options.loadDataDir);
    if (dir && fresh) {
      await pglite.syncToFs();
      rmSync(join(dir, INIT_MARKER_NAME), { force: true });
    }
  } catch (error) {
    lock?.release();
    throw new DatabaseOpenError(`cannot open the embedded database ${target}: ${(error as Error).message}`, {
      cause: error,
    });
  }
  const db = new Kysely<Database>({ dialect: new PgliteDialect(pglite) });
  PGLITE_HANDLES.set(db, pglite);
  try {
    await sql`select 1`.execute(db);
  } catch (error) {
    await pglite.close().catch(() => undefined);
    lock?.release();
    throw new DatabaseOpenError(`cannot open the embedded database ${target}: ${(error as Error).message}`, {
      cause: error,
    });
  }
  let closed = false;
  return {
    db,
    backend: 'pglite',
    description: memory ? MEMORY_TARGET : target,
    created: fresh,
    fromTemplate,
    async close() {
      if (closed) return;
      closed = true;
      try {
        await db.destroy();
        if (!pglite.closed) await pglite.close();
      } finally {
        lock?.release();
      }
    },
  };
}

/** PGlite only: a dump of the data directory (tests copy a migrated template from it). */
export async function dumpEmbedded(opened: OpenedDatabase): Promise<Blob> {
  if (opened.backend !== 'pglite') throw new Error('dumpEmbedded works on the embedded database only');
  const pglite = pgliteOf(opened);
  return pglite.dumpDataDir('none');
}

function pgliteOf(opened: OpenedDatabase): PGliteLike {
  const handle = PGLITE_HANDLES.get(opened.db);
  if (!handle) throw new Error('no PGlite handle for this database');
  return handle;
}
