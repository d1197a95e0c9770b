/**
 * One entry point to the database, whatever runs it:
 * - PostgreSQL through `pg` when the target is a postgres:// or postgresql:// URL;
 * - embedded PGlite otherwise: a directory (default ./data/cpreg) or `memory:` (tests).
 * Everything above db/ sees the same Kysely<Database>; nothing backend-specific leaks out.
 */
import { existsSync, mkdirSync, readdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { Kysely, PostgresDialect, sql } from 'kysely';
import { PgliteDialect } from './pglite-dialect.ts';
import { plannerStartParams } from './planner-settings.ts';
import type { PGlite as PGliteClass } from '@electric-sql/pglite';
import type { PoolClient } from 'pg';
import type { Database } from './types.ts';
import { acquireDirectoryLock, LOCK_FILE_NAME, type DirectoryLock } from './lock.ts';
import { DatabaseOpenError, NoDatabaseError } from './database-errors.ts';

export type Backend = 'pglite' | 'postgres';

export const DEFAULT_DATA_DIR = './data/cpreg';
export const MEMORY_TARGET = 'memory:';
/** How long opening waits for PostgreSQL to accept a connection before saying it is unreachable. */
export const DEFAULT_CONNECT_TIMEOUT_MS = 5000;

export interface OpenDatabaseOptions {
  /**
   * The per-request database timeout (the service's --db-timeout): on PostgreSQL, both how long a
   * request waits for a pooled connection and the server-side statement_timeout. Unset: no
   * statement timeout (migrations, jobs and the CLI may run long statements).
   */
  timeoutMs?: number;
  /** PostgreSQL connection-pool size (default 10). */
  poolSize?: number;
  /** Recorded in the embedded lock file, shown to a second process that is refused. */
  command?: string;
  /** Told about a stale embedded lock taken over (default: one line on stderr). */
  onMessage?: (line: string) => void;
  /** PGlite only: start from this data-directory dump (tests use a migrated template). */
  loadDataDir?: Blob;
  /** Told when the pool reports an error on an idle PostgreSQL connection (default: ignored; the pool replaces it). */
  onPoolError?: (error: Error) => void;
  /**
   * Embedded only: whether a directory without a database may be made into a new empty one (default true).
   * False (read-only commands): such a directory is refused with NoDatabaseError and nothing is written.
   */
  create?: boolean;
  /**
   * Embedded only: load pg_trgm, fuzzystrmatch and unaccent (default true). Loading them is a third of the start
   * (about 0.8 s of 2); a command that only reads tables (no search, no writes to indexed names, no migration)
   * opens without them. Calling one of their functions then fails with "could not access file".
   */
  extensions?: boolean;
  /**
   * Embedded only: start the engine with a small buffer pool (16 MB instead of the cluster's 128 MB). The engine
   * zeroes its whole pool at every start, about 0.4 s of CPU for 128 MB; a command that opens, reads a little and
   * exits gains that. Writers keep the large pool: an ingest of 6,000 names took a quarter more CPU with the small one.
   */
  smallBufferPool?: boolean;
}

/** The buffer pool of a `smallBufferPool` start (see OpenDatabaseOptions). */
export const SMALL_BUFFER_POOL = '16MB';

export interface OpenedDatabase {
  db: Kysely<Database>;
  backend: Backend;
  /** What was opened, fit for messages: a URL without its password, a directory, or `memory:`. */
  description: string;
  /** True when this call made a new empty embedded database (the directory held none). */
  created: boolean;
  /** Embedded only: the new database was copied from the migrated template (db/embedded-template.ts). */
  fromTemplate?: boolean;
  close(): Promise<void>;
}

/** The target to use: the argument, else DATABASE_URL, else the embedded default directory. */
export function resolveTarget(target?: string): string {
  if (target && target.trim() !== '') return target;
  const fromEnv = process.env.DATABASE_URL;
  if (fromEnv && fromEnv.trim() !== '') return fromEnv;
  return DEFAULT_DATA_DIR;
}

export function isPostgresUrl(target: string): boolean {
  return /^postgres(?:ql)?:\/\//i.test(target);
}

export async function openDatabase(target?: string, options: OpenDatabaseOptions = {}): Promise<OpenedDatabase> {
  const resolved = resolveTarget(target);
  if (isPostgresUrl(resolved)) return openPostgres(resolved, options);
  return openPglite(resolved, options);
}

// ---------------------------------------------------------------- PostgreSQL

/** host:port of a PostgreSQL URL, for messages. */
export function describePostgresUrl(url: string): { host: string; port: number; database: string; safe: string } {
  const parsed = new URL(url);
  const host = parsed.hostname || 'localhost';
  const port = parsed.port ? Number(parsed.port) : 5432;
  const database = decodeURIComponent(parsed.pathname.replace(/^\//, '')) || parsed.username || 'postgres';
  if (parsed.password) parsed.password = '***';
  return { host, port, database, safe: parsed.toString() };
}

const INT8_OID = 20;

async function openPostgres(url: string, options: OpenDatabaseOptions): Promise<OpenedDatabase> {
  let where: ReturnType<typeof describePostgresUrl>;
  try {
    where = describePostgresUrl(url);
  } catch (error) {
    throw new DatabaseOpenError(`the database URL is not a valid URL: ${(error as Error).message}`, { cause: error });
  }
  const { default: pg } = await import('pg');
  // int8 (ids, counts) as a JS number, as PGlite answers it, so both backends give the same values;
  // ids stay far below 2^53. Set on this pool only, not on pg's global parsers.
  const types = {
    getTypeParser: ((oid: number, format?: 'text' | 'binary') =>
      oid === INT8_OID && format !== 'binary' ? (value: string) => Number(value) : pg.types.getTypeParser(oid, format)) as typeof pg.types.getTypeParser,
  };
  const pool = new pg.Pool({
    connectionString: url,
    max: options.poolSize ?? 10,
    connectionTimeoutMillis: options.timeoutMs ?? DEFAULT_CONNECT_TIMEOUT_MS,
    ...(options.timeoutMs ? { statement_timeout: options.timeoutMs, query_timeout: options.timeoutMs + QUERY_TIMEOUT_MARGIN_MS } : {}),
    application_name: 'cpreg',
    // Start parameters of each connection: no extra round trip (db/planner-settings.ts says why).
    options: plannerStartParams().join(' '),
    types,
  });
  // An idle client whose server went away emits 'error' on the pool; unhandled it would crash the
  // process. The pool drops that client and the next request reconnects (or answers 503).
  pool.on('error', (error) => options.onPoolError?.(error));
  // A client that is checked out has no pool listener: when its connection dies between queries (the server
  // went away, or dropOnReadTimeout closed it after a read timeout while the request still held it), the
  // client's own 'error' event would crash the process (seen under load in the database-faults test). The
  // failing query already answers the request; the pool drops the dead client when it comes back.
  pool.on('connect', (client) => client.on('error', (error) => options.onPoolError?.(error)));
  if (options.timeoutMs) pool.on('connect', dropOnReadTimeout);
  try {
    const client = await pool.connect();
    client.release();
  } catch (error) {
    await pool.end().catch(() => undefined);
    throw new DatabaseOpenError(explainConnectError(error, where), { cause: error });
  }
  const db = new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
  let closed = false;
  return {
    db,
    backend: 'postgres',
    description: where.safe,
    created: false,
    async close() {
      if (closed) return;
      closed = true;
      await db.destroy(); // ends the pool
    },
  };
}

/**
 * A server that hangs (frozen, or a network path that drops packets) never fires statement_timeout, so
 * the client gives up after query_timeout. The statement was sent and is not cancelled: such a connection
 * would go back to the pool with a query (or a transaction) still open, so it is closed instead; the
 * server rolls back whatever was open on it, and the pool opens a new connection when asked.
 */
const QUERY_TIMEOUT_MARGIN_MS = 500;

function dropOnReadTimeout(client: PoolClient): void {
  const query = client.query as (...args: unknown[]) => unknown;
  (client as unknown as { query: (...args: unknown[]) => unknown }).query = function (this: unknown, ...args: unknown[]) {
    const result = query.apply(this, args);
    if (result && typeof (result as Promise<unknown>).catch === 'function') {
      (result as Promise<unknown>).catch((error: unknown) => {
        if ((error as Error | undefined)?.message === 'Query read timeout') {
          (client as unknown as { connection?: { stream?: { destroy(): void } } }).connection?.stream?.destroy();
        }
      });
    }
    return result;
  };
}

function explainConnectError(error: unknown, where: { host: string; port: number; database: string }): string {
  const err = error as { code?: string; message?: string; errors?: Array<{ code?: string }> };
  const code = err.code ?? err.errors?.[0]?.code;
  const at = `PostgreSQL at ${where.host}:${where.port}`;
  const fix = 'check --db or DATABASE_URL';
  switch (code) {
    case 'ECONNREFUSED':
      return `cannot reach ${at}: connection refused (is the server running?); ${fix}`;
    case 'ENOTFOUND':
    case 'EAI_AGAIN':
      return `cannot reach ${at}: unknown host ${where.host}; ${fix}`;
    case '3D000':
      return `${at} has no database "${where.database}"; create it or ${fix}`;
    case '28P01':
    case '28000':
      return `${at} refused the login: ${err.message}; ${fix}`;
    default:
      if (/timeout/i.test(err.message ?? '')) return `cannot reach ${at}: no answer (connection timed out); ${fix}`;
      return `cannot reach ${at}: ${oneLine(err.message || code || 'unknown error')}; ${fix}`;
  }
}

function oneLine(text: string): string {
  return text.replace(/\s+/g, ' ').trim();
}

// ---------------------------------------------------------------- PGlite

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

async function openPglite(target: string, options: OpenDatabaseOptions): Promise<OpenedDatabase> {
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

/** Whether a directory holds a complete embedded database (a first start that was interrupted does not). */
export function holdsDatabase(dir: string): boolean {
  return existsSync(join(dir, 'PG_VERSION')) && !existsSync(join(dir, INIT_MARKER_NAME));
}

/**
 * Called with the lock held. Returns true when the directory holds no cluster yet (initdb will run):
 * marks it, after clearing what an interrupted earlier first start left.
 */
function prepareFirstStart(dir: string, onMessage?: (line: string) => void): boolean {
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

/**
 * Called once a database this process created is migrated (and before anything else is written to it): keeps it
 * as the template the next new embedded database is copied from. Does nothing on PostgreSQL, in memory, for a
 * database that was itself copied, or when the template exists; never fails the command.
 */
export async function keepAsTemplate(opened: OpenedDatabase): Promise<void> {
  if (opened.backend !== 'pglite' || !opened.created || opened.fromTemplate || opened.description === MEMORY_TARGET) return;
  const { saveTemplate, templateFile } = await import('./embedded-template.ts');
  const file = templateFile();
  if (!file || existsSync(file)) return;
  try {
    const dump = await dumpEmbedded(opened);
    saveTemplate(new Uint8Array(await dump.arrayBuffer()));
  } catch {
    // no template this time: the next new database is made the long way and tries again
  }
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
