/** The public surface of db/ that services import. Query modules are imported from their own files. */
export {
  openDatabase,
  resolveTarget,
  isPostgresUrl,
  describePostgresUrl,
  checkEmbeddedDirectory,
  dumpEmbedded,
  DEFAULT_DATA_DIR,
  MEMORY_TARGET,
  type Backend,
  type OpenDatabaseOptions,
  type OpenedDatabase,
} from './open-database.ts';
export { migrateToLatest, createMigrator, ensureExtensions, MigrationError, MIGRATIONS_DIR, type MigrationReport } from './migrate.ts';
export { DatabaseOpenError, DatabaseTimeoutError, isDatabaseUnavailable, withDatabaseTimeout } from './database-errors.ts';
export { DatabaseLockedError, acquireDirectoryLock, LOCK_FILE_NAME, type LockHolder } from './lock.ts';
export type { Database } from './types.ts';
