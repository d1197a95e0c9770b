/**
 * Keys, scopes, limits and idempotency over fastify inject, on both backends. The route table is walked with
 * no key, a read, a write and an admin key: each route answers 401 without a key, 403 below its scope, and
 * anything but 401/403 at or above it (scopes nest: admin ⊇ write ⊇ read — the rule).
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { Writable } from 'node:stream';
import pino from 'pino';
import { sql } from 'kysely';
import { buildApp } from '../../../services/api/app.ts';
import { createApiKey, digest, revokeApiKey } from '../../../services/api/auth/keys.ts';
import { describeEachBackend } from '../../support/database.ts';
import { keyedApp, type KeyedApp } from './support.ts';
import type { ApiScope } from '../../../resolvers/vocabulary.ts';

const RANK: Record<ApiScope, number> = { read: 0, write: 1, admin: 2 };

describeEachBackend('/v1 keys, scopes, limits and idempotency', (ctx) => {
  let k: KeyedApp;
  const routes: { method: string; url: string; scope: ApiScope }[] = [];
  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
    const spec = (await k.app.inject({ method: 'GET', url: '/openapi.json' })).json() as { paths: Record<string, Record<string, { 'x-scope'?: ApiScope }>> };
    for (const [path, methods] of Object.entries(spec.paths)) {
      for (const [method, op] of Object.entries(methods)) {
        if (!path.startsWith('/v1')) continue;
        routes.push({
          method: method.toUpperCase(),
          url: path.replace(/\{[a-z]+\}/gi, (m) => (m.includes('kind') ? 'register' : m.includes('keyId') ? 'kffffffffffff' : '999999')),
          scope: op['x-scope']!,
        });
      }
    }
  });
  afterAll(async () => {
    await k?.app.close();
  });

  async function mentionCount(): Promise<number> {
    const row = await sql<{ n: string }>`SELECT count(*) AS n FROM mention`.execute(ctx.db());
    return Number(row.rows[0]!.n);
  }

  it('documents a scope on every /v1 route (the OpenAPI x-scope)', () => {
    expect(routes.length).toBeGreaterThan(30);
    for (const r of routes) expect(['read', 'write', 'admin'], `${r.method} ${r.url}`).toContain(r.scope);
    // The split: reads are read, posting mentions and contracts is write, changes are admin.
    const scopeOf = (method: string, url: string) => routes.find((r) => r.method === method && r.url === url)?.scope;
    expect(scopeOf('GET', '/v1/counterparties')).toBe('read');
    expect(scopeOf('POST', '/v1/mentions')).toBe('write');
    expect(scopeOf('POST', '/v1/contracts')).toBe('write');
    expect(scopeOf('POST', '/v1/counterparties/merge')).toBe('admin');
    expect(scopeOf('POST', '/v1/keys')).toBe('admin');
  });

  it('walks the route table with no key, read, write and admin keys', async () => {
    for (const route of routes) {
      const payload = ['POST', 'PATCH', 'PUT'].includes(route.method) ? {} : undefined;
      const none = await k.call(null, { method: route.method as 'GET', url: route.url, payload });
      expect(none.statusCode, `${route.method} ${route.url} without a key`).toBe(401);
      expect(none.json().code).toBe('UNAUTHENTICATED');
      for (const scope of ['read', 'write', 'admin'] as const) {
        const res = await k.call(scope, { method: route.method as 'GET', url: route.url, payload, headers: { 'if-match': '"cp999999.v1"' } });
        if (RANK[scope] < RANK[route.scope]) {
          expect(res.statusCode, `${route.method} ${route.url} with ${scope}`).toBe(403);
          expect(res.json()).toMatchObject({ code: 'FORBIDDEN', requiredScope: route.scope });
        } else {
          expect([401, 403], `${route.method} ${route.url} with ${scope}: ${res.body.slice(0, 200)}`).not.toContain(res.statusCode);
          expect(res.statusCode, `${route.method} ${route.url} with ${scope}`).toBeLessThan(500);
        }
      }
    }
  });

  it('stores only a digest of the key, refuses a revoked or altered key, and GET /v1/me names the key', async () => {
    const created = await createApiKey(ctx.db(), { scope: 'write', label: 'contract system' });
    const row = await ctx.db().selectFrom('api_key').selectAll().where('id', '=', created.id).executeTakeFirstOrThrow();
    expect(row.secret_hash).toBe(digest(created.secret));
    // The random part follows "cpreg_<id>_"; base64url may itself hold "_", so take all of it, never a piece.
    const randomPart = created.secret.slice(`cpreg_${created.id}_`.length);
    expect(randomPart.length).toBeGreaterThanOrEqual(43);
    expect(JSON.stringify(row)).not.toContain(randomPart);
    const me = await k.app.inject({ method: 'GET', url: '/v1/me', headers: { authorization: `Bearer ${created.secret}` } });
    expect(me.json()).toMatchObject({ keyId: created.id, label: 'contract system', scope: 'write' });
    const altered = created.secret.slice(0, -1) + (created.secret.endsWith('A') ? 'B' : 'A');
    expect((await k.app.inject({ method: 'GET', url: '/v1/me', headers: { authorization: `Bearer ${altered}` } })).statusCode).toBe(401);
    await revokeApiKey(ctx.db(), created.id);
    expect((await k.app.inject({ method: 'GET', url: '/v1/me', headers: { authorization: `Bearer ${created.secret}` } })).statusCode).toBe(401);
  });

  it('creates a key over the API (secret once) and never logs the key', async () => {
    const lines: string[] = [];
    const logger = pino({ level: 'info' }, new Writable({ write: (chunk, _e, done) => (lines.push(String(chunk)), done()) }));
    const app = await buildApp({ db: ctx.db(), backend: ctx.backend, logger, rateLimitPerMinute: false });
    const res = await app.inject({
      method: 'POST',
      url: '/v1/keys',
      headers: { authorization: `Bearer ${k.keys.admin}` },
      payload: { scope: 'read', label: 'auditor' },
    });
    expect(res.statusCode).toBe(201);
    const secret = res.json().secret as string;
    await app.inject({ method: 'GET', url: '/v1/me', headers: { authorization: `Bearer ${secret}` } });
    await app.close();
    const log = lines.join('');
    expect(log.length).toBeGreaterThan(0);
    expect(log).not.toContain(secret);
    expect(log).not.toContain(k.keys.admin);
    const listed = await k.call('admin', { method: 'GET', url: '/v1/keys' });
    expect(listed.body).not.toContain(secret);
  });

  it('answers 429 naming the per-key limit, per key', async () => {
    const limited = await keyedApp(ctx.db(), ctx.backend, { rateLimitPerMinute: 3 });
    const codes = [];
    for (let i = 0; i < 4; i++) codes.push((await limited.call('read', { method: 'GET', url: '/v1/me' })).statusCode);
    expect(codes).toEqual([200, 200, 200, 429]);
    const res = await limited.call('read', { method: 'GET', url: '/v1/me' });
    expect(res.json()).toMatchObject({ code: 'RATE_LIMITED', limit: 3 });
    expect(res.json().detail).toContain('3 requests per minute');
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    expect((await limited.call('write', { method: 'GET', url: '/v1/me' })).statusCode).toBe(200);
    await limited.app.close();
  });

  it('refuses over-size bodies with 413 naming the limit, and stores nothing', async () => {
    const before = await mentionCount();
    const big = { source: 's', externalId: 'x', text: 'A'.repeat(70 * 1024) };
    const res = await k.call('write', { method: 'POST', url: '/v1/mentions', payload: big });
    expect(res.statusCode).toBe(413);
    expect(res.json()).toMatchObject({ code: 'PAYLOAD_TOO_LARGE', limitBytes: 65536 });
    const contract = await k.call('write', {
      method: 'POST',
      url: '/v1/contracts',
      payload: { source: 's', externalId: 'c', text: 'x'.repeat(1024 * 1024 + 10) },
    });
    expect(contract.statusCode).toBe(413);
    expect(contract.json().limitBytes).toBe(1024 * 1024);
    const items = Array.from({ length: 10_001 }, (_, i) => ({ source: 's', externalId: `b${i}`, text: 'Tolvern Ltd' }));
    const batch = await k.call('write', { method: 'POST', url: '/v1/mentions/batch', payload: items });
    expect(batch.statusCode).toBe(413);
    expect(batch.json()).toMatchObject({ code: 'BATCH_TOO_LARGE', limit: 10_000, jobRoute: '/v1/jobs/ingest' });
    const ndjson = items.map((i) => JSON.stringify(i)).join('\n');
    const batch2 = await k.call('write', { method: 'POST', url: '/v1/mentions/batch', payload: ndjson, headers: { 'content-type': 'application/x-ndjson' } });
    expect(batch2.statusCode).toBe(413);
    expect(batch2.json().jobRoute).toBe('/v1/jobs/ingest');
    const huge = 'x'.repeat(10 * 1024 * 1024 + 1);
    const batch3 = await k.call('write', { method: 'POST', url: '/v1/mentions/batch', payload: huge, headers: { 'content-type': 'application/x-ndjson' } });
    expect(batch3.statusCode).toBe(413);
    expect(batch3.json()).toMatchObject({ code: 'PAYLOAD_TOO_LARGE', limitBytes: 10 * 1024 * 1024, jobRoute: '/v1/jobs/ingest' });
    expect(await mentionCount()).toBe(before);
  });

  it('answers problem+json for malformed JSON, wrong types, unknown fields and names over 1,000 characters, storing nothing', async () => {
    const before = await mentionCount();
    const cases: { payload: string | object; status: number; code: string; pointer?: string }[] = [
      { payload: '{"source": "s", "externalId":', status: 400, code: 'MALFORMED_JSON' },
      { payload: { source: 's', externalId: 7, text: 'Tolvern Ltd' }, status: 422, code: 'VALIDATION_FAILED', pointer: '/externalId' },
      { payload: { source: 's', externalId: 'e', text: 'Tolvern Ltd', colour: 'red' }, status: 422, code: 'VALIDATION_FAILED', pointer: '/colour' },
      { payload: { source: 's', externalId: 'e', text: 'T'.repeat(1001) }, status: 422, code: 'VALIDATION_FAILED', pointer: '/text' },
      { payload: { source: 's', externalId: 'e' }, status: 422, code: 'VALIDATION_FAILED', pointer: '/text' },
    ];
    for (const c of cases) {
      const res = await k.call('write', { method: 'POST', url: '/v1/mentions', payload: c.payload as string, headers: { 'content-type': 'application/json' } });
      expect(res.statusCode, JSON.stringify(c.payload).slice(0, 80)).toBe(c.status);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
      expect(res.json().code).toBe(c.code);
      if (c.pointer) expect(res.json().errors.map((e: { pointer: string }) => e.pointer)).toContain(c.pointer);
    }
    const long = await k.call('write', { method: 'POST', url: '/v1/mentions', payload: { source: 's', externalId: 'e', text: 'T'.repeat(1001) } });
    expect(long.json().detail).toContain('1000');
    expect(await mentionCount()).toBe(before);
  });

  it('replays an idempotent retry without doing the work twice, and refuses the key with another body (422)', async () => {
    const body = { name: 'Halvorsund Marine AS', jurisdiction: 'NO', reason: 'idempotency test' };
    const headers = { 'idempotency-key': 'create-halvorsund-1' };
    const first = await k.call('admin', { method: 'POST', url: '/v1/counterparties', payload: body, headers });
    expect(first.statusCode).toBe(201);
    const again = await k.call('admin', { method: 'POST', url: '/v1/counterparties', payload: body, headers });
    expect(again.statusCode).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.json()).toEqual(first.json());
    expect(again.headers.location).toBe(first.headers.location);
    const created = await ctx.db().selectFrom('counterparty').select('id').where('canonical_name', '=', body.name).execute();
    expect(created).toHaveLength(1);
    const events = await ctx.db().selectFrom('history_event').select('id').where('reason', '=', 'idempotency test').execute();
    expect(events).toHaveLength(1);
    const other = await k.call('admin', { method: 'POST', url: '/v1/counterparties', payload: { ...body, name: 'Other Marine AS' }, headers });
    expect(other.statusCode).toBe(422);
    expect(other.json().code).toBe('IDEMPOTENCY_KEY_REUSED');
    expect(await ctx.db().selectFrom('counterparty').select('id').where('canonical_name', '=', 'Other Marine AS').execute()).toHaveLength(0);
    // Keys belong to the API key that sent them: another key may use the same Idempotency-Key for its own request.
    const mention = { source: 'idem', externalId: 'm1', text: 'Halvorsund Marine AS', country: 'NO' };
    const m1 = await k.call('write', { method: 'POST', url: '/v1/mentions', payload: mention, headers });
    expect(m1.statusCode).toBe(200);
    const m2 = await k.call('write', { method: 'POST', url: '/v1/mentions', payload: mention, headers });
    expect(m2.headers['idempotent-replayed']).toBe('true');
    expect(m2.json()).toEqual(m1.json());
  });
});
