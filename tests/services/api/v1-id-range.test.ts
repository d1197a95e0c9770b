/**
 * Issue 17 item 4: ids are safe positive integers. A number outside PostgreSQL's bigint answered 500, and one
 * above 2^53 was silently rounded to another id (JSON numbers are IEEE doubles): every id path parameter and id
 * body field is refused with 422 naming it, before anything is looked up.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import type { LightMyRequestResponse } from 'fastify';
import { createRegisterContext, resolveMention, stateSnapshot } from '../../../services/register/index.ts';
import { describeEachBackend } from '../../support/index.ts';
import { keyedApp, type KeyedApp } from './support.ts';

interface ProblemBody {
  code: string;
  detail: string;
  errors?: { pointer: string; message: string; in?: string }[];
}

function expectNamed(res: LightMyRequestResponse, pointer: string, where?: string): void {
  expect(res.statusCode, res.body).toBe(422);
  expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  const body = res.json() as ProblemBody;
  expect(body.code).toBe('VALIDATION_FAILED');
  expect(body.errors).toEqual(expect.arrayContaining([expect.objectContaining({ pointer, ...(where ? { in: where } : {}) })]));
  // The rule is named, not the number that was sent.
  expect(body.detail).not.toMatch(/9223372036854775808|922337203685477\d+|1e\+?300/);
}

const BIG = '9223372036854775808'; // 2^63: one past PostgreSQL's bigint
const JUST_UNSAFE = '9007199254740993'; // 2^53 + 1: parses as 2^53, another id

describeEachBackend('ids out of range', (t) => {
  let k: KeyedApp;
  let cp: number;
  let etag: string;
  beforeAll(async () => {
    const ctx = createRegisterContext(t.db());
    const r = await resolveMention(ctx, { source: 'range', externalId: '1', text: 'Quillfeather Ropeworks Ltd' }, { actor: 'test:range' });
    cp = r.counterpartyId!;
    k = await keyedApp(t.db(), t.backend);
    etag = String((await k.call('read', { method: 'GET', url: `/v1/counterparties/${cp}` })).headers.etag);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('refuses path ids beyond bigint or above 2^53 with 422 naming the parameter (was 500)', async () => {
    expectNamed(await k.call('read', { method: 'GET', url: `/v1/history/${BIG}` }), '/eventId', 'path');
    expectNamed(await k.call('admin', { method: 'POST', url: `/v1/history/${BIG}/undo`, payload: { reason: 'r' } }), '/eventId', 'path');
    expectNamed(await k.call('read', { method: 'GET', url: `/v1/counterparties/${JUST_UNSAFE}` }), '/id', 'path');
    expectNamed(await k.call('admin', { method: 'DELETE', url: `/v1/counterparties/${cp}/relations/1234567890123456789` }), '/relationId', 'path');
    expectNamed(await k.call('admin', { method: 'DELETE', url: `/v1/counterparties/${cp}/relations/${BIG}` }), '/relationId', 'path');
  });

  it('refuses body ids beyond bigint, above 2^53 or written as 1e300 with 422 naming the field', async () => {
    const json = { 'content-type': 'application/json' };
    const before = await stateSnapshot(t.db());
    expectNamed(
      await k.call('admin', { method: 'POST', url: `/v1/counterparties/${cp}/split`, headers: json, payload: `{"mentionIds":[${BIG}],"reason":"r"}` }),
      '/mentionIds/0',
    );
    expectNamed(
      await k.call('admin', {
        method: 'POST',
        url: `/v1/counterparties/${cp}/split`,
        headers: json,
        payload: '{"mentionIds":[1],"targetId":1e300,"reason":"r"}',
      }),
      '/targetId',
    );
    expectNamed(
      await k.call('admin', {
        method: 'POST',
        url: `/v1/counterparties/${cp}/relations`,
        headers: json,
        payload: `{"toId":${JUST_UNSAFE},"type":"parent_of"}`,
      }),
      '/toId',
    );
    expectNamed(
      await k.call('admin', {
        method: 'POST',
        url: '/v1/counterparties/merge',
        headers: json,
        payload: `{"items":[{"id":${cp},"etag":${JSON.stringify(etag)}},{"id":${BIG},"etag":"\\"cp1.v1\\""}],"survivorId":${cp},"reason":"r"}`,
      }),
      '/items/1/id',
    );
    expectNamed(
      await k.call('admin', {
        method: 'POST',
        url: '/v1/counterparties/merge',
        headers: json,
        payload: `{"items":[{"id":${cp},"etag":"x"},{"id":2,"etag":"y"}],"survivorId":${JUST_UNSAFE},"reason":"r"}`,
      }),
      '/survivorId',
    );
    expect(await stateSnapshot(t.db())).toEqual(before);
  });

  it('refuses an integer query value beyond 2^53 (limits are integers too)', async () => {
    expectNamed(await k.call('read', { method: 'GET', url: `/v1/counterparties?limit=${BIG}` }), '/limit', 'query');
  });

  it('still takes the largest safe id (404 for one that does not exist)', async () => {
    const res = await k.call('read', { method: 'GET', url: `/v1/history/${Number.MAX_SAFE_INTEGER}` });
    expect(res.statusCode).toBe(404);
  });
});
