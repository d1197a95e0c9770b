/**
 * Issue 17 item 3: text PostgreSQL cannot store (NUL, a lone surrogate) is refused at the door wherever it comes
 * from — body, query string, path parameter or header — with 400 UNSTORABLE_TEXT naming the parameter, never a
 * 500 from the driver. The query parser's and the router's objects are not plain objects: the check used to skip
 * them. A surrogate cannot travel in a URL except as invalid UTF-8 (its CESU-8 bytes %ED%A0%80): refused the same way.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import type { LightMyRequestResponse } from 'fastify';
import { describeEachBackend } from '../../support/index.ts';
import { keyedApp, type KeyedApp } from './support.ts';

interface ProblemBody {
  code: string;
  status: number;
  detail: string;
  errors?: { pointer: string; message: string; in?: string }[];
}

function expectRefused(res: LightMyRequestResponse, where: string, pointer: string): ProblemBody {
  expect(res.statusCode, res.body).toBe(400);
  expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  const body = res.json() as ProblemBody;
  expect(body.code).toBe('UNSTORABLE_TEXT');
  expect(body.errors?.[0]).toMatchObject({ pointer, in: where });
  return body;
}

describeEachBackend('text the database cannot store, from every part of a request', (t) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(t.db(), t.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('refuses a NUL in a query-string parameter (400 naming it), not 500', async () => {
    expectRefused(await k.call('read', { method: 'GET', url: '/v1/contracts?source=a%00b' }), 'query', '/source');
    expectRefused(await k.call('read', { method: 'GET', url: '/v1/contracts?q=a%00b' }), 'query', '/q');
    expectRefused(await k.call('read', { method: 'GET', url: '/v1/counterparties?q=%00' }), 'query', '/q');
    // A repeated parameter arrives as an array: each value is checked.
    expectRefused(await k.call('read', { method: 'GET', url: '/v1/counterparties?q=ok&q=x%00' }), 'query', '/q/1');
  });

  it('refuses a NUL in a path parameter (400 naming it), not 500', async () => {
    const body = expectRefused(await k.call('admin', { method: 'DELETE', url: '/v1/keys/k%00' }), 'path', '/keyId');
    // The message names the parameter and the rule, never the caller's value.
    expect(body.detail).toContain('keyId');
    expect(body.detail).not.toContain('\u0000');
  });

  it('refuses a lone surrogate sent as its CESU-8 bytes in the query or the path', async () => {
    expectRefused(await k.call('read', { method: 'GET', url: '/v1/contracts?source=%ED%A0%80' }), 'query', '/source');
    expectRefused(await k.call('read', { method: 'GET', url: '/v1/counterparties?q=a%ED%B0%80' }), 'query', '/q');
    // A parameter name that does not decode is named by its part alone.
    const nameless = expectRefused(await k.call('read', { method: 'GET', url: '/v1/counterparties?%ED%A0%80=x' }), 'query', '');
    expect(nameless.detail).toMatch(/^the query string has a parameter name/);
    const path = await k.call('admin', { method: 'DELETE', url: '/v1/keys/k%ED%A0%80' });
    expect(path.statusCode).toBe(400);
    expect(path.headers['content-type']).toMatch(/^application\/problem\+json/);
  });

  it('refuses a NUL or a lone surrogate in a body field with the same code', async () => {
    expectRefused(
      await k.call('write', { method: 'POST', url: '/v1/mentions', payload: { source: 's', externalId: 'e', text: 'A\u0000B Ltd' } }),
      'body',
      '/text',
    );
    expectRefused(
      await k.call('write', {
        method: 'POST',
        url: '/v1/mentions',
        headers: { 'content-type': 'application/json' },
        payload: '{"source":"s","externalId":"\\ud800","text":"x"}',
      }),
      'body',
      '/externalId',
    );
  });

  it('refuses a NUL in a header value', async () => {
    // Node's HTTP parser refuses NUL in a header on a socket; inject does not, so the app must.
    const res = await k.call('read', { method: 'GET', url: '/v1/me', headers: { 'x-note': 'a\u0000b' } });
    expectRefused(res, 'header', '/x-note');
  });

  it('still answers plain requests', async () => {
    expect((await k.call('read', { method: 'GET', url: '/v1/contracts?source=clm' })).statusCode).toBe(200);
    expect((await k.call('read', { method: 'GET', url: '/v1/counterparties?q=Gr%C3%BCnwald' })).statusCode).toBe(200);
  });
});
