import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/database.ts';
import { keyedApp, type KeyedApp } from './support.ts';

describeEachBackend('/v1 counterparties', (ctx) => {
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

  it('creates, reads with an ETag, patches with If-Match and refuses a stale ETag with 412', async () => {
    const { id, etag } = await create('Quillmere Logistics GmbH', { jurisdiction: 'DE' });
    const got = await k.call('read', { method: 'GET', url: `/v1/counterparties/${id}` });
    expect(got.statusCode).toBe(200);
    expect(got.headers.etag).toBe(etag);
    expect(got.json()).toMatchObject({ id, canonicalName: 'Quillmere Logistics GmbH', jurisdiction: 'DE', etag });
    const patched = await k.call('admin', {
      method: 'PATCH',
      url: `/v1/counterparties/${id}`,
      headers: { 'if-match': etag },
      payload: { name: 'Quillmere Logistik GmbH', addNames: [{ name: 'Quillmere', kind: 'trade' }], reason: 'test' },
    });
    expect(patched.statusCode, patched.body).toBe(200);
    expect(patched.json().canonicalName).toBe('Quillmere Logistik GmbH');
    expect(patched.headers.etag).not.toBe(etag);
    const stale = await k.call('admin', {
      method: 'PATCH',
      url: `/v1/counterparties/${id}`,
      headers: { 'if-match': etag },
      payload: { name: 'Other Name GmbH' },
    });
    expect(stale.statusCode).toBe(412);
    expect(stale.json().code).toBe('PRECONDITION_FAILED');
    const missing = await k.call('admin', { method: 'PATCH', url: `/v1/counterparties/${id}`, payload: { name: 'Other Name GmbH' } });
    expect(missing.statusCode).toBe(428);
    const after = await k.call('read', { method: 'GET', url: `/v1/counterparties/${id}` });
    expect(after.json().canonicalName).toBe('Quillmere Logistik GmbH');
  });

  it('takes back the field names GET answers: canonicalName renames (issue 19 item 4); name still works, both at once is refused', async () => {
    const { id } = await create('Vellacourt Instruments GmbH', { jurisdiction: 'DE' });
    const got = await k.call('read', { method: 'GET', url: `/v1/counterparties/${id}` });
    const body = got.json() as { canonicalName: string; etag: string };
    const renamed = await k.call('admin', {
      method: 'PATCH',
      url: `/v1/counterparties/${id}`,
      headers: { 'if-match': body.etag },
      payload: { canonicalName: 'Vellacourt Instrumente GmbH', reason: 'register spelling' },
    });
    expect(renamed.statusCode, renamed.body).toBe(200);
    expect(renamed.json().canonicalName).toBe('Vellacourt Instrumente GmbH');
    const both = await k.call('admin', {
      method: 'PATCH',
      url: `/v1/counterparties/${id}`,
      headers: { 'if-match': renamed.headers.etag as string },
      payload: { canonicalName: 'A GmbH', name: 'B GmbH' },
    });
    expect(both.statusCode).toBe(422);
    expect(both.json().errors).toEqual([{ pointer: '/name', message: 'give either canonicalName or name, not both' }]);
    const empty = await k.call('admin', {
      method: 'PATCH',
      url: `/v1/counterparties/${id}`,
      headers: { 'if-match': renamed.headers.etag as string },
      payload: { canonicalName: '' },
    });
    expect(empty.statusCode).toBe(422);
    expect(empty.body).toContain('canonicalName');
    expect((await k.call('read', { method: 'GET', url: `/v1/counterparties/${id}` })).json().canonicalName).toBe('Vellacourt Instrumente GmbH');
  });

  it('creates with canonicalName, the field GET answers (issue 19); name stays a deprecated alias; both, or neither, is refused', async () => {
    const made = await k.call('admin', {
      method: 'POST',
      url: '/v1/counterparties',
      payload: { canonicalName: 'Orrinford Marine Services Ltd', jurisdiction: 'GB' },
    });
    expect(made.statusCode, made.body).toBe(201);
    const got = await k.call('read', { method: 'GET', url: `/v1/counterparties/${made.json().counterpartyId}` });
    expect(got.json().canonicalName).toBe('Orrinford Marine Services Ltd');
    const alias = await k.call('admin', { method: 'POST', url: '/v1/counterparties', payload: { name: 'Orrinford Dredging Ltd' } });
    expect(alias.statusCode, alias.body).toBe(201);
    expect((await k.call('read', { method: 'GET', url: `/v1/counterparties/${alias.json().counterpartyId}` })).json().canonicalName).toBe(
      'Orrinford Dredging Ltd',
    );
    // The same refusal as PATCH gives (422 VALIDATION_FAILED, naming the field), and nothing is created.
    const before = (await k.call('read', { method: 'GET', url: '/v1/counterparties?q=Orrinford' })).body;
    const both = await k.call('admin', { method: 'POST', url: '/v1/counterparties', payload: { canonicalName: 'Orrinford A Ltd', name: 'Orrinford B Ltd' } });
    expect(both.statusCode).toBe(422);
    expect(both.headers['content-type']).toContain('application/problem+json');
    expect(both.json().errors).toEqual([{ pointer: '/name', message: 'give either canonicalName or name, not both' }]);
    const neither = await k.call('admin', { method: 'POST', url: '/v1/counterparties', payload: { jurisdiction: 'GB' } });
    expect(neither.statusCode).toBe(422);
    expect(neither.json().errors).toEqual([{ pointer: '/canonicalName', message: 'canonicalName is required (or its deprecated spelling name)' }]);
    const blank = await k.call('admin', { method: 'POST', url: '/v1/counterparties', payload: { canonicalName: '   ' } });
    expect(blank.statusCode).toBe(422);
    expect(blank.body).toContain('canonicalName');
    expect((await k.call('read', { method: 'GET', url: '/v1/counterparties?q=Orrinford' })).body).toBe(before);
  });

  it('merges with ETags, answers 308 for the merged id, and undoes the merge', async () => {
    const a = await create('Tarnwell Optics Ltd', { jurisdiction: 'GB' });
    const b = await create('Tarnwell Optics Limited', { jurisdiction: 'GB' });
    const merged = await k.call('admin', {
      method: 'POST',
      url: '/v1/counterparties/merge',
      payload: {
        items: [
          { id: a.id, etag: a.etag },
          { id: b.id, etag: b.etag },
        ],
        survivorId: a.id,
        reason: 'same company',
      },
    });
    expect(merged.statusCode, merged.body).toBe(200);
    expect(merged.json()).toMatchObject({ survivorId: a.id, mergedIds: [b.id] });
    const redirect = await k.call('read', { method: 'GET', url: `/v1/counterparties/${b.id}` });
    expect(redirect.statusCode).toBe(308);
    expect(redirect.headers.location).toBe(`/v1/counterparties/${a.id}`);
    const again = await k.call('admin', {
      method: 'POST',
      url: '/v1/counterparties/merge',
      payload: {
        items: [
          { id: a.id, etag: a.etag },
          { id: b.id, etag: b.etag },
        ],
        reason: 'again',
      },
    });
    expect(again.statusCode).toBe(412);
    const undo = await k.call('admin', { method: 'POST', url: `/v1/history/${merged.json().eventId}/undo`, payload: { reason: 'mistake' } });
    expect(undo.statusCode, undo.body).toBe(200);
    expect((await k.call('read', { method: 'GET', url: `/v1/counterparties/${b.id}` })).statusCode).toBe(200);
  });

  it('searches with highlight ranges', async () => {
    await create('Vellacourt Brewing Company LLC', { jurisdiction: 'US-DE' });
    const res = await k.call('read', { method: 'GET', url: '/v1/counterparties?q=vellacourt%20brewing' });
    expect(res.statusCode, res.body).toBe(200);
    const hit = res.json().items[0];
    expect(hit.canonicalName).toBe('Vellacourt Brewing Company LLC');
    expect(hit.highlight).toEqual([
      [0, 10],
      [11, 18],
    ]);
    const partial = await k.call('read', { method: 'GET', url: '/v1/counterparties?q=vellaco' });
    expect(partial.json().items.map((i: { canonicalName: string }) => i.canonicalName)).toContain('Vellacourt Brewing Company LLC');
  });
});
