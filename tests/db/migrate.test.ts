import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sql } from 'kysely';
import { migrateToLatest, createMigrator, REQUIRED_EXTENSIONS } from '../../db/migrate.ts';
import { describeEachBackend, describePostgres, openTestDatabase, type TestDatabase } from '../support/database.ts';
import { schemaSnapshot } from './support.ts';

describeEachBackend('migrations', (ctx) => {
  it('migrating an up-to-date database again applies nothing and changes no schema', async () => {
    const before = await schemaSnapshot(ctx.db());
    const migrator = createMigrator(ctx.db());
    const known = await migrator.getMigrations();
    expect(known.length).toBeGreaterThan(0);
    expect(known.every((m) => m.executedAt !== undefined)).toBe(true);

    const first = await migrateToLatest(ctx.db());
    const second = await migrateToLatest(ctx.db());
    expect(first.applied).toEqual([]);
    expect(second.applied).toEqual([]);
    expect(second.all).toEqual(known.map((m) => m.name));
    expect(await schemaSnapshot(ctx.db())).toEqual(before);
  });

  it('recognises an up-to-date database by its recorded names alone, loading no migration module', async () => {
    const { mkdtempSync, readdirSync, writeFileSync, rmSync } = await import('node:fs');
    const { tmpdir } = await import('node:os');
    const { join } = await import('node:path');
    const { MIGRATIONS_DIR } = await import('../../db/migrate.ts');
    // The same file names, each a module that throws when loaded: the fast path must not load any.
    const folder = mkdtempSync(join(tmpdir(), 'cpreg-migrations-'));
    try {
      for (const file of readdirSync(MIGRATIONS_DIR)) writeFileSync(join(folder, file), 'throw new Error("loaded");\n');
      const report = await migrateToLatest(ctx.db(), folder);
      expect(report.applied).toEqual([]);
      expect(report.all.length).toBe(readdirSync(MIGRATIONS_DIR).length);
      // One more file than recorded: the migrator runs (and loads the modules).
      writeFileSync(join(folder, '29991231000000_later.ts'), 'throw new Error("loaded");\n');
      await expect(migrateToLatest(ctx.db(), folder)).rejects.toThrow();
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  });

  it('enables the extensions the schema uses', async () => {
    const { extensions } = await schemaSnapshot(ctx.db());
    for (const name of REQUIRED_EXTENSIONS) expect(extensions).toContain(name);
    // The functions answer (values: pg_trgm and fuzzystrmatch documentation examples, from memory).
    const { rows } = await sql<{ sim: number; lev: number; plain: string }>`
      select similarity('word', 'two words') as sim, levenshtein('kitten', 'sitting') as lev,
             unaccent('Hôtel') as plain`.execute(ctx.db());
    expect(rows[0]!.lev).toBe(3); // kitten → sitting: the classic Levenshtein example, distance 3
    expect(rows[0]!.plain).toBe('Hotel');
    expect(rows[0]!.sim).toBeGreaterThan(0.3);
    expect(rows[0]!.sim).toBeLessThan(0.4); // pg_trgm docs example: 0.36363637 (4 shared of 11 trigrams)
  });
});

describe('a database migrated from empty', () => {
  it('ends with every migration applied, and a second run applies none', async () => {
    const { openDatabase } = await import('../../db/open-database.ts');
    const opened = await openDatabase('memory:');
    try {
      const first = await migrateToLatest(opened.db);
      expect(first.applied).toEqual(first.all);
      expect(first.all.length).toBeGreaterThan(0);
      const second = await migrateToLatest(opened.db);
      expect(second.applied).toEqual([]);
    } finally {
      await opened.close();
    }
  });
});

describePostgres('both backends', () => {
  let pglite: TestDatabase;
  let postgres: TestDatabase;
  beforeAll(async () => {
    [pglite, postgres] = await Promise.all([openTestDatabase('pglite'), openTestDatabase('postgres')]);
  });
  afterAll(async () => {
    await Promise.all([pglite?.close(), postgres?.close()]);
  });

  it('end with the same tables, columns, types, indexes and constraints', async () => {
    const [a, b] = await Promise.all([schemaSnapshot(pglite.db), schemaSnapshot(postgres.db)]);
    expect(a.columns.length).toBeGreaterThan(0);
    expect(a.indexes.length).toBeGreaterThan(0);
    expect(a).toEqual(b);
  });
});
