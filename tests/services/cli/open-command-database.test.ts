/**
 * How a command opens the embedded database (issue 19 item 3: quick read-only commands): a command that only reads
 * starts the engine light (no search extensions, a small buffer pool); a database at an older migration is still
 * brought up to date first, as a writer would.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { sql, type Kysely } from 'kysely';
import { openCommandDatabase } from '../../../services/cli/open-command-database.ts';
import { openDatabase } from '../../../db/open-database.ts';
import { createMigrator, migrateToLatest, schemaState } from '../../../db/migrate.ts';
import { makeTempDir, removeTempDir } from '../../support/database.ts';

const dirs: string[] = [];
afterEach(() => {
  for (const dir of dirs.splice(0)) removeTempDir(dir);
});

/** A migrated embedded database in a directory of its own; `behind` latest migrations undone. */
async function embeddedDatabase(behind = 0): Promise<string> {
  const home = makeTempDir('cpreg-open-command-');
  dirs.push(home);
  const dir = join(home, 'db');
  const opened = await openDatabase(dir);
  try {
    await migrateToLatest(opened.db);
    for (let i = 0; i < behind; i++) {
      const { error } = await createMigrator(opened.db).migrateDown();
      if (error) throw error;
    }
  } finally {
    await opened.close();
  }
  return dir;
}

async function setting(db: Kysely<any>, name: 'shared_buffers'): Promise<string> {
  const { rows } = await sql<Record<string, string>>`select current_setting(${name}) as value`.execute(db);
  return rows[0]!.value!;
}

async function extensionsLoaded(db: Kysely<any>): Promise<boolean> {
  try {
    await sql`select similarity('a', 'a')`.execute(db);
    return true;
  } catch {
    return false;
  }
}

const SLOW = 120_000;

describe('openCommandDatabase on an embedded database', () => {
  it(
    'a reading command on an up-to-date database starts the engine light and says nothing',
    async () => {
      const dir = await embeddedDatabase();
      const said: string[] = [];
      const opened = await openCommandDatabase(dir, 'test reads', { writes: false, say: (line) => said.push(line) });
      try {
        expect(await setting(opened.db, 'shared_buffers')).toBe('16MB');
        expect(await extensionsLoaded(opened.db)).toBe(false);
      } finally {
        await opened.close();
      }
      expect(said).toEqual([]);
      // A writing command gets the engine as the cluster sets it, with its extensions.
      const writer = await openCommandDatabase(dir, 'test writes', { writes: true, say: (line) => said.push(line) });
      try {
        expect(await setting(writer.db, 'shared_buffers')).toBe('128MB');
        expect(await extensionsLoaded(writer.db)).toBe(true);
      } finally {
        await writer.close();
      }
    },
    SLOW,
  );

  it(
    'a reading command on a database one migration behind migrates it first, opened as a writer',
    async () => {
      const dir = await embeddedDatabase(1);
      const opened = await openCommandDatabase(dir, 'test reads', { writes: false, say: () => undefined });
      try {
        expect((await schemaState(opened.db)).upToDate).toBe(true);
        expect(await setting(opened.db, 'shared_buffers')).toBe('128MB');
        expect(await extensionsLoaded(opened.db)).toBe(true);
      } finally {
        await opened.close();
      }
    },
    SLOW,
  );
});
