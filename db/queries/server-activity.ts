/**
 * Which server processes serve a database (pg_stat_activity), for measuring their CPU from outside: the scale-out
 * bench follows the backends of its database and leaves out its own connection. PostgreSQL only.
 */
import { sql } from 'kysely';
import type { Queryable } from './util.ts';

/** The process id of the server backend that answers this connection. */
export async function ownBackendPid(db: Queryable): Promise<number> {
  const result = await sql<{ pid: number }>`SELECT pg_backend_pid() AS pid`.execute(db);
  return Number(result.rows[0]!.pid);
}

/** The process ids of the backends connected to `database`, except `exceptPid`. */
export async function backendPids(db: Queryable, database: string, exceptPid: number): Promise<number[]> {
  const result = await sql<{ pid: number }>`SELECT pid FROM pg_stat_activity WHERE datname = ${database} AND pid <> ${exceptPid}`.execute(db);
  return result.rows.map((r) => Number(r.pid));
}
