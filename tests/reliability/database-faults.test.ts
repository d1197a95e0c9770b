/**
 * Database faults under a running service: the test runs its own PostgreSQL (own-postgres.ts), starts
 * `cpreg serve` on it with --db-timeout 1500, writes, stops PostgreSQL, and checks that requests answer 503
 * problem+json within the timeout (plus a generous margin that only catches hangs) and that /healthz says the
 * database is down; then starts PostgreSQL again and checks that the same process recovers by itself and that
 * every write it acknowledged is there (and verify passes).
 */
import pg from 'pg';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { runCli, startServe, childEnv, type ServerProcess } from '../support/cli.ts';
import { describePostgres } from '../support/index.ts';
import { ownPostgresUnavailable, startOwnPostgres, type OwnPostgres } from './support.ts';

const DB_TIMEOUT_MS = 1500;
describePostgres(
  'PostgreSQL stopped and started under a running service',
  () => {
    let server: OwnPostgres;
    let service: ServerProcess;
    let url: string;
    let key: string;
    beforeAll(async () => {
      server = await startOwnPostgres();
      const admin = new pg.Client({ connectionString: server.url });
      await admin.connect();
      await admin.query('CREATE DATABASE cpreg_faults');
      await admin.end();
      url = server.url.replace(/\/postgres$/, '/cpreg_faults');
      const migrate = await runCli(['migrate', '--db', url]);
      expect(migrate.code, migrate.stderr).toBe(0);
      const created = await runCli(['keys', 'create', '--scope', 'admin', '--label', 'faults test', '--json', '--db', url]);
      expect(created.code, created.stderr).toBe(0);
      key = (JSON.parse(created.stdout) as { secret: string }).secret;
      service = await startServe(['--db', url, '--port', '0', '--db-timeout', String(DB_TIMEOUT_MS)], {
        env: childEnv({ CPREG_RATE_LIMIT_PER_MINUTE: 'off' }),
      });
    }, 180_000);
    afterAll(async () => {
      await service?.stop();
      server?.destroy();
    });

    const call = async (method: 'GET' | 'POST', path: string, body?: unknown) => {
      const started = performance.now();
      const send = () =>
        fetch(`${service.url}${path}`, {
          method,
          headers: { authorization: `Bearer ${key}`, ...(body ? { 'content-type': 'application/json' } : {}) },
          body: body ? JSON.stringify(body) : undefined,
          signal: AbortSignal.timeout(30_000),
        });
      let res: Response;
      try {
        res = await send();
      } catch (error) {
        // The service stopped answering (it once crashed here on an unhandled 'error' of a pg client whose
        // connection died while checked out): say so with its output.
        throw new Error(`the service did not answer ${method} ${path} (${(error as Error).message}); its last output:\n${service.output().slice(-4000)}`, {
          cause: error,
        });
      }
      const text = await res.text();
      return { status: res.status, type: res.headers.get('content-type') ?? '', text, ms: performance.now() - started };
    };

    it('answers 503 problem+json during the outage, recovers by itself, loses no acknowledged write', async () => {
      const acknowledged: { externalId: string; mentionId: number }[] = [];
      let n = 0;
      const write = async () => {
        const externalId = `f-${n++}`;
        const res = await call('POST', '/v1/mentions', { source: 'faults', externalId, text: `Tollbridge Quarry ${n} Ltd` });
        if (res.status < 300) acknowledged.push({ externalId, mentionId: (JSON.parse(res.text) as { mentionId: number }).mentionId });
        return res;
      };
      for (let i = 0; i < 5; i++) expect((await write()).status).toBeLessThan(300);
      expect((await call('GET', '/healthz')).status).toBe(200);

      server.stop('fast');
      const outage: { status: number; ms: number }[] = [];
      for (let i = 0; i < 6; i++) {
        const res = i % 2 === 0 ? await write() : await call('GET', '/v1/counterparties?q=Tollbridge');
        outage.push({ status: res.status, ms: Math.round(res.ms) });
        expect(res.status, res.text).toBe(503);
        expect(res.type).toMatch(/^application\/problem\+json/);
        expect(JSON.parse(res.text)).toMatchObject({ status: 503, code: expect.any(String) });
        // Within the database timeout, plus a margin that only catches hangs (the connect attempt itself).
        expect(res.ms).toBeLessThan(DB_TIMEOUT_MS + 3000);
      }
      const health = await call('GET', '/healthz');
      expect(health.status).toBe(503);
      expect(health.text).toMatch(/database/i);
      process.stdout.write(`database-faults: outage answers ${JSON.stringify(outage)}\n`);

      server.start();
      const back = performance.now();
      let recovered = false;
      while (performance.now() - back < 30_000) {
        const res = await write();
        if (res.status < 300) {
          recovered = true;
          break;
        }
        expect(res.status).toBe(503);
        await new Promise((r) => setTimeout(r, 250));
      }
      expect(recovered).toBe(true);
      process.stdout.write(`database-faults: recovered ${Math.round(performance.now() - back)} ms after PostgreSQL was started again\n`);
      expect((await call('GET', '/healthz')).status).toBe(200);
      for (let i = 0; i < 5; i++) expect((await write()).status).toBeLessThan(300);

      // Every acknowledged write is there.
      for (const { mentionId, externalId } of acknowledged) {
        const res = await call('GET', `/v1/mentions/${mentionId}`);
        expect(res.status, externalId).toBe(200);
        expect(JSON.parse(res.text)).toMatchObject({ externalId, source: 'faults' });
      }

      // A database that hangs instead of refusing (the postmaster and its backends frozen with SIGSTOP):
      // requests must still answer 503 within the timeout, and recover when it thaws.
      const frozen = server.pids();
      for (const pid of frozen) process.kill(pid, 'SIGSTOP');
      const hung: { status: number; ms: number }[] = [];
      try {
        for (let i = 0; i < 3; i++) {
          const res = i % 2 === 0 ? await write() : await call('GET', '/healthz');
          hung.push({ status: res.status, ms: Math.round(res.ms) });
          expect(res.status, res.text).toBe(503);
          expect(res.type).toMatch(/^application\/problem\+json/);
          expect(res.ms).toBeLessThan(DB_TIMEOUT_MS + 3000);
        }
      } finally {
        for (const pid of frozen) process.kill(pid, 'SIGCONT');
      }
      process.stdout.write(`database-faults: hung database answers ${JSON.stringify(hung)}\n`);
      const thawed = performance.now();
      let again = false;
      while (performance.now() - thawed < 30_000) {
        if ((await write()).status < 300) {
          again = true;
          break;
        }
        await new Promise((r) => setTimeout(r, 250));
      }
      expect(again).toBe(true);
      for (const { mentionId, externalId } of acknowledged) {
        const res = await call('GET', `/v1/mentions/${mentionId}`);
        expect(res.status, externalId).toBe(200);
      }

      const verify = await runCli(['verify', '--db', url, '--json']);
      expect(verify.code, verify.stdout + verify.stderr).toBe(0);
    }, 240_000);
  },
  { unavailable: ownPostgresUnavailable() },
);
