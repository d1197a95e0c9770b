/**
 * What opening a database takes and gives (see db/open-database.ts): the options, the opened database and its
 * backend. Types only, so that each backend's opening module and the entry point share them without importing
 * each other.
 */
import type { Kysely } from 'kysely';
import type { Database } from './types.ts';

export type Backend = 'pglite' | 'postgres';

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
