/**
 * What the vitest globalSetup (global-setup.ts) hands to every test file through provide/inject:
 * where the migrated PGlite template lies and which PostgreSQL (if any) the run uses.
 */
export interface PostgresTestServer {
  /** A URL of the server whose database may be used for CREATE/DROP DATABASE (credentials included). */
  adminUrl: string;
  /** The migrated template database that every test file's database is copied from. */
  templateDatabase: string;
  /** Prefix of every database this run creates (the teardown drops them all). */
  databasePrefix: string;
  /** Where the server came from, for the run's one-line notice. */
  source: 'DATABASE_URL' | 'testcontainers';
}

export interface TestEnvironment {
  /** A file holding the data-directory dump of a migrated embedded database. */
  pgliteTemplateFile: string;
  /** Absent when no PostgreSQL is available: the PostgreSQL variants of the suites are then skipped. */
  postgres?: PostgresTestServer;
  /** Why PostgreSQL is absent. */
  postgresUnavailableReason?: string;
}

declare module 'vitest' {
  export interface ProvidedContext {
    cpregTestEnvironment: TestEnvironment;
  }
}

export const TEST_DATABASE_PREFIX = 'cpreg_test_';
export const TEMPLATE_DATABASE_PREFIX = 'cpreg_tpl_';
