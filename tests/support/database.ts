/**
 * Database suites run on every backend available, each test file on its own migrated copy:
 *
 *   describeEachBackend('counterparty queries', (ctx) => {
 *     it('inserts', async () => {
 *       await ctx.db().insertInto('counterparty')...;
 *     });
 *   });
 *
 * registers `counterparty queries [pglite]` and `counterparty queries [postgres]`; the latter is
 * skipped (reported as skipped, never as passed) when the run has no PostgreSQL. The copy is opened
 * in beforeAll and dropped in afterAll; tests inside one describe share it (clean up after yourself
 * or use distinct keys). `withTestDatabase(backend, work)` gives a copy for one piece of work and always closes it;
 * `describePostgres(title, fn)` declares a suite that needs PostgreSQL itself (the one way to skip one).
 */
import { readFileSync } from 'node:fs';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, inject } from 'vitest';
import type { Kysely } from 'kysely';
import { openDatabase, type OpenDatabaseOptions, type OpenedDatabase } from '../../db/open-database.ts';
import type { Database } from '../../db/types.ts';
import type { TestEnvironment } from './environment.ts';
import { createDatabaseFromTemplate, dropDatabase, withDatabase } from './postgres-admin.ts';

export type TestBackend = 'pglite' | 'postgres';
export const ALL_TEST_BACKENDS: readonly TestBackend[] = ['pglite', 'postgres'];

export interface TestDatabase extends OpenedDatabase {
  backend: TestBackend;
  /** PostgreSQL only: the URL of this copy (for child processes or a second service instance). */
  url?: string;
}

export interface BackendContext {
  backend: TestBackend;
  /** The copy's Kysely instance; valid inside tests and hooks (opened in beforeAll). */
  db(): Kysely<Database>;
  /** The whole opened copy (backend, url on PostgreSQL, close). */
  database(): TestDatabase;
}

export function testEnvironment(): TestEnvironment {
  const environment = inject('cpregTestEnvironment');
  if (!environment) throw new Error('the test harness globalSetup did not run: run tests through vitest.config.ts');
  return environment;
}

export function isBackendAvailable(backend: TestBackend): boolean {
  return backend === 'pglite' || testEnvironment().postgres !== undefined;
}

export function availableBackends(): TestBackend[] {
  return ALL_TEST_BACKENDS.filter(isBackendAvailable);
}

let templateBlob: Blob | undefined;
/** The migrated embedded template, read once per test file. */
export function pgliteTemplate(): Blob {
  templateBlob ??= new Blob([readFileSync(testEnvironment().pgliteTemplateFile)]);
  return templateBlob;
}

/**
 * An existing database a test opens again (a directory a command wrote, the URL of a copy for a second connection):
 * opened as it is and only closed, never dropped (its owner removes it).
 */
export interface ExistingDatabase {
  at: string;
}

/**
 * A fresh migrated database: PGlite in memory loaded from the template dump (about half a second),
 * or a PostgreSQL database copied from the run's template. close() also drops the PostgreSQL copy.
 * Given `{ at }`, the existing database there instead. Tests open databases only through this module
 * (tests/conventions/test-support.test.ts), so that each one is closed the same way.
 */
export async function openTestDatabase(backend: TestBackend, options?: Omit<OpenDatabaseOptions, 'loadDataDir'>): Promise<TestDatabase>;
export async function openTestDatabase(existing: ExistingDatabase, options?: OpenDatabaseOptions): Promise<OpenedDatabase>;
export async function openTestDatabase(source: TestBackend | ExistingDatabase, options: OpenDatabaseOptions = {}): Promise<OpenedDatabase> {
  if (typeof source === 'object') return openDatabase(source.at, options);
  return openFreshCopy(source, options);
}

async function openFreshCopy(backend: TestBackend, options: Omit<OpenDatabaseOptions, 'loadDataDir'>): Promise<TestDatabase> {
  if (backend === 'pglite') {
    const opened = await openDatabase('memory:', { ...options, loadDataDir: pgliteTemplate() });
    return { ...opened, backend };
  }
  const url = await createPostgresCopy();
  const server = testEnvironment().postgres!;
  const name = new URL(url).pathname.slice(1);
  let opened: OpenedDatabase;
  try {
    opened = await openDatabase(url, options);
  } catch (error) {
    await dropDatabase(server.adminUrl, name);
    throw error;
  }
  return {
    ...opened,
    backend,
    url,
    async close() {
      await opened.close();
      await dropDatabase(server.adminUrl, name);
    },
  };
}

