/**
 * The pg client under a kysely transaction, for what kysely cannot send through it: COPY … FROM STDIN
 * (db/queries/copy-rows.ts). kysely lends one pooled client to a transaction without showing it, so the pool's
 * clients are kept here by their server process id (db/open-postgres.ts registers each database's pool), and a
 * transaction asks its own connection for that id: one round trip. The client is the transaction's own, so what
 * is sent on it is inside the transaction (rolled back with it, seen by its later statements).
 */
import { sql, type Kysely, type Transaction } from 'kysely';
import type { Pool, PoolClient } from 'pg';
import type { Database } from './types.ts';

/** Pool clients by server process id, per database (weakly held: a closed database is forgotten). */
const poolClients = new WeakMap<Kysely<Database>, Map<number, PoolClient>>();

/** pg sets processID on a connected client (the server's BackendKeyData); @types/pg does not declare it. */
const processIdOf = (client: PoolClient): number | undefined => (client as PoolClient & { processID?: number | null }).processID ?? undefined;

/** Keeps a pool's clients by process id from now on; `attach` ties them to the database built on the pool. */
export function trackPoolClients(pool: Pool): { attach(db: Kysely<Database>): void } {
  const clients = new Map<number, PoolClient>();
  pool.on('connect', (client) => {
    const pid = processIdOf(client);
    if (pid !== undefined) clients.set(pid, client);
  });
  pool.on('remove', (client) => {
    const pid = processIdOf(client);
    if (pid !== undefined && clients.get(pid) === client) clients.delete(pid);
  });
  return { attach: (db) => void poolClients.set(db, clients) };
}

/**
 * The pg client `trx` runs on, or undefined when `db` is not a tracked PostgreSQL pool (PGlite, or a kysely
 * instance derived from the opened one): the caller then takes its statement path.
 */
export async function transactionClient(db: Kysely<Database>, trx: Transaction<Database>): Promise<PoolClient | undefined> {
  const clients = poolClients.get(db);
  if (!clients) return undefined;
  const result = await sql<{ pid: number }>`SELECT pg_backend_pid() AS pid`.execute(trx);
  return clients.get(Number(result.rows[0]!.pid));
}
