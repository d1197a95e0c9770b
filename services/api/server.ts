/**
 * Runs the API as a long-lived service: opens the database (taking the embedded lock), migrates,
 * listens, and on SIGINT / SIGTERM closes the server (in-flight requests finish) and then the
 * database (releasing the lock). Used by `cpreg serve` and, until the demo lands, `cpreg demo`.
 */
import type { FastifyInstance } from 'fastify';
import pino from 'pino';
import { resolve as resolvePath } from 'node:path';
import { isPostgresUrl, keepAsTemplate, openDatabase, resolveTarget, type OpenedDatabase } from '../../db/open-database.ts';
import type { Jobs } from '../jobs/start-jobs.ts';
import { migrateToLatest } from '../../db/migrate.ts';
import { selectApiKeys } from '../../db/queries/api-keys.ts';
import { loggerOptions } from './logger.ts';
import { DEFAULT_DB_TIMEOUT_MS } from './types.ts';

export interface ServeOptions {
  db?: string;
  port: number;
  host: string;
  dbTimeoutMs?: number;
  logLevel?: string;
  command: string;
  /** One line for the person at the terminal (default: stdout). */
  say?: (line: string) => void;
  /** The address once listening (for --json). */
  onListening?: (info: { url: string; backend: string; database: string }) => void;
  /**
   * Job partitions this process runs at once besides serving (on PostgreSQL; 0: submit only, leave the work to
   * `cpreg worker` processes). The embedded database always runs its jobs here. Default 1.
   */
  workSlots?: number;
}

export interface RunningServer {
  app: FastifyInstance;
  database: OpenedDatabase;
  url: string;
  /** Resolves once the server has stopped (signal or stop()). */
  stopped: Promise<void>;
  stop(reason?: string): Promise<void>;
}

export class ListenError extends Error {}

export async function startServer(options: ServeOptions): Promise<RunningServer> {
  const say = options.say ?? ((line: string) => process.stdout.write(`${line}\n`));
  const dbTimeoutMs = options.dbTimeoutMs ?? DEFAULT_DB_TIMEOUT_MS;
  const logger = pino(loggerOptions(options.logLevel));
  // Opening the embedded database and loading the API take seconds: a line before the wait. (Not for PostgreSQL: a
  // server that cannot be reached is reported in one line, with nothing before it.)
  const target = resolveTarget(options.db);
  if (!isPostgresUrl(target)) say(`cpreg: opening the embedded database ${target} and loading the API`);
  // The API's modules (fastify, every route, the register, the job runner) load while the database opens: the
  // embedded engine compiles its WebAssembly on other threads meanwhile, and this thread would only wait.
  const modules = Promise.all([import('./app.ts'), import('../jobs/start-jobs.ts')]);
  modules.catch(() => undefined); // awaited below; when opening fails first, its error is the one reported
  const database = await openDatabase(options.db, {
    timeoutMs: dbTimeoutMs,
    command: options.command,
    onMessage: (line) => say(`cpreg: ${line}`),
    onPoolError: (error) => logger.warn({ err: error }, 'idle database connection lost; the pool reconnects on demand'),
  });
  // Never made silently: the serving line names the database, this one says it is new and empty.
  if (database.created) say(`cpreg: created a new empty database at ${resolvePath(database.description)}`);
  let app: FastifyInstance | undefined;
  let jobs: Jobs | undefined;
  try {
    const report = await migrateToLatest(database.db);
    if (report.applied.length > 0) say(`cpreg: applied ${report.applied.length} migration(s): ${report.applied.join(', ')}`);
    await keepAsTemplate(database);
    // Building the API (every route's schemas compiled) takes seconds on a small machine: a line before the wait.
    say(`cpreg: database open (${database.description}); starting the API`);
    const workSlots = options.workSlots ?? 1;
    const [{ buildApp }, { startJobs }] = await modules;
    jobs = await startJobs({
      db: database.db,
      backend: database.backend,
      url: resolveTarget(options.db),
      work: database.backend !== 'postgres' || workSlots > 0,
      concurrency: Math.max(1, workSlots),
      log: (level, fields, message) => logger[level](fields, message),
    });
    app = await buildApp({ db: database.db, backend: database.backend, dbTimeoutMs, logger, jobs });
    try {
      await app.listen({ port: options.port, host: options.host });
    } catch (error) {
      const code = (error as NodeJS.ErrnoException).code;
      if (code === 'EADDRINUSE') throw new ListenError(`port ${options.port} on ${options.host} is already in use; choose another --port`);
      if (code === 'EADDRNOTAVAIL') throw new ListenError(`cannot listen on ${options.host}: no such local address; check --host`);
      if (code === 'EACCES') throw new ListenError(`not allowed to listen on port ${options.port}; use a port above 1023`);
      throw error;
    }
  } catch (error) {
    await app?.close().catch(() => undefined);
    await jobs?.stop().catch(() => undefined);
    await database.close().catch(() => undefined);
    throw error;
  }

  const url = addressOf(app);
  let resolveStopped!: () => void;
  const stopped = new Promise<void>((resolve) => (resolveStopped = resolve));
  let stopping: Promise<void> | undefined;
  const stop = (reason = 'stop requested'): Promise<void> => {
    stopping ??= (async () => {
      process.off('SIGINT', onSignal);
      process.off('SIGTERM', onSignal);
      say(`cpreg: stopping (${reason})`);
      try {
        await app!.close();
        await jobs!.stop().catch((error: unknown) => logger.warn({ err: error }, 'the job queue did not stop cleanly'));
      } finally {
        await database.close();
        logger.flush?.();
        say(`cpreg: stopped; ${url} no longer answers and the database is closed`);
        resolveStopped();
      }
    })();
    return stopping;
  };
  const onSignal = (signal: NodeJS.Signals): void => {
    void stop(signal);
  };
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);

  say(`cpreg: serving ${url} (database: ${database.backend} ${database.description}; API reference at ${url}/docs)`);
  if ((await selectApiKeys(database.db)).length === 0) say(noKeyHint(database.backend, options.db));
  options.onListening?.({ url, backend: database.backend, database: database.description });
  return { app, database, url, stopped, stop };
}

/**
 * Every /v1 route needs a key, and a new database has none. On the embedded database `cpreg keys create` is refused
 * while this process holds the directory, so the way to the first key is said here, where the person looks.
 */
function noKeyHint(backend: string, db: string | undefined): string {
  const create = `cpreg keys create --scope admin --label "<role>"${db ? ` --db ${db}` : ''}`;
  return backend === 'pglite'
    ? `cpreg: no API key yet, and every /v1 route needs one: stop the service (Ctrl-C), run ${create}, and start it again (one process at a time holds an embedded database)`
    : `cpreg: no API key yet, and every /v1 route needs one: run ${create} (it prints the key once)`;
}

function addressOf(app: FastifyInstance): string {
  const address = app.server.address();
  if (address && typeof address === 'object') {
    const host = address.family === 'IPv6' ? `[${address.address}]` : address.address;
    return `http://${host}:${address.port}`;
  }
  return String(address);
}
