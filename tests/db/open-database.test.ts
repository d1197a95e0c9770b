import { afterEach, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { hostname } from 'node:os';
import { join } from 'node:path';
import { spawnSync } from 'node:child_process';
import { sql } from 'kysely';
import { openDatabase, resolveTarget, DEFAULT_DATA_DIR, INIT_MARKER_NAME, SMALL_BUFFER_POOL } from '../../db/open-database.ts';
import { DatabaseLockedError, LOCK_FILE_NAME, acquireDirectoryLock } from '../../db/lock.ts';
import { DatabaseOpenError, isDatabaseUnavailable } from '../../db/database-errors.ts';
import { makeTempDir, removeTempDir } from '../support/database.ts';

const dirs: string[] = [];
function tempDir(): string {
  const dir = makeTempDir('cpreg-open-');
  dirs.push(dir);
  return dir;
}
afterEach(() => {
  for (const dir of dirs.splice(0)) removeTempDir(dir);
});

/** The pid of a process that has exited (so it cannot be alive any more). */
function deadPid(): number {
  const child = spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))']);
  return Number(child.stdout.toString());
}

describe('resolveTarget', () => {
  it('prefers the argument, then DATABASE_URL, then the embedded default', () => {
    const saved = process.env.DATABASE_URL;
    try {
      process.env.DATABASE_URL = 'postgres://u@h:1/d';
      expect(resolveTarget('memory:')).toBe('memory:');
      expect(resolveTarget()).toBe('postgres://u@h:1/d');
      delete process.env.DATABASE_URL;
      expect(resolveTarget()).toBe(DEFAULT_DATA_DIR);
    } finally {
      if (saved === undefined) delete process.env.DATABASE_URL;
      else process.env.DATABASE_URL = saved;
    }
  });
});

describe('the embedded directory lock', () => {
  it('refuses a second holder, naming the first', () => {
    const dir = tempDir();
    const first = acquireDirectoryLock(dir, { command: 'cpreg serve (test)' });
    try {
      let caught: unknown;
      try {
        acquireDirectoryLock(dir);
      } catch (error) {
        caught = error;
      }
      expect(caught).toBeInstanceOf(DatabaseLockedError);
      expect((caught as Error).message).toContain(`process ${process.pid} on ${hostname()}`);
      expect((caught as Error).message).toContain('cpreg serve (test)');
    } finally {
      first.release();
    }
    expect(existsSync(join(dir, LOCK_FILE_NAME))).toBe(false);
  });

  it('takes over a lock whose process has died, and says so', () => {
    const dir = tempDir();
    const pid = deadPid();
    const stale = { pid, host: hostname(), command: 'cpreg serve', startedAt: '2026-01-01T00:00:00.000Z' };
    writeFileSync(join(dir, LOCK_FILE_NAME), JSON.stringify(stale));
    const messages: string[] = [];
    const lock = acquireDirectoryLock(dir, { onMessage: (line) => messages.push(line) });
    try {
      expect(messages).toHaveLength(1);
      expect(messages[0]).toContain(`process ${pid}`);
      expect(messages[0]).toContain('no longer running');
      expect(JSON.parse(readFileSync(join(dir, LOCK_FILE_NAME), 'utf8')).pid).toBe(process.pid);
    } finally {
      lock.release();
    }
  });

  it('treats a lock held on another host as alive (it cannot be checked from here)', () => {
    const dir = tempDir();
    const remote = { pid: 1, host: `${hostname()}-elsewhere`, command: 'cpreg serve', startedAt: '2026-01-01T00:00:00Z' };
    writeFileSync(join(dir, LOCK_FILE_NAME), JSON.stringify(remote));
    expect(() => acquireDirectoryLock(dir)).toThrow(/another host/);
  });
});

