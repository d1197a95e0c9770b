/**
 * Guessing keys is limited per client address: after the allowed failed authentications in a minute, the address
 * is answered 429 with Retry-After, without a key lookup, until its bucket refills; another address is not affected.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import type { FastifyInstance } from 'fastify';
import { buildApp } from '../../../services/api/app.ts';
import { createApiKey } from '../../../services/api/auth/keys.ts';
import { describeEachBackend } from '../../support/database.ts';

const ALLOWED = 5;

describeEachBackend('failed authentications per address', (t) => {
  let app: FastifyInstance;
  let good: string;
  beforeAll(async () => {
    app = await buildApp({ db: t.db(), backend: t.backend, rateLimitPerMinute: 1000, failedAuthPerMinute: ALLOWED });
    good = (await createApiKey(t.db(), { scope: 'read', label: 'failed-auth test' })).secret;
  });
  afterAll(async () => {
    await app?.close();
  });

  const me = (key: string, address: string) =>
    app.inject({ method: 'GET', url: '/v1/me', headers: { authorization: `Bearer ${key}` }, remoteAddress: address });

  it('answers 401 for the allowed failures, then 429 with Retry-After, and leaves another address alone', async () => {
    for (let i = 0; i < ALLOWED; i++) expect((await me(`cpreg_k0_guess${i}`, '192.0.2.10')).statusCode).toBe(401);
    const refused = await me('cpreg_k0_guess-more', '192.0.2.10');
    expect(refused.statusCode).toBe(429);
    expect(refused.json()).toMatchObject({ code: 'RATE_LIMITED', limitPer: 'minute' });
    expect(Number(refused.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    // The address is refused before any key is looked up, a right one included.
    expect((await me(good, '192.0.2.10')).statusCode).toBe(429);
    // Another address (TEST-NET-1, RFC 5737) is not affected.
    expect((await me(good, '192.0.2.20')).statusCode).toBe(200);
    expect((await me('cpreg_k0_other', '192.0.2.20')).statusCode).toBe(401);
  });
});
