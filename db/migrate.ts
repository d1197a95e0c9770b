/**
 * Schema migrations: kysely's Migrator over the timestamp-named files in migrations/.
 * Running it again is harmless (applied migrations are recorded in kysely_migration).
 */
import { promises as fs } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { sql, type Kysely } from 'kysely';
import { Migrator, type Migration, type MigrationProvider, type MigrationResult } from 'kysely';

export const MIGRATIONS_DIR = fileURLToPath(new URL('../migrations/', import.meta.url));

/**
 * Extensions the schema relies on. Enabled before the migrations run, so that a migration may use
 * them; CREATE EXTENSION IF NOT EXISTS is harmless on a second run. (On PGlite they must also be
 * loaded in the constructor: openDatabase does that.) All three ship with PostgreSQL 15 contrib and
 * are "trusted", so a database owner without superuser may create them.
 */
export const REQUIRED_EXTENSIONS = ['pg_trgm', 'fuzzystrmatch', 'unaccent'] as const;

export interface MigrationReport {
  /** Migrations applied by this call, in order. */
  applied: string[];
  /** Every migration name known, in order. */
  all: string[];
}

export class MigrationError extends Error {
  constructor(
    readonly migration: string | undefined,
    options: { cause?: unknown },
  ) {
    const cause = options.cause as { message?: string } | undefined;
    super(
      migration ? `migration ${migration} failed: ${cause?.message ?? String(options.cause)}` : `migrations failed: ${cause?.message ?? String(options.cause)}`,
      options,
    );
    this.name = 'MigrationError';
  }
}

/**
 * The migrations of a folder, one module per file (`up`, `down`), keyed by file name without extension. Imported
 * by file URL so that the same code loads them under vitest and under the CLI's TypeScript loader.
 */
function folderMigrations(folder: string): MigrationProvider {
  return {
    async getMigrations(): Promise<Record<string, Migration>> {
      const out: Record<string, Migration> = {};
      for (const file of (await fs.readdir(folder)).sort()) {
        if (!/\.(?:ts|js|mjs)$/.test(file) || file.endsWith('.d.ts')) continue;
        const module = (await import(pathToFileURL(path.join(folder, file)).href)) as Migration;
        out[file.replace(/\.(?:ts|js|mjs)$/, '')] = module;
      }
      return out;
    },
  };
}

export function createMigrator(db: Kysely<any>, migrationFolder = MIGRATIONS_DIR): Migrator {
  return new Migrator({
    db,
    provider: folderMigrations(migrationFolder),
  });
}

export async function ensureExtensions(db: Kysely<any>): Promise<void> {
  for (const name of REQUIRED_EXTENSIONS) {
    await sql`create extension if not exists ${sql.id(name)}`.execute(db);
  }
}

/** The migration files' names (no extension), sorted, read from the folder without loading any module. */
async function migrationFileNames(folder: string): Promise<string[]> {
  const files = await fs.readdir(folder);
  return files
    .filter((f) => /\.(?:ts|js|mjs)$/.test(f) && !f.endsWith('.d.ts'))
    .map((f) => f.replace(/\.(?:ts|js|mjs)$/, ''))
    .sort();
}

/** The names recorded as applied, sorted; null when the database has no migration table yet. */
async function appliedMigrationNames(db: Kysely<any>): Promise<string[] | null> {
  try {
    const result = await sql<{ name: string }>`SELECT name FROM kysely_migration`.execute(db);
    return result.rows.map((r) => r.name).sort();
  } catch {
    return null;
  }
}

/** Whether the schema is at the migration this code expects: every file applied, nothing applied it lacks. */
export async function schemaState(db: Kysely<any>, migrationFolder = MIGRATIONS_DIR): Promise<{ upToDate: boolean; missing: string[]; unknown: string[] }> {
  const [files, applied] = await Promise.all([migrationFileNames(migrationFolder), appliedMigrationNames(db)]);
  const done = new Set(applied ?? []);
  const known = new Set(files);
  const missing = files.filter((f) => !done.has(f));
  const unknown = (applied ?? []).filter((a) => !known.has(a));
  return { upToDate: missing.length === 0 && unknown.length === 0, missing, unknown };
}

/**
 * Brings the schema up to date; throws MigrationError naming the failing migration. A database already at the
 * latest migration is recognised by one read (every file's name recorded as applied, nothing else): loading the
 * migrator and every migration module took about 2 s per command on the embedded database.
 */
export async function migrateToLatest(db: Kysely<any>, migrationFolder = MIGRATIONS_DIR): Promise<MigrationReport> {
  const [files, applied] = await Promise.all([migrationFileNames(migrationFolder), appliedMigrationNames(db)]);
  if (applied && applied.length === files.length && applied.every((name, i) => name === files[i])) return { applied: [], all: files };
  await ensureExtensions(db);
  const migrator = createMigrator(db, migrationFolder);
  const { error, results } = await migrator.migrateToLatest();
  const failed = results?.find((r: MigrationResult) => r.status === 'Error');
  if (error) throw new MigrationError(failed?.migrationName, { cause: error });
  const all = (await migrator.getMigrations()).map((m) => m.name);
  return {
    applied: (results ?? []).filter((r) => r.status === 'Success').map((r) => r.migrationName),
    all,
  };
}
