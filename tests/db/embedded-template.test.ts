/**
 * A new embedded database is a copy of a migrated template (db/embedded-template.ts) once one has been made:
 * the copy is a complete, migrated, independent database, with its own lock, and a template is only ever made
 * from a database this process created the long way.
 */
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { keepAsTemplate, openDatabase } from '../../db/open-database.ts';
import { migrateToLatest, schemaState } from '../../db/migrate.ts';
import { templateFile } from '../../db/embedded-template.ts';
import { LOCK_FILE_NAME } from '../../db/lock.ts';
import { makeTempDir, removeTempDir } from '../support/database.ts';

let root: string;
let savedCache: string | undefined;
beforeEach(() => {
  root = makeTempDir('cpreg-template-');
  savedCache = process.env.CPREG_CACHE_DIR;
  process.env.CPREG_CACHE_DIR = join(root, 'cache');
});
afterEach(() => {
  if (savedCache === undefined) delete process.env.CPREG_CACHE_DIR;
  else process.env.CPREG_CACHE_DIR = savedCache;
  removeTempDir(root);
});

describe('the migrated template of new embedded databases', () => {
  it('is made from the first new database, and the next new database is a migrated, independent copy of it', async () => {
    const template = templateFile()!;
    expect(template.startsWith(join(root, 'cache'))).toBe(true);

    const first = await openDatabase(join(root, 'a'));
    expect(first.created).toBe(true);
    expect(first.fromTemplate).toBe(false);
    await migrateToLatest(first.db);
    await keepAsTemplate(first);
    expect(existsSync(join(template, 'PG_VERSION'))).toBe(true);
    // The maker's lock and the running engine's pid file are not part of it.
    expect(existsSync(join(template, LOCK_FILE_NAME))).toBe(false);
    expect(existsSync(join(template, 'postmaster.pid'))).toBe(false);
    await first.db.insertInto('own_entity').values({ name: 'Example Holdings GmbH', normalised: 'example holdings', created_at: new Date() }).execute();

    const second = await openDatabase(join(root, 'b'));
    try {
      expect(second.created).toBe(true);
      expect(second.fromTemplate).toBe(true);
      expect((await schemaState(second.db)).upToDate).toBe(true);
      // Empty: what was written to the first database after the template was taken is not in the copy.
      expect(await second.db.selectFrom('own_entity').selectAll().execute()).toEqual([]);
      // Its lock is this process's own, not the template maker's.
      expect(readFileSync(join(root, 'b', LOCK_FILE_NAME), 'utf8')).toContain(String(process.pid));
      // A copy is never saved again as a template (keepAsTemplate leaves it alone).
      await keepAsTemplate(second);
    } finally {
      await second.close();
      await first.close();
    }
    const reopened = await openDatabase(join(root, 'b'));
    try {
      expect(reopened.created).toBe(false);
      expect((await schemaState(reopened.db)).upToDate).toBe(true);
    } finally {
      await reopened.close();
    }
  }, 120_000);

  it('is not made from a database that was not created by this open (an existing one could hold data)', async () => {
    const made = await openDatabase(join(root, 'a'));
    await migrateToLatest(made.db);
    await made.close();
    const existing = await openDatabase(join(root, 'a'));
    try {
      expect(existing.created).toBe(false);
      await keepAsTemplate(existing);
      expect(existsSync(templateFile()!)).toBe(false);
    } finally {
      await existing.close();
    }
  }, 120_000);
});