describe('openDatabase on a directory', () => {
  it('refuses a non-empty directory that is not a PGlite database and leaves it untouched', async () => {
    const dir = tempDir();
    writeFileSync(join(dir, 'notes.txt'), 'keep me');
    mkdirSync(join(dir, 'sub'));
    const before = readdirSync(dir).sort();
    await expect(openDatabase(dir)).rejects.toThrow(/not an embedded cpreg database.*nothing was changed/);
    expect(readdirSync(dir).sort()).toEqual(before);
    expect(readFileSync(join(dir, 'notes.txt'), 'utf8')).toBe('keep me');
  });

  it('recovers from an interrupted first start (initdb cut short), saying so', async () => {
    const dir = tempDir();
    // What a first start killed during initdb leaves: the marker and part of a cluster.
    writeFileSync(join(dir, INIT_MARKER_NAME), 'initdb started');
    writeFileSync(join(dir, 'PG_VERSION'), '18\n');
    mkdirSync(join(dir, 'base'));
    writeFileSync(join(dir, 'base', 'partial'), 'x');
    const messages: string[] = [];
    // No migrated template to copy (db/embedded-template.ts): the long way, initdb, is what is said.
    const savedCache = process.env.CPREG_CACHE_DIR;
    process.env.CPREG_CACHE_DIR = tempDir();
    const opened = await openDatabase(dir, { onMessage: (line) => messages.push(line) }).finally(() => {
      if (savedCache === undefined) delete process.env.CPREG_CACHE_DIR;
      else process.env.CPREG_CACHE_DIR = savedCache;
    });
    try {
      // The recovery is said, then (issue 19 item 3) that a new database is being made: initdb takes seconds.
      expect(messages).toEqual([expect.stringContaining('first start of'), expect.stringContaining('creating a new empty database in')]);
      const { rows } = await sql<{ one: number }>`select 1 as one`.execute(opened.db);
      expect(rows).toEqual([{ one: 1 }]);
    } finally {
      await opened.close();
    }
    expect(existsSync(join(dir, INIT_MARKER_NAME))).toBe(false);
    expect(existsSync(join(dir, 'base', 'partial'))).toBe(false);
  });

  it('refuses a file given as the directory', async () => {
    const dir = tempDir();
    const file = join(dir, 'file');
    writeFileSync(file, 'x');
    await expect(openDatabase(file)).rejects.toThrow(/is a file, not a database directory/);
  });

  it('opens, keeps data across a reopen, and refuses a second opener in the same process', async () => {
    const dir = join(tempDir(), 'db');
    const first = await openDatabase(dir);
    try {
      expect(first.backend).toBe('pglite');
      await expect(openDatabase(dir)).rejects.toBeInstanceOf(DatabaseLockedError);
      await sql`create table kept (v int)`.execute(first.db);
      await sql`insert into kept values (42)`.execute(first.db);
    } finally {
      await first.close();
    }
    expect(existsSync(join(dir, LOCK_FILE_NAME))).toBe(false);
    const second = await openDatabase(dir);
    try {
      const { rows } = await sql<{ v: number }>`select v from kept`.execute(second.db);
      expect(rows).toEqual([{ v: 42 }]);
    } finally {
      await second.close();
    }
  });
});

describe('the buffer pool of an embedded start', () => {
  it('is 16 MB for a smallBufferPool start only; the cluster keeps its own 128 MB for every other start', async () => {
    const dir = join(tempDir(), 'db');
    const pool = async (smallBufferPool: boolean): Promise<string> => {
      const opened = await openDatabase(dir, { smallBufferPool });
      try {
        const { rows } = await sql<{ shared_buffers: string }>`show shared_buffers`.execute(opened.db);
        return rows[0]!.shared_buffers;
      } finally {
        await opened.close();
      }
    };
    // 128MB: the value initdb writes into postgresql.conf when the machine allows it (PostgreSQL documentation,
    // "shared_buffers": "The default is typically 128 megabytes"); 16MB is SMALL_BUFFER_POOL.
    expect(await pool(false)).toBe('128MB');
    expect(SMALL_BUFFER_POOL).toBe('16MB');
    expect(await pool(true)).toBe('16MB');
    expect(await pool(false)).toBe('128MB'); // a setting of that start, not written into the cluster
  });
});

describe('openDatabase on PostgreSQL', () => {
  it('names host and port when the server does not answer, quickly', async () => {
    // Port 1 on the loopback: nothing listens there (common practice for "refused" tests).
    const started = Date.now();
    const error = await openDatabase('postgres://cpreg@127.0.0.1:1/cpreg').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(DatabaseOpenError);
    expect((error as Error).message).toContain('127.0.0.1:1');
    expect((error as Error).message).not.toContain('\n');
    expect(isDatabaseUnavailable(error)).toBe(true);
    expect(Date.now() - started).toBeLessThan(10_000); // only catches a hang
  });
});
