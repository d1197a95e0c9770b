/**
 * The log output of a run (pino at trace, the most verbose, with the service's own logger options) carries no
 * API key, no Authorization header and no full IBAN or phone number, whatever the requests put in bodies, query
 * strings and errors. The IBAN is the IBAN registry's GB example (from memory); the phone is in London's
 * drama range 020 7946 0xxx reserved for fiction (Ofcom, from memory).
 */
import { Writable } from 'node:stream';
import pino from 'pino';
import { expect, it } from 'vitest';
import { buildApp } from '../../services/api/app.ts';
import { loggerOptions } from '../../services/api/logger.ts';
import { createApiKey } from '../../services/api/auth/keys.ts';
import { describeEachBackend } from '../support/index.ts';

const IBAN = 'GB82WEST12345698765432';
const IBAN_SPACED = 'GB82 WEST 1234 5698 7654 32';
const PHONE = '+442079460999';
// The same kinds of value in the other shapes people write them (issue: masks missed these).
const PHONE_SPACED = '+44 20 7946 0999';
const PHONE_NATIONAL = '(020) 7946 0999';
const IBAN_LOWER = 'gb82west12345698765432';
const EMAIL = 'accounts.payable@glimmerdale-haulage.example';

describeEachBackend('log redaction', (t) => {
  it("no key, Authorization header, full IBAN or phone number in a run's logs", async () => {
    const lines: string[] = [];
    const sink = new Writable({
      write(chunk, _encoding, done) {
        lines.push(String(chunk));
        done();
      },
    });
    const logger = pino(loggerOptions('trace'), sink);
    const app = await buildApp({ db: t.db(), backend: t.backend, logger, rateLimitPerMinute: false });
    const admin = (await createApiKey(t.db(), { scope: 'admin', label: 'log test admin' })).secret;
    const read = (await createApiKey(t.db(), { scope: 'read', label: 'log test read' })).secret;
    const auth = (key: string) => ({ authorization: `Bearer ${key}` });
    try {
      const created = await app.inject({
        method: 'POST',
        url: '/v1/mentions',
        headers: auth(admin),
        payload: {
          source: 'log',
          externalId: '1',
          text: 'Glimmerdale Haulage Ltd',
          address: '3 Fenwick Row',
          identifiers: [
            { scheme: 'iban', value: IBAN_SPACED },
            { scheme: 'phone', value: PHONE },
          ],
        },
      });
      expect(created.statusCode).toBeLessThan(300);
      // The same values in query strings, bad input and errors.
      await app.inject({ method: 'GET', url: `/v1/counterparties?q=${encodeURIComponent(IBAN)}`, headers: auth(read) });
      await app.inject({ method: 'GET', url: `/v1/counterparties?q=${encodeURIComponent(PHONE)}&cursor=${IBAN}`, headers: auth(read) });
      await app.inject({
        method: 'POST',
        url: '/v1/mentions',
        headers: auth(admin),
        payload: { source: 'log', externalId: '2', text: 'x', identifiers: [{ scheme: 'iban', value: 'GB82WEST12345698765433' }] },
      });
      await app.inject({
        method: 'POST',
        url: '/v1/mentions',
        headers: auth(admin),
        payload: { source: 'log', externalId: '3', text: 'y', identifiers: [{ scheme: 'phone', value: `${PHONE}9999` }] },
      });
      await app.inject({ method: 'POST', url: '/v1/mentions', headers: auth(read), payload: { source: 'log', externalId: '4', text: IBAN } });
      await app.inject({ method: 'GET', url: '/v1/me', headers: { authorization: `Bearer ${admin}x` } });
      await app.inject({ method: 'GET', url: '/v1/me', headers: { authorization: admin } });
      await app.inject({ method: 'GET', url: `/v1/nowhere/${IBAN}?k=${admin}`, headers: auth(admin) });
      // Other shapes, in a body the schema refuses (the error names the field) and in a path that does not exist.
      await app.inject({
        method: 'POST',
        url: '/v1/mentions',
        headers: auth(admin),
        payload: { source: 'log', externalId: '5', text: `${EMAIL} ${PHONE_SPACED}`, unknownField: `${IBAN_LOWER} ${PHONE_NATIONAL}` },
      });
      await app.inject({
        method: 'GET',
        url: `/v1/nowhere/${encodeURIComponent(EMAIL)}/${encodeURIComponent(PHONE_SPACED)}/${IBAN_LOWER}`,
        headers: auth(admin),
      });
      app.log.info(`a message quoting ${EMAIL}, ${PHONE_SPACED}, ${PHONE_NATIONAL} and ${IBAN_LOWER}`);
    } finally {
      await app.close();
    }
    logger.flush();
    const text = lines.join('');
    expect(lines.length).toBeGreaterThan(10); // the run really logged (trace level)
    for (const secret of [admin, read, admin.slice(0, 24), read.slice(0, 24)]) expect(text).not.toContain(secret);
    expect(text).not.toMatch(/Bearer\s+cpreg_/);
    expect(text).not.toMatch(/"authorization":"(?!\[redacted\])/i);
    for (const value of [IBAN, IBAN_SPACED, 'GB82WEST12345698765433', PHONE, PHONE.slice(1), encodeURIComponent(PHONE)]) expect(text).not.toContain(value);
    for (const value of [PHONE_SPACED, PHONE_NATIONAL, '7946 0999', IBAN_LOWER, EMAIL, 'accounts.payable@', encodeURIComponent(EMAIL)])
      expect(text, value).not.toContain(value);
    expect(text).toContain('[email redacted]');
  });
});
