/**
 * vitest globalSetup: prepares, once per run, what the database suites copy from.
 * - PGlite: a migrated data-directory dump (cached on disk by a hash of the migrations), so that no
 *   test file migrates from scratch nor pays PGlite's cold start twice.
 * - PostgreSQL: DATABASE_URL when set; else a container through testcontainers when a container
 *   runtime answers; else none, said in ONE line (the PostgreSQL variants are then skipped, not passed).
 *   A migrated template database is created for the run; each test file copies it.
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { homedir, tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { TestProject } from 'vitest/node';
import { openDatabase, dumpEmbedded } from '../../db/open-database.ts';
import { migrateToLatest, MIGRATIONS_DIR } from '../../db/migrate.ts';
import { TEMPLATE_DATABASE_PREFIX, TEST_DATABASE_PREFIX, type PostgresTestServer, type TestEnvironment } from './environment.ts';
import { dropDatabase, listDatabases, quoteIdent, withAdminClient, withDatabase } from './postgres-admin.ts';

const STALE_AFTER_SECONDS = 2 * 3600; // a run never lasts this long; older leftovers are from crashed runs

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const runTag = `${Math.floor(Date.now() / 1000)}_${process.pid}`;
  const pgliteTemplateFile = await preparePgliteTemplate();
  const found = await findPostgres();
  const environment: TestEnvironment = { pgliteTemplateFile };
  let stopContainer: (() => Promise<void>) | undefined;
  if ('adminUrl' in found) {
    stopContainer = found.stop;
    const server = await preparePostgresTemplate(found.adminUrl, runTag, found.source);
    environment.postgres = server;
    console.log(`database suites: PGlite and PostgreSQL (${describeServer(found.adminUrl)}, from ${found.source})`);
  } else {
    environment.postgresUnavailableReason = found.reason;
    console.log(`database suites: PGlite only; PostgreSQL suites skipped (not passed): ${found.reason}`);
  }
  project.provide('cpregTestEnvironment', environment);

  return async () => {
    if (environment.postgres) await dropRunDatabases(environment.postgres);
    await stopContainer?.();
  };
}

function describeServer(url: string): string {
  const parsed = new URL(url);
  return `${parsed.hostname}:${parsed.port || 5432}`;
}

// ------------------------------------------------------------------ PGlite

async function preparePgliteTemplate(): Promise<string> {
  const dir = join(tmpdir(), 'cpreg-test-cache');
  mkdirSync(dir, { recursive: true });
  const file = join(dir, `pglite-template-${templateHash()}.tar`);
  if (existsSync(file)) return file;
  const opened = await openDatabase('memory:');
  try {
    await migrateToLatest(opened.db);
    const dump = await dumpEmbedded(opened);
    const partial = `${file}.${process.pid}.partial`;
    writeFileSync(partial, Buffer.from(await dump.arrayBuffer()));
    renameSync(partial, file); // atomic: a concurrent run never reads half a file
  } finally {
    await opened.close();
  }
  return file;
}

/** Changes whenever a migration, the migrator or the PGlite version changes. */
function templateHash(): string {
  const hash = createHash('sha256');
  for (const name of readdirSync(MIGRATIONS_DIR).sort()) {
    hash.update(name).update(readFileSync(join(MIGRATIONS_DIR, name)));
  }
  hash.update(readFileSync(fileURLToPath(new URL('../../db/migrate.ts', import.meta.url))));
  hash.update(readFileSync(fileURLToPath(new URL('../../node_modules/@electric-sql/pglite/package.json', import.meta.url))));
  return hash.digest('hex').slice(0, 16);
}

// ------------------------------------------------------------------ PostgreSQL

type Found = { adminUrl: string; source: PostgresTestServer['source']; stop?: () => Promise<void> } | { reason: string };

