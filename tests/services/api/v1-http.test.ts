/**
 * Over real HTTP (listen on a free port): keys, a resolve, 308 for a merged id, and — on PostgreSQL — two service
 * instances, each with its own connection pool, over one database answering the same (the register issue's
 * two-instance and concurrency tests repeated over HTTP).
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../../services/api/app.ts';
import { createApiKey } from '../../../services/api/auth/keys.ts';
import type { OpenedDatabase } from '../../../db/open-database.ts';
import { describeEachBackend, describePostgres, openTestDatabase, type TestDatabase } from '../../support/database.ts';

async function listen(app: FastifyInstance): Promise<string> {
  await app.listen({ port: 0, host: '127.0.0.1' });
  const address = app.server.address() as { port: number };
  return `http://127.0.0.1:${address.port}`;
}

describeEachBackend('/v1 over real HTTP', (ctx) => {
  let app: FastifyInstance;
  let base: string;
  let admin: string;
  beforeAll(async () => {
    app = await buildApp({ db: ctx.db(), backend: ctx.backend, rateLimitPerMinute: false });
    base = await listen(app);
    admin = (await createApiKey(ctx.db(), { scope: 'admin', label: 'http test' })).secret;
  });
  afterAll(async () => {
    await app?.close();
  });

  const call = (url: string, init: { method?: string; body?: unknown; key?: string; headers?: Record<string, string> } = {}) =>
    fetch(`${base}${url}`, {
      method: init.method ?? 'GET',
      redirect: 'manual',
      headers: {
        ...(init.key === '' ? {} : { authorization: `Bearer ${init.key ?? admin}` }),
        ...(init.body !== undefined ? { 'content-type': 'application/json' } : {}),
        ...init.headers,
      },
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
    });

  it('answers 401 without a key and resolves with one', async () => {
    const none = await call('/v1/me', { key: '' });
    expect(none.status).toBe(401);
    expect(none.headers.get('content-type')).toMatch(/^application\/problem\+json/);
    expect(none.headers.get('www-authenticate')).toContain('Bearer');
    const res = await call('/v1/mentions', { method: 'POST', body: { source: 'http', externalId: 'h-1', text: 'Dunmarrow Ceramics Ltd', country: 'GB' } });
    expect(res.status).toBe(200);
    expect((await res.json()).status).toBe('new');
  });

  it('takes an NDJSON upload as a partitioned job over real HTTP (the request stream is never walked as JSON)', async () => {
    // Regression: the well-formed-text check once walked the upload stream's object graph and never returned.
    const lines = [
      JSON.stringify({ externalId: 'u-1', text: 'Brindlecombe Optics Ltd', country: 'GB' }),
      JSON.stringify({ externalId: 'u-2', text: 'Brindlecombe Optics Limited', country: 'GB' }),
      '{"externalId":"u-3","text":"Nul\\u0000Byte Traders"}',
    ];
    const res = await fetch(`${base}/v1/jobs/ingest?source=http-upload`, {
      method: 'POST',
      headers: { authorization: `Bearer ${admin}`, 'content-type': 'application/x-ndjson' },
      body: `${lines.join('\n')}\n`,
      signal: AbortSignal.timeout(60_000),
    });
    expect(res.status, await res.clone().text()).toBe(202);
    const id = ((await res.json()) as { id: number }).id;
    let job: { status: string; result: { counts: Record<string, number>; rejected: { line: number; reason: string }[] } | null } = {
      status: 'queued',
      result: null,
    };
    for (let i = 0; i < 300 && (job.status === 'queued' || job.status === 'running'); i++) {
      await new Promise((r) => setTimeout(r, 100));
      job = (await (await call(`/v1/jobs/${id}`)).json()) as typeof job;
    }
    expect(job.status).toBe('finished');
    expect(job.result!.counts).toMatchObject({ read: 3, rejected: 1 });
    expect(job.result!.rejected).toEqual([{ line: 3, reason: expect.stringContaining('NUL') }]);
  });

  it('answers 308 to the survivor for a merged id', async () => {
    const a = await (await call('/v1/counterparties', { method: 'POST', body: { name: 'Istervale Paper AB', jurisdiction: 'SE' } })).json();
    const b = await (await call('/v1/counterparties', { method: 'POST', body: { name: 'Istervale Papper AB', jurisdiction: 'SE' } })).json();
    const merged = await call('/v1/counterparties/merge', {
      method: 'POST',
      body: {
        items: [
          { id: a.counterpartyId, etag: a.etag },
          { id: b.counterpartyId, etag: b.etag },
        ],
        reason: 'typo',
      },
    });
    expect(merged.status).toBe(200);
    const res = await call(`/v1/counterparties/${b.counterpartyId}/mentions`);
    expect(res.status).toBe(308);
    expect(res.headers.get('location')).toBe(`/v1/counterparties/${a.counterpartyId}/mentions`);
    const followed = await fetch(`${base}${res.headers.get('location')}`, { headers: { authorization: `Bearer ${admin}` } });
    expect(followed.status).toBe(200);
  });
});

// A second pool over the same database: PostgreSQL (PGlite is one in-process connection).
describePostgres('/v1 over real HTTP: two instances [postgres]', () => {
  let database: TestDatabase;
  let app: FastifyInstance;
  let base: string;
  let admin: string;
  beforeAll(async () => {
    database = await openTestDatabase('postgres');
    app = await buildApp({ db: database.db, backend: 'postgres', rateLimitPerMinute: false });
    base = await listen(app);
    admin = (await createApiKey(database.db, { scope: 'admin', label: 'http test' })).secret;
  });
  afterAll(async () => {
    await app?.close();
    await database?.close();
  });

  it('two instances with their own pools over one database answer the same', async () => {
    const second: OpenedDatabase = await openTestDatabase({ at: database.url! });
    const other = await buildApp({ db: second.db, backend: 'postgres', rateLimitPerMinute: false });
    const otherBase = await listen(other);
    try {
      const via = (root: string, url: string, body?: unknown) =>
        fetch(`${root}${url}`, {
          method: body ? 'POST' : 'GET',
          headers: { authorization: `Bearer ${admin}`, ...(body ? { 'content-type': 'application/json' } : {}) },
          body: body ? JSON.stringify(body) : undefined,
        });
      // The same company written three ways, sent at once through both instances: one counterparty.
      const names = ['Caldermoor Instruments GmbH', 'Caldermoor Instruments G.m.b.H.', 'CALDERMOOR INSTRUMENTS GMBH'];
      const answers = await Promise.all(
        names.flatMap((text, i) => [
          via(i % 2 ? base : otherBase, '/v1/mentions', { source: 'two', externalId: `t-${i}`, text, country: 'DE' }),
          via(i % 2 ? otherBase : base, '/v1/mentions', { source: 'two', externalId: `t-${i}`, text, country: 'DE' }),
        ]),
      );
      const results = await Promise.all(answers.map((r) => r.json()));
      for (const r of answers) expect(r.status).toBe(200);
      const ids = new Set(results.map((r) => r.counterpartyId));
      expect(ids.size).toBe(1);
      const count = await database.db
        .selectFrom('mention')
        .select((eb) => eb.fn.countAll<string>().as('n'))
        .where('source', '=', 'two')
        .executeTakeFirstOrThrow();
      expect(Number(count.n)).toBe(3);
      const [one, two] = await Promise.all([via(base, `/v1/counterparties/${[...ids][0]}`), via(otherBase, `/v1/counterparties/${[...ids][0]}`)]);
      const [j1, j2] = [await one.json(), await two.json()];
      expect(j1).toEqual(j2);
      expect(one.headers.get('etag')).toBe(two.headers.get('etag'));
      // An Idempotency-Key used on one instance is honoured by the other (records live in the database).
      const body = { name: 'Brennock Valves Ltd', jurisdiction: 'IE' };
      const headers = { authorization: `Bearer ${admin}`, 'content-type': 'application/json', 'idempotency-key': 'two-instances-1' };
      const first = await fetch(`${base}/v1/counterparties`, { method: 'POST', headers, body: JSON.stringify(body) });
      const retry = await fetch(`${otherBase}/v1/counterparties`, { method: 'POST', headers, body: JSON.stringify(body) });
      expect(retry.headers.get('idempotent-replayed')).toBe('true');
      expect(await retry.json()).toEqual(await first.json());
    } finally {
      await other.close();
      await second.close();
    }
  });
});
