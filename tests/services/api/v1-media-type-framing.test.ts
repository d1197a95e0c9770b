/**
 * Issue 17 item 12: a body of the wrong media type answered 422 "(root) must be object" (fastify parsed text/plain
 * as a string); it is 415 problem+json. Errors raised before a route runs — a bad percent-encoding in the path, a
 * path parameter too long for the router, an oversized header block (431), malformed HTTP framing (400), a client
 * that is too slow (408) — answered fastify's own `{"error":"Bad Request","message":"Client Error"}`: they are
 * problem+json with a code too. These last ones need a real socket (inject does no HTTP framing).
 */
import { connect } from 'node:net';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, expect, it } from 'vitest';
import type { LightMyRequestResponse } from 'fastify';
import { describeEachBackend } from '../../support/index.ts';
import { keyedApp, type KeyedApp } from './support.ts';

function expectProblem(res: LightMyRequestResponse, status: number, code: string): void {
  expect(res.statusCode, res.body).toBe(status);
  expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
  expect(res.json()).toMatchObject({ status, code, type: `urn:cpreg:problem:${code}` });
}

/** Writes raw bytes to the server and answers what came back (status line, headers, body). */
async function raw(port: number, bytes: string | Buffer): Promise<{ status: number; headers: string; body: string }> {
  return new Promise((resolve, reject) => {
    const socket = connect(port, '127.0.0.1');
    const chunks: Buffer[] = [];
    socket.on('data', (c: Buffer) => chunks.push(c));
    socket.on('error', () => undefined); // the server closes the connection after a framing error
    socket.on('close', () => {
      const text = Buffer.concat(chunks).toString('utf8');
      const [head = '', body = ''] = text.split('\r\n\r\n');
      const status = Number(/^HTTP\/1\.1 (\d{3})/.exec(head)?.[1] ?? 0);
      if (status === 0) reject(new Error(`no HTTP answer: ${JSON.stringify(text.slice(0, 200))}`));
      else resolve({ status, headers: head, body });
    });
    socket.write(bytes);
  });
}

describeEachBackend('media types and framing errors', (t) => {
  let k: KeyedApp;
  let port: number;
  beforeAll(async () => {
    k = await keyedApp(t.db(), t.backend);
    await k.app.listen({ port: 0, host: '127.0.0.1' });
    port = (k.app.server.address() as AddressInfo).port;
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('answers 415 problem+json for a body of another media type (was 422 "(root) must be object")', async () => {
    for (const contentType of [
      'text/plain',
      'text/plain; charset=utf-8',
      'application/xml',
      'application/x-www-form-urlencoded',
      'multipart/form-data; boundary=x',
    ]) {
      const res = await k.call('write', {
        method: 'POST',
        url: '/v1/mentions',
        headers: { 'content-type': contentType },
        payload: 'source=s&externalId=e&text=t',
      });
      expectProblem(res, 415, 'UNSUPPORTED_MEDIA_TYPE');
      // The message names what is accepted, never the caller's header.
      expect((res.json() as { detail: string }).detail).not.toContain(contentType);
    }
    expectProblem(
      await k.call('admin', { method: 'POST', url: '/v1/jobs/sweep', headers: { 'content-type': 'text/plain' }, payload: 'go' }),
      415,
      'UNSUPPORTED_MEDIA_TYPE',
    );
  });

  it('names the media types the route takes: an upload route does not advise application/json, which it refuses too', async () => {
    // Each told its caller to "send application/json": the ingest route takes NDJSON only, the contract route a zip.
    const ingest = await k.call('write', {
      method: 'POST',
      url: '/v1/jobs/ingest?source=s',
      headers: { 'content-type': 'text/csv' },
      payload: 'source,text\ns,t\n',
    });
    expectProblem(ingest, 415, 'UNSUPPORTED_MEDIA_TYPE');
    expect((ingest.json() as { detail: string }).detail).toMatch(/send application\/x-ndjson$/);
    const contracts = await k.call('write', { method: 'POST', url: '/v1/jobs/contracts', headers: { 'content-type': 'text/plain' }, payload: 'a contract' });
    expectProblem(contracts, 415, 'UNSUPPORTED_MEDIA_TYPE');
    expect((contracts.json() as { detail: string }).detail).toMatch(/send application\/zip or multipart\/form-data$/);
    const mention = await k.call('write', { method: 'POST', url: '/v1/mentions', headers: { 'content-type': 'text/csv' }, payload: 'x' });
    expect((mention.json() as { detail: string }).detail).toMatch(/send application\/json$/);
  });

  it('answers a bad percent-encoding in the path and an over-long path parameter with problem+json', async () => {
    expectProblem(await k.call('read', { method: 'GET', url: '/v1/counterparties/%E0%A4%A' }), 400, 'BAD_REQUEST');
    expectProblem(await k.call('admin', { method: 'DELETE', url: `/v1/keys/${'k'.repeat(600)}` }), 414, 'URI_TOO_LONG');
  });

  it('answers an oversized header block with 431 problem+json', async () => {
    const res = await raw(port, `GET /v1/counterparties?q=${'a'.repeat(60_000)} HTTP/1.1\r\nHost: x\r\n\r\n`);
    expect(res.status).toBe(431);
    expect(res.headers).toMatch(/content-type: application\/problem\+json/i);
    expect(JSON.parse(res.body)).toMatchObject({ status: 431, code: 'HEADERS_TOO_LARGE' });
  });

  it('answers malformed HTTP framing with 400 problem+json', async () => {
    for (const bytes of [
      'GARBAGE\r\n\r\n',
      'GET / HTTP/1.1\r\nHost: x\r\nContent-Length: 5\r\nContent-Length: 6\r\n\r\nhello',
      'POST /v1/mentions HTTP/1.1\r\nHost: x\r\nTransfer-Encoding: chunked\r\n\r\nzz\r\n',
    ]) {
      const res = await raw(port, bytes);
      expect(res.status, bytes).toBe(400);
      expect(res.headers).toMatch(/content-type: application\/problem\+json/i);
      expect(JSON.parse(res.body)).toMatchObject({ status: 400, code: 'BAD_REQUEST' });
    }
  });

  it('still answers afterwards', async () => {
    expect((await k.call('read', { method: 'GET', url: '/v1/me' })).statusCode).toBe(200);
  });
});