/**
 * A new PostgreSQL database copied from the migrated template; returns its URL. The caller opens it
 * (e.g. from two service instances); the run's teardown drops it, or call dropPostgresCopy(url).
 */
export async function createPostgresCopy(): Promise<string> {
  const server = testEnvironment().postgres;
  if (!server) throw new Error("no PostgreSQL in this run (see the run's first line)");
  const name = `${server.databasePrefix}${randomBytes(5).toString('hex')}`;
  await createDatabaseFromTemplate(server.adminUrl, name, server.templateDatabase);
  return withDatabase(server.adminUrl, name);
}

export async function dropPostgresCopy(url: string): Promise<void> {
  const server = testEnvironment().postgres;
  if (!server) return;
  await dropDatabase(server.adminUrl, new URL(url).pathname.slice(1));
}

/**
 * A migrated embedded database written into a new temporary directory (for CLI tests that spawn
 * `cpreg serve --db <dir>`); returns the directory. Remove it with removeTempDir.
 */
export async function createMigratedDataDir(): Promise<string> {
  const dir = makeTempDir('cpreg-db-');
  const opened = await openDatabase(dir, { loadDataDir: pgliteTemplate(), command: 'test harness' });
  await opened.close();
  return dir;
}

export function makeTempDir(prefix = 'cpreg-test-'): string {
  return mkdtempSync(join(tmpdir(), prefix));
}

export function removeTempDir(dir: string): void {
  rmSync(dir, { recursive: true, force: true });
}

/** Registers `fn` once per backend (see the file header). */
export function describeEachBackend(title: string, fn: (ctx: BackendContext) => void): void {
  for (const backend of ALL_TEST_BACKENDS) {
    const available = isBackendAvailable(backend);
    const suite = available ? describe : describe.skip;
    suite(`${title} [${backend}]`, () => {
      let opened: TestDatabase | undefined;
      beforeAll(async () => {
        opened = await openTestDatabase(backend);
      });
      afterAll(async () => {
        await opened?.close();
      });
      const database = (): TestDatabase => {
        if (!opened) throw new Error(`the ${backend} test database is not open yet: use it inside tests or hooks`);
        return opened;
      };
      fn({ backend, db: () => database().db, database });
    });
  }
}

/**
 * The same as describeEachBackend for suites that open their own databases (a data directory for a child
 * process, a PostgreSQL copy by URL): registers `title [backend]` per backend, skipped where it is missing.
 */
export function describeBackends(title: string, fn: (backend: TestBackend) => void): void {
  for (const backend of ALL_TEST_BACKENDS) (isBackendAvailable(backend) ? describe : describe.skip)(`${title} [${backend}]`, () => fn(backend));
}

/**
 * The one way to declare a suite that needs PostgreSQL itself (pg-boss, a second pool, a server to stop): skipped,
 * reported as skipped and never as passed, when the run has none. A suite that starts its own server passes
 * `{ unavailable }` instead (undefined when it can run, else why not; printed so the skip is seen).
 */
export function describePostgres(title: string, fn: () => void, options: { unavailable?: string } = {}): void {
  // The run's own check is announced by the global setup; a suite's own reason is announced here.
  if (options.unavailable !== undefined) process.stdout.write(`${title}: skipped (not passed): ${options.unavailable}\n`);
  const skip = 'unavailable' in options ? options.unavailable !== undefined : !isBackendAvailable('postgres');
  (skip ? describe.skip : describe)(title, fn);
}

/**
 * A database (see openTestDatabase: a fresh migrated copy, or `{ at }` an existing one) for the length of `work`,
 * closed (a fresh PostgreSQL copy also dropped) however `work` ends.
 */
export async function withTestDatabase<T>(
  backend: TestBackend,
  work: (database: TestDatabase) => Promise<T>,
  options?: Omit<OpenDatabaseOptions, 'loadDataDir'>,
): Promise<T>;
export async function withTestDatabase<T>(
  existing: ExistingDatabase,
  work: (database: OpenedDatabase) => Promise<T>,
  options?: OpenDatabaseOptions,
): Promise<T>;
export async function withTestDatabase<T>(
  source: TestBackend | ExistingDatabase,
  work: (database: OpenedDatabase) => Promise<T>,
  options: OpenDatabaseOptions = {},
): Promise<T> {
  const database = typeof source === 'object' ? await openTestDatabase(source, options) : await openFreshCopy(source, options);
  try {
    return await work(database);
  } finally {
    await database.close();
  }
}
