/**
 * Opens PostgreSQL through `pg` (see db/open-database.ts): one pool, int8 read as a number as PGlite answers it,
 * the per-request timeout as the server's statement_timeout, and a connection that stops answering dropped.
 */
import { Kysely, PostgresDialect } from 'kysely';
import type { PoolClient } from 'pg';
import type { Database } from './types.ts';
import { DatabaseOpenError } from './database-errors.ts';
import { withPlannerOptions } from './planner-settings.ts';
import { explainConnectError } from './explain-connect-error.ts';
import { trackPoolClients } from './transaction-client.ts';
import type { OpenDatabaseOptions, OpenedDatabase } from './opened-database.ts';

/** How long opening waits for PostgreSQL to accept a connection before saying it is unreachable. */
export const DEFAULT_CONNECT_TIMEOUT_MS = 5000;

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

export async function openPostgres(url: string, options: OpenDatabaseOptions): Promise<OpenedDatabase> {
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
    // Start parameters of each connection, in the URL: no extra round trip (db/planner-settings.ts says why).
    connectionString: withPlannerOptions(url),
    max: options.poolSize ?? 10,
    connectionTimeoutMillis: options.timeoutMs ?? DEFAULT_CONNECT_TIMEOUT_MS,
    ...(options.timeoutMs ? { statement_timeout: options.timeoutMs, query_timeout: options.timeoutMs + QUERY_TIMEOUT_MARGIN_MS } : {}),
    application_name: 'cpreg',
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
  // COPY … FROM STDIN goes to the client under a transaction, which kysely does not show (db/transaction-client.ts).
  const tracked = trackPoolClients(pool);
  try {
    const client = await pool.connect();
    client.release();
  } catch (error) {
    await pool.end().catch(() => undefined);
    throw new DatabaseOpenError(explainConnectError(error, where), { cause: error });
  }
  const db = new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
  tracked.attach(db);
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
