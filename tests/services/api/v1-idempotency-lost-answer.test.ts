/**
 * Issue 17 item 15, second half: the idempotency claim is written before the work and the answer after it, outside
 * the work's transaction. A process that dies after the work committed and before the answer was stored left a
 * claim without an answer; ten minutes later a retry took the claim over and did the work again (a second
 * counterparty, a second API key). The work's transaction now stamps the claim, and such a retry answers 409
 * IDEMPOTENT_ANSWER_LOST without doing anything. The crash is reproduced by clearing the stored answer and ageing
 * the claim, which is exactly what the dead process leaves behind. Names are invented.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/index.ts';
import { ABANDONED_AFTER_MS } from '../../../services/api/auth/idempotency.ts';
import { keyedApp, type KeyedApp } from './support.ts';

describeEachBackend('idempotency: an answer lost after the work committed', (t) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(t.db(), t.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  const count = async (table: 'counterparty' | 'api_key'): Promise<number> =>
    Number(
      (
        await t
          .db()
          .selectFrom(table)
          .select((eb) => eb.fn.countAll<number>().as('n'))
          .executeTakeFirstOrThrow()
      ).n,
    );
  /** What a process that died between the commit and storing the answer leaves: a claim without an answer, gone stale. */
  const loseAnswer = async (key: string, options: { committed?: boolean } = {}): Promise<void> => {
    await t
      .db()
      .updateTable('idempotency_record')
      .set({
        status_code: null,
        response: null,
        created_at: new Date(Date.now() - ABANDONED_AFTER_MS - 60_000),
        ...(options.committed === false ? { work_committed_at: null } : {}),
      })
      .where('idempotency_key', '=', key)
      .execute();
  };

  it('a retry after the answer was lost does not create the counterparty a second time', async () => {
    const send = () =>
      k.call('admin', { method: 'POST', url: '/v1/counterparties', payload: { name: 'Harrowgate Lanterns Ltd' }, headers: { 'idempotency-key': 'lost-cp-1' } });
    const before = await count('counterparty');
    expect((await send()).statusCode).toBe(201);
    const record = await t.db().selectFrom('idempotency_record').selectAll().where('idempotency_key', '=', 'lost-cp-1').executeTakeFirstOrThrow();
    expect(record.work_committed_at).not.toBeNull();
    await loseAnswer('lost-cp-1');
    const retry = await send();
    expect(retry.statusCode, retry.body).toBe(409);
    expect((retry.json() as { code: string }).code).toBe('IDEMPOTENT_ANSWER_LOST');
    expect(await count('counterparty')).toBe(before + 1);
  });

  it('a retry after the answer was lost does not create a second API key', async () => {
    const send = () =>
      k.call('admin', {
        method: 'POST',
        url: '/v1/keys',
        payload: { scope: 'read', label: 'Lost answer probe' },
        headers: { 'idempotency-key': 'lost-key-1' },
      });
    const before = await count('api_key');
    expect((await send()).statusCode).toBe(201);
    await loseAnswer('lost-key-1');
    const retry = await send();
    expect(retry.statusCode, retry.body).toBe(409);
    expect(await count('api_key')).toBe(before + 1);
  });

  it('a claim abandoned before its work committed is taken over and the work is done once', async () => {
    const send = () =>
      k.call('admin', {
        method: 'POST',
        url: '/v1/counterparties',
        payload: { name: 'Wimbrel Quay Chandlers Ltd' },
        headers: { 'idempotency-key': 'lost-cp-2' },
      });
    const before = await count('counterparty');
    expect((await send()).statusCode).toBe(201);
    // As if the first process had died before its commit: no stamp (its counterparty stays here, so the count
    // below shows the takeover doing the work once more, which is right when the first run committed nothing).
    await loseAnswer('lost-cp-2', { committed: false });
    const taken = await send();
    expect(taken.statusCode, taken.body).toBe(201);
    expect(taken.headers['idempotent-replayed']).toBeUndefined();
    expect(await count('counterparty')).toBe(before + 2);
    // …and its answer is stored now: a further retry replays it.
    expect((await send()).headers['idempotent-replayed']).toBe('true');
  });

  it('a request refused before any work leaves no stamp', async () => {
    const res = await k.call('admin', {
      method: 'POST',
      url: '/v1/counterparties/merge',
      payload: {
        items: [
          { id: 999999991, etag: '"x"' },
          { id: 999999992, etag: '"y"' },
        ],
        reason: 'probe',
      },
      headers: { 'idempotency-key': 'no-work-1' },
    });
    expect(res.statusCode).toBeGreaterThanOrEqual(400);
    const record = await t.db().selectFrom('idempotency_record').selectAll().where('idempotency_key', '=', 'no-work-1').executeTakeFirst();
    expect(record?.work_committed_at ?? null).toBeNull();
  });
});