async function findPostgres(): Promise<Found> {
  const url = process.env.DATABASE_URL;
  if (url && url.trim() !== '') {
    // Set but unreachable is an error of the run, never a silent skip.
    await withAdminClient(url, async (client) => client.query('SELECT 1')).catch((error: Error) => {
      throw new Error(`DATABASE_URL is set but PostgreSQL does not answer (${describeServer(url)}): ${error.message}`);
    });
    return { adminUrl: url, source: 'DATABASE_URL' };
  }
  const socket = containerRuntimeHint();
  if (!socket) return { reason: 'DATABASE_URL is not set and no container runtime was found' };
  return startContainer(socket);
}

/** A quick look for a container runtime, so that a machine without one is not kept waiting. */
function containerRuntimeHint(): string | undefined {
  if (process.env.DOCKER_HOST) return process.env.DOCKER_HOST;
  const candidates = [
    '/var/run/docker.sock',
    join(homedir(), '.docker/run/docker.sock'),
    join(homedir(), '.colima/default/docker.sock'),
    '/run/podman/podman.sock',
    process.env.XDG_RUNTIME_DIR ? join(process.env.XDG_RUNTIME_DIR, 'podman/podman.sock') : '',
  ];
  return candidates.find((path) => path !== '' && existsSync(path));
}

async function startContainer(socket: string): Promise<Found> {
  try {
    const { getContainerRuntimeClient } = await import('testcontainers');
    await withTimeout(getContainerRuntimeClient(), 10_000, `the container runtime at ${socket} did not answer`);
    const { PostgreSqlContainer } = await import('@testcontainers/postgresql');
    const container = await new PostgreSqlContainer('postgres:15').start();
    return {
      adminUrl: container.getConnectionUri(),
      source: 'testcontainers',
      stop: async () => {
        await container.stop();
      },
    };
  } catch (error) {
    return { reason: `DATABASE_URL is not set and no PostgreSQL container could be started (${(error as Error).message})` };
  }
}

async function withTimeout<T>(work: Promise<T>, ms: number, message: string): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  try {
    return await Promise.race([
      work,
      new Promise<never>((_, reject) => {
        timer = setTimeout(() => reject(new Error(message)), ms);
      }),
    ]);
  } finally {
    clearTimeout(timer);
  }
}

async function preparePostgresTemplate(adminUrl: string, runTag: string, source: PostgresTestServer['source']): Promise<PostgresTestServer> {
  await dropStaleDatabases(adminUrl);
  const templateDatabase = `${TEMPLATE_DATABASE_PREFIX}${runTag}`;
  await withAdminClient(adminUrl, async (client) => {
    await client.query(`CREATE DATABASE ${quoteIdent(templateDatabase)}`);
  });
  const opened = await openDatabase(withDatabase(adminUrl, templateDatabase));
  try {
    await migrateToLatest(opened.db);
  } finally {
    await opened.close(); // CREATE DATABASE … TEMPLATE needs the template without connections
  }
  return { adminUrl, templateDatabase, databasePrefix: `${TEST_DATABASE_PREFIX}${runTag}_`, source };
}

/**
 * Databases left by runs that crashed before their teardown: only ours (by prefix), only older than
 * STALE_AFTER_SECONDS by the time stamp in their name, and without FORCE, so one still in use stays.
 */
async function dropStaleDatabases(adminUrl: string): Promise<void> {
  const now = Date.now() / 1000;
  for (const prefix of [TEST_DATABASE_PREFIX, TEMPLATE_DATABASE_PREFIX]) {
    for (const name of await listDatabases(adminUrl, prefix)) {
      const createdAt = Number(name.slice(prefix.length).split('_')[0]);
      if (!Number.isFinite(createdAt) || now - createdAt < STALE_AFTER_SECONDS) continue;
      await withAdminClient(adminUrl, (client) => client.query(`DROP DATABASE IF EXISTS ${quoteIdent(name)}`)).catch(() => undefined);
    }
  }
}

async function dropRunDatabases(server: PostgresTestServer): Promise<void> {
  for (const name of await listDatabases(server.adminUrl, server.databasePrefix)) {
    await dropDatabase(server.adminUrl, name);
  }
  await dropDatabase(server.adminUrl, server.templateDatabase);
}
