/**
 * Issue 19 item 2, one database by default, as a user meets it: in a directory of their own, with no --db and no
 * DATABASE_URL, every command (the demo included) uses ./data/cpreg; a command that only reads never makes a
 * database, a command that writes says which database it opened, and a new one is never made silently.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { childEnv, runCli } from '../../support/cli.ts';

const SLOW = 180_000;

describe('cpreg commands share one default database (./data/cpreg)', () => {
  let home: string;
  const run = (args: string[]) => runCli(args, { cwd: home, env: childEnv(), timeoutMs: SLOW });

  beforeAll(() => {
    home = mkdtempSync(join(tmpdir(), 'cpreg-default-db-'));
  });
  afterAll(() => {
    if (home) rmSync(home, { recursive: true, force: true });
  });

  it(
    'a read-only command refuses a missing database and creates nothing',
    async () => {
      const list = await run(['keys', 'list']);
      expect(list.code).toBe(1);
      expect(list.stderr).toContain('there is no database at ./data/cpreg (the default); nothing was created');
      expect(existsSync(join(home, 'data'))).toBe(false);
      const exported = await run(['export', 'register', '--format', 'csv']);
      expect(exported.code).toBe(1);
      expect(exported.stdout).toBe(''); // not a header of an empty register
      expect(existsSync(join(home, 'data'))).toBe(false);
    },
    SLOW,
  );

  it(
    'the first writing command says it created a new empty database, and where',
    async () => {
      const added = await run(['own-entities', 'add', 'Example Holdings GmbH', '--country', 'DE']);
      expect(added.code, added.stderr).toBe(0);
      expect(added.stderr).toContain(`created a new empty database at ${join(home, 'data', 'cpreg')}`);
      expect(existsSync(join(home, 'data', 'cpreg', 'PG_VERSION'))).toBe(true);
    },
    SLOW,
  );

  it(
    'later commands open the same database: writers name it, readers see what the writers stored',
    async () => {
      const key = await run(['keys', 'create', '--scope', 'read', '--label', 'contract system (read key)']);
      expect(key.code, key.stderr).toBe(0);
      expect(key.stderr).toContain('database ./data/cpreg (embedded; the default)');
      expect(key.stderr).not.toContain('created a new');
      const list = await run(['own-entities', 'list', '--json']);
      expect(list.code, list.stderr).toBe(0);
      expect((JSON.parse(list.stdout) as Array<{ name: string }>).map((o) => o.name)).toEqual(['Example Holdings GmbH']);
      expect(list.stderr).toBe(''); // read-only: no database line
    },
    SLOW,
  );

  it(
    '--db names another database, and the line says so',
    async () => {
      const added = await run(['own-entities', 'add', 'Example Trading Ltd', '--db', './data/other']);
      expect(added.code, added.stderr).toBe(0);
      expect(added.stderr).toContain(`created a new empty database at ${join(home, 'data', 'other')}`);
      const again = await run(['own-entities', 'remove', '1', '--db', './data/other']);
      expect(again.stderr).toContain('database ./data/other (embedded; from --db)');
    },
    SLOW,
  );

  it(
    'the demo uses the same default directory, and never mixes its invented data into a register that is not the demo',
    async () => {
      const demo = await run(['demo', '--no-serve']);
      expect(demo.code).toBe(1);
      expect(demo.stderr).toContain('./data/cpreg holds a register that is not the demo (0 contracts, 0 mentions, 1 own entity)');
      const list = await run(['own-entities', 'list', '--json']);
      expect((JSON.parse(list.stdout) as unknown[]).length).toBe(1); // nothing added by the refused demo
    },
    SLOW,
  );
});
