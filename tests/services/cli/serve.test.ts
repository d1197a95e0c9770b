import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { hostname } from 'node:os';
import { spawnSync } from 'node:child_process';
import { LOCK_FILE_NAME } from '../../../db/lock.ts';
import { createMigratedDataDir, makeTempDir, removeTempDir } from '../../support/database.ts';
import { childEnv, runCli, startServe, type ServerProcess } from '../../support/cli.ts';

describe('cpreg serve on an embedded directory', () => {
  let dir: string;
  let server: ServerProcess | undefined;
  beforeAll(async () => {
    dir = await createMigratedDataDir();
    server = await startServe(['--db', dir, '--port', '0']);
  });
  afterAll(async () => {
    await server?.stop('SIGKILL');
    removeTempDir(dir);
  });

  it('answers /healthz 200 JSON, /openapi.json OpenAPI 3, and an unknown route 404 problem+json', async () => {
    const health = await fetch(`${server!.url}/healthz`);
    expect(health.status).toBe(200);
    expect((await health.json()).database.backend).toBe('pglite');
    const spec = await (await fetch(`${server!.url}/openapi.json`)).json();
    expect(spec.openapi).toMatch(/^3\./);
    const missing = await fetch(`${server!.url}/nowhere`);
    expect(missing.status).toBe(404);
    expect(missing.headers.get('content-type')).toMatch(/^application\/problem\+json/);
    expect((await missing.json()).code).toBe('ROUTE_NOT_FOUND');
  });

  it('says how to get the first API key when the database has none (keys create is refused while it serves)', async () => {
    // The line follows the serving line: wait for it a little.
    const hint =
      /cpreg: no API key yet, and every \/v1 route needs one: stop the service \(Ctrl-C\), run cpreg keys create --scope admin --label "<role>" --db (\S+), and start it again/;
    for (let i = 0; i < 50 && !hint.test(server!.output()); i++) await new Promise((done) => setTimeout(done, 100));
    expect(server!.output()).toMatch(hint);
    expect(hint.exec(server!.output())![1]).toBe(dir);
  });

  it('refuses a second process on the same directory at once, naming the holder', async () => {
    const second = await runCli(['serve', '--db', dir, '--port', '0'], { timeoutMs: 30_000 });
    expect(second.code).not.toBe(0);
    const lines = second.stderr.trim().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toContain(`process ${server!.child.pid}`);
    expect(lines[0]).toContain('cpreg serve');
    // The first server is unharmed.
    expect((await fetch(`${server!.url}/healthz`)).status).toBe(200);
  });

  it('stops cleanly on SIGTERM, says it has stopped, and releases the directory', async () => {
    const stopping = server!;
    const { code } = await stopping.stop('SIGTERM');
    server = undefined;
    expect(code).toBe(0);
    // The last line may still be in the pipe when the exit is seen: wait for it a little.
    const said = /cpreg: stopped; http:\/\/\S+ no longer answers and the database is closed/;
    for (let i = 0; i < 50 && !said.test(stopping.output()); i++) await new Promise((done) => setTimeout(done, 100));
    expect(stopping.output()).toMatch(said);
    expect(existsSync(join(dir, LOCK_FILE_NAME))).toBe(false);
    const again = await runCli(['migrate', '--db', dir, '--json']);
    expect(again.code).toBe(0);
    expect(JSON.parse(again.stdout).applied).toEqual([]);
  });
});

describe('cpreg on an embedded directory it must not use', () => {
  it('takes over a lock whose process has died, and says so', async () => {
    const dir = await createMigratedDataDir();
    try {
      const dead = spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))']);
      const pid = Number(dead.stdout.toString());
      const stale = { pid, host: hostname(), command: 'cpreg serve', startedAt: '2026-01-01T00:00:00.000Z' };
      writeFileSync(join(dir, LOCK_FILE_NAME), JSON.stringify(stale));
      const result = await runCli(['migrate', '--db', dir]);
      expect(result.code).toBe(0);
      expect(result.stderr).toContain(`taking over the lock of ${dir}`);
      expect(result.stderr).toContain(`process ${pid}`);
      expect(existsSync(join(dir, LOCK_FILE_NAME))).toBe(false);
    } finally {
      removeTempDir(dir);
    }
  });

  it('refuses a directory that is not a PGlite database and leaves it untouched', async () => {
    const dir = makeTempDir('cpreg-notdb-');
    try {
      writeFileSync(join(dir, 'ledger.csv'), 'id,amount\n1,10\n');
      const before = readdirSync(dir);
      for (const args of [
        ['migrate', '--db', dir],
        ['serve', '--db', dir, '--port', '0'],
      ]) {
        const result = await runCli(args, { timeoutMs: 30_000 });
        expect(result.code).toBe(1);
        expect(result.stderr.trim().split('\n')).toHaveLength(1);
        expect(result.stderr).toContain('is not an embedded cpreg database');
      }
      expect(readdirSync(dir)).toEqual(before);
      expect(readFileSync(join(dir, 'ledger.csv'), 'utf8')).toBe('id,amount\n1,10\n');
    } finally {
      removeTempDir(dir);
    }
  });
});

describe('cpreg with an unreachable DATABASE_URL', () => {
  it('prints one line naming host and port and exits non-zero, for migrate and serve', async () => {
    // Nothing listens on port 1 of the loopback (common practice for a refused connection).
    const env = childEnv({ DATABASE_URL: 'postgres://cpreg@127.0.0.1:1/cpreg' });
    for (const args of [['migrate'], ['serve', '--port', '0']]) {
      const started = Date.now();
      const result = await runCli(args, { env, timeoutMs: 30_000 });
      expect(result.code).toBe(1);
      const lines = result.stderr.trim().split('\n');
      expect(lines).toHaveLength(1);
      expect(lines[0]).toContain('127.0.0.1:1');
      expect(result.stdout).toBe('');
      expect(Date.now() - started).toBeLessThan(20_000); // only catches a hang
    }
  });
});
