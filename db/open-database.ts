/**
 * One entry point to the database, whatever runs it:
 * - PostgreSQL through `pg` when the target is a postgres:// or postgresql:// URL;
 * - embedded PGlite otherwise: a directory (default ./data/cpreg) or `memory:` (tests).
 * Everything above db/ sees the same Kysely<Database>; nothing backend-specific leaks out.
 */
import { openPglite } from './open-pglite.ts';
import { openPostgres } from './open-postgres.ts';
import type { OpenDatabaseOptions, OpenedDatabase } from './opened-database.ts';

export type { Backend, OpenDatabaseOptions, OpenedDatabase } from './opened-database.ts';
export { DEFAULT_CONNECT_TIMEOUT_MS, describePostgresUrl } from './open-postgres.ts';
export { dumpEmbedded, MEMORY_TARGET, SMALL_BUFFER_POOL } from './open-pglite.ts';
export { checkEmbeddedDirectory, holdsDatabase, INIT_MARKER_NAME } from './embedded-directory.ts';
export { keepAsTemplate } from './keep-as-template.ts';

export const DEFAULT_DATA_DIR = './data/cpreg';

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
