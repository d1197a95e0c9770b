/**
 * Issue 17 item 5 (and the first half of 15): a 20,000-deep JSON body sent with an Idempotency-Key to the job
 * routes overflowed the stack while the body was hashed (500). Every route refuses a body nested deeper than
 * MAX_BODY_DEPTH (422 BODY_TOO_DEEP naming the limit), the job routes have a body schema, the idempotency hash is
 * iterative and canonical (the same JSON with its keys in another order is the same request).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/index.ts';
import { keyedApp, type KeyedApp } from './support.ts';
import { MAX_BODY_DEPTH } from '../../../services/api/plugins/body-depth.ts';
import { bodyHash } from '../../../services/api/auth/idempotency.ts';
import { canonicalJson } from '../../../services/api/auth/canonical-json.ts';

const deepArray = (n: number) => `${'['.repeat(n)}${']'.repeat(n)}`;
const deepObject = (n: number) => `${'{"a":'.repeat(n)}1${'}'.repeat(n)}`;

describe('canonicalJson and the idempotency body hash', () => {
  it('serialises like JSON.stringify with sorted keys', () => {
    const value = { b: [1, 'x', null, { d: true, c: 1.5 }], a: { z: 'é', y: [] }, e: {} };
    expect(canonicalJson(value)).toBe('{"a":{"y":[],"z":"é"},"b":[1,"x",null,{"c":1.5,"d":true}],"e":{}}');
    expect(JSON.parse(canonicalJson(value))).toEqual(value);
    for (const v of [null, 0, -1.25, 'a"\\\n', true, [], {}, [[[]]]]) expect(canonicalJson(v)).toBe(JSON.stringify(v));
  });

  it('never recurses: a 100,000-deep value is hashed (JSON.stringify overflows the stack)', () => {
    const deep = JSON.parse(deepArray(100_000)) as unknown;
    expect(() => JSON.stringify(deep)).toThrow(RangeError);
    expect(bodyHash('POST', '/v1/jobs/sweep', deep)).toMatch(/^[0-9a-f]{64}$/);
    const deepObj = JSON.parse(deepObject(100_000)) as unknown;
    expect(bodyHash('POST', '/x', deepObj)).toMatch(/^[0-9a-f]{64}$/);
  });

  it('hashes the same JSON with keys in another order alike, and different JSON apart', () => {
    expect(bodyHash('POST', '/p', { a: 1, b: { c: 2, d: 3 } })).toBe(bodyHash('POST', '/p', { b: { d: 3, c: 2 }, a: 1 }));
    expect(bodyHash('POST', '/p', { a: 1 })).not.toBe(bodyHash('POST', '/p', { a: 2 }));
    expect(bodyHash('POST', '/p', [1, 2])).not.toBe(bodyHash('POST', '/p', [2, 1]));
  });
});

describeEachBackend('body depth', (t) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(t.db(), t.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  async function jobCount(): Promise<number> {
    return Number(
      (
        await t
          .db()
          .selectFrom('job')
          .select((eb) => eb.fn.countAll<number>().as('n'))
          .executeTakeFirstOrThrow()
      ).n,
    );
  }

  it('refuses a 20,000-deep body to the job routes with an Idempotency-Key: 422 naming the limit, no job, no 500', async () => {
    const before = await jobCount();
    for (const url of ['/v1/jobs/sweep', '/v1/jobs/reresolve']) {
      // 10,000 levels of {"a": fit in the 64 KiB body limit (20,000 would be refused as too large first).
      for (const payload of [deepArray(20_000), deepObject(10_000)]) {
        const res = await k.call('admin', {
          method: 'POST',
          url,
          headers: { 'content-type': 'application/json', 'idempotency-key': `deep-${url}-${payload.length}-${payload[1]}` },
          payload,
        });
        expect(res.statusCode, `${url}: ${res.body.slice(0, 200)}`).toBe(422);
        expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
        expect(res.json()).toMatchObject({ code: 'BODY_TOO_DEEP', maxDepth: MAX_BODY_DEPTH });
        expect((res.json() as { detail: string }).detail).toContain(String(MAX_BODY_DEPTH));
      }
    }
    expect(await jobCount()).toBe(before);
  });

  it('gives the job routes a body schema: an unknown field is 422 naming it', async () => {
    for (const url of ['/v1/jobs/sweep', '/v1/jobs/reresolve']) {
      const res = await k.call('admin', { method: 'POST', url, payload: { everything: true } });
      expect(res.statusCode).toBe(422);
      expect(res.json()).toMatchObject({ code: 'VALIDATION_FAILED', errors: [{ pointer: '/everything' }] });
    }
  });

  it('limits depth on every route, NDJSON batches included; a body at the limit passes the depth check', async () => {
    const tooDeep = `{"source":"s","externalId":"e","text":"t","contract":${deepArray(MAX_BODY_DEPTH)}}`;
    const mention = await k.call('write', { method: 'POST', url: '/v1/mentions', headers: { 'content-type': 'application/json' }, payload: tooDeep });
    expect(mention.json()).toMatchObject({ code: 'BODY_TOO_DEEP' });
    const batch = await k.call('write', {
      method: 'POST',
      url: '/v1/mentions/batch',
      headers: { 'content-type': 'application/x-ndjson' },
      payload: `{"source":"s","externalId":"1","text":"t"}\n${tooDeep}\n`,
    });
    expect(batch.json()).toMatchObject({ code: 'BODY_TOO_DEEP' });
    // MAX_BODY_DEPTH levels in all (the outer object is level 1) is allowed: refused by the schema instead.
    const atLimit = `{"source":"s","externalId":"e","text":"t","contract":${deepArray(MAX_BODY_DEPTH - 1)}}`;
    const ok = await k.call('write', { method: 'POST', url: '/v1/mentions', headers: { 'content-type': 'application/json' }, payload: atLimit });
    expect(ok.json()).toMatchObject({ code: 'VALIDATION_FAILED' });
  });

  it('replays the same JSON body sent with its keys in another order instead of refusing the key', async () => {
    const headers = { 'content-type': 'application/json', 'idempotency-key': 'reorder-1' };
    const first = await k.call('admin', { method: 'POST', url: '/v1/own-entities', headers, payload: '{"name":"Varrowmere Holdings B.V.","country":"NL"}' });
    expect(first.statusCode).toBe(201);
    const again = await k.call('admin', { method: 'POST', url: '/v1/own-entities', headers, payload: '{"country":"NL","name":"Varrowmere Holdings B.V."}' });
    expect(again.statusCode, again.body).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    const other = await k.call('admin', { method: 'POST', url: '/v1/own-entities', headers, payload: '{"country":"BE","name":"Varrowmere Holdings B.V."}' });
    expect(other.json()).toMatchObject({ code: 'IDEMPOTENCY_KEY_REUSED' });
  });
});
