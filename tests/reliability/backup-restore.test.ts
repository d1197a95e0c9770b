/**
 * Backup and restore of the embedded database through the real CLI: the restored copy equals the original row
 * for row in every table (register, history, keys, runs, migrations) and passes verify; restore refuses a
 * non-empty target without --force and replaces it with --force; a backup of a PostgreSQL URL points to pg_dump.
 */
import { existsSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dumpAllTables } from './support.ts';
import { createRegisterContext } from '../../services/register/index.ts';
import { createApiKey } from '../../services/api/auth/keys.ts';
import { verifyRegister } from '../../services/verify/index.ts';
import { seededRandom } from '../../resolvers/prng.ts';
import { runWorkload } from '../services/register/support.ts';
import { createMigratedDataDir, makeTempDir, removeTempDir, withTestDatabase } from '../support/index.ts';
import { runCli } from '../support/cli.ts';

describe('cpreg backup / restore (embedded)', () => {
  let work: string;
  let source: string;
  let original: Record<string, string[]>;
  beforeAll(async () => {
    work = makeTempDir('cpreg-backup-');
    source = await createMigratedDataDir();
    original = await withTestDatabase(
      { at: source },
      async (opened) => {
        await runWorkload(createRegisterContext(opened.db), seededRandom(4242), 40, 'b');
        await createApiKey(opened.db, { scope: 'admin', label: 'backup test key' });
        return dumpAllTables(opened.db);
      },
      { command: 'backup test' },
    );
  }, 180_000);
  afterAll(() => {
    removeTempDir(work);
    removeTempDir(source);
  });

  it('round-trips every table row for row, and the copy verifies', async () => {
    const file = join(work, 'register.backup');
    const backup = await runCli(['backup', '--db', source, '--out', file, '--json']);
    expect(backup.stderr).toBe('');
    expect(backup.code).toBe(0);
    expect(JSON.parse(backup.stdout)).toMatchObject({ file, bytes: expect.any(Number) });
    const target = join(work, 'restored');
    const restore = await runCli(['restore', file, '--db', target]);
    expect(restore.stderr).toBe('');
    expect(restore.code).toBe(0);
    await withTestDatabase(
      { at: target },
      async (copy) => {
        // The history and the register really hold something (otherwise equality proves little).
        expect(original.history_event!.length).toBeGreaterThan(20);
        expect(original.api_key!.length).toBe(1);
        expect(await dumpAllTables(copy.db)).toEqual(original);
        const report = await verifyRegister(copy.db);
        expect(report.checks.filter((c) => !c.ok)).toEqual([]);
      },
      { command: 'backup test' },
    );
  }, 180_000);

  it('refuses to restore over a non-empty directory without --force, replaces it with --force', async () => {
    const file = join(work, 'register.backup');
    expect(existsSync(file)).toBe(true);
    const occupied = await createMigratedDataDir();
    try {
      const refused = await runCli(['restore', file, '--db', occupied]);
      expect(refused.code).toBe(1);
      expect(refused.stderr).toMatch(/is not empty: restore refuses to overwrite a database; pass --force/);
      const events = await withTestDatabase(
        { at: occupied },
        (before) =>
          before.db
            .selectFrom('history_event')
            .select((eb) => eb.fn.countAll<number>().as('n'))
            .executeTakeFirstOrThrow(),
        { command: 'backup test' },
      );
      expect(Number(events.n)).toBe(0);
      const forced = await runCli(['restore', file, '--db', occupied, '--force']);
      expect(forced.stderr).toBe('');
      expect(forced.code).toBe(0);
      const restored = await withTestDatabase({ at: occupied }, (after) => dumpAllTables(after.db), { command: 'backup test' });
      expect(restored).toEqual(original);
    } finally {
      removeTempDir(occupied);
    }
  }, 180_000);

  it('refuses a file that is not a backup, and points PostgreSQL to pg_dump', async () => {
    const junk = join(work, 'junk.backup');
    writeFileSync(junk, 'not an archive');
    const bad = await runCli(['restore', junk, '--db', join(work, 'never')]);
    expect(bad.code).toBe(1);
    expect(bad.stderr).toMatch(/is not a cpreg backup/);
    expect(existsSync(join(work, 'never'))).toBe(false);
    const pg = await runCli(['backup', '--db', 'postgres://nobody@127.0.0.1:1/none', '--out', join(work, 'x')]);
    expect(pg.code).toBe(1);
    expect(pg.stderr).toMatch(/pg_dump --format=custom/);
  }, 60_000);
});
