/**
 * PATCH /v1/counterparties/{id} with `jurisdiction` (issue 7: rename, jurisdiction, names, identifiers).
 * Invented names; code forms from ISO 3166-1 alpha-2 and ISO 3166-2.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/database.ts';
import { keyedApp, type KeyedApp } from './support.ts';

describeEachBackend('/v1 PATCH jurisdiction', (ctx) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  async function create(name: string, extra: Record<string, unknown> = {}): Promise<{ id: number; etag: string }> {
    const res = await k.call('admin', { method: 'POST', url: '/v1/counterparties', payload: { name, ...extra } });
    expect(res.statusCode, res.body).toBe(201);
    return { id: res.json().counterpartyId, etag: res.headers.etag as string };
  }
  const patch = (id: number, etag: string | undefined, payload: unknown) =>
    k.call('admin', {
      method: 'PATCH',
      url: `/v1/counterparties/${id}`,
      headers: etag ? { 'if-match': etag } : {},
      payload: payload as Record<string, unknown>,
    });

  it('sets and clears the jurisdiction, one jurisdiction_changed event each, visible in history and the change feed', async () => {
    const { id, etag } = await create('Ravenstoke Instruments Ltd', { jurisdiction: 'GB' });
    const set = await patch(id, etag, { jurisdiction: 'US-DE', reason: 'reincorporated in Delaware' });
    expect(set.statusCode, set.body).toBe(200);
    expect(set.json()).toMatchObject({ id, jurisdiction: 'US-DE' });
    expect(set.headers.etag).not.toBe(etag);
    const got = await k.call('read', { method: 'GET', url: `/v1/counterparties/${id}` });
    expect(got.json().jurisdiction).toBe('US-DE');
    const history = await k.call('read', { method: 'GET', url: `/v1/counterparties/${id}/history` });
    const event = (history.json().items as { type: string; details: Record<string, unknown>; reason: string | null }[]).find(
      (e) => e.type === 'jurisdiction_changed',
    );
    expect(event).toMatchObject({ details: { counterpartyId: id, from: 'GB', to: 'US-DE' }, reason: 'reincorporated in Delaware' });

    const cleared = await patch(id, set.headers.etag as string, { jurisdiction: null });
    expect(cleared.statusCode, cleared.body).toBe(200);
    expect(cleared.json().jurisdiction).toBeNull();
  });

  it('applies the jurisdiction before the identifiers of the same request, and undo brings the old one back', async () => {
    const { id, etag } = await create('Ravenstoke Optics');
    // A GB company number: eight digits (Companies House format, common practice); invented value.
    const res = await patch(id, etag, { jurisdiction: 'GB', addIdentifiers: [{ scheme: 'gb_company', value: '04561238' }] });
    expect(res.statusCode, res.body).toBe(200);
    expect(res.json()).toMatchObject({ jurisdiction: 'GB', identifiers: [expect.objectContaining({ scheme: 'gb_company', value: '04561238' })] });
    const history = await k.call('read', { method: 'GET', url: `/v1/counterparties/${id}/history` });
    const items = history.json().items as { id: number; type: string }[];
    const jurisdictionEvent = items.find((e) => e.type === 'jurisdiction_changed')!;
    const identifierEvent = items.find((e) => e.type === 'identifier_added')!;
    expect(jurisdictionEvent.id).toBeLessThan(identifierEvent.id);
    expect((await k.call('admin', { method: 'POST', url: `/v1/history/${identifierEvent.id}/undo`, payload: { reason: 'test: undo' } })).statusCode).toBe(200);
    const undone = await k.call('admin', { method: 'POST', url: `/v1/history/${jurisdictionEvent.id}/undo`, payload: { reason: 'test: undo' } });
    expect(undone.statusCode, undone.body).toBe(200);
    expect((await k.call('read', { method: 'GET', url: `/v1/counterparties/${id}` })).json().jurisdiction).toBeNull();
  });

  it('refuses a bad code with 422 naming the field, a stale ETag with 412, and a read key with 403; nothing changes', async () => {
    const { id, etag } = await create('Ravenstoke Gauges Ltd', { jurisdiction: 'GB' });
    for (const bad of ['Britain', 'gb', 'GBR', 'US_DE', 7]) {
      const res = await patch(id, etag, { jurisdiction: bad });
      expect(res.statusCode, `${String(bad)}: ${res.body}`).toBe(422);
      expect(res.json().code).toBe('VALIDATION_FAILED');
      expect(res.body).toContain('jurisdiction');
    }
    // A bad jurisdiction stops the whole request: the rename in it is not written either.
    expect((await patch(id, etag, { name: 'Ravenstoke Gauges Limited', jurisdiction: 'XYZ' })).statusCode).toBe(422);
    const moved = await patch(id, etag, { jurisdiction: 'IE' });
    expect(moved.statusCode).toBe(200);
    const stale = await patch(id, etag, { jurisdiction: 'FR' });
    expect(stale.statusCode).toBe(412);
    const forbidden = await k.call('read', {
      method: 'PATCH',
      url: `/v1/counterparties/${id}`,
      headers: { 'if-match': moved.headers.etag as string },
      payload: { jurisdiction: 'FR' },
    });
    expect(forbidden.statusCode).toBe(403);
    const after = (await k.call('read', { method: 'GET', url: `/v1/counterparties/${id}` })).json();
    expect(after).toMatchObject({ canonicalName: 'Ravenstoke Gauges Ltd', jurisdiction: 'IE' });
  });
});
