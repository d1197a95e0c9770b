/**
 * Issue 19 item 4: POST /v1/mentions/batch answers per item. One empty text used to refuse the whole batch; now the
 * valid items are taken and each invalid one answers its own problem in its place (index, field as a JSON pointer
 * inside the item, the schema rule), and an Idempotency-Key covers the batch as a whole. Invented names.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/database.ts';
import { keyedApp, type KeyedApp } from './support.ts';

describeEachBackend('POST /v1/mentions/batch, item by item', (ctx) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  const stored = async (source: string): Promise<string[]> =>
    (await ctx.db().selectFrom('mention').select('external_id').where('source', '=', source).orderBy('external_id').execute()).map((r) => r.external_id);

  it('takes the valid items and answers each invalid one with its own problem (index, field, rule)', async () => {
    const items = [
      { source: 'pb', externalId: 'p-1', text: 'Sallowfield Ceramics Ltd', country: 'GB' },
      { source: 'pb', externalId: 'p-2', text: '' },
      { source: 'pb', text: 'Brannock Valves GmbH' },
      42,
      { source: 'pb', externalId: 'p-5', text: 'Tollerby Freight AB', country: 'SE', colour: 'blue' },
      { source: 'pb', externalId: 'p-6', text: 'Ambervale Print Ltd', country: 'GB' },
    ];
    const res = await k.call('write', { method: 'POST', url: '/v1/mentions/batch', payload: items });
    expect(res.statusCode, res.body).toBe(200);
    const out = res.json() as {
      items: Array<{ index: number; status: string; externalId?: string; error?: { code: string; field: string; rule: string; message: string } }>;
      counts: Record<string, number>;
    };
    expect(out.items.map((i) => i.index)).toEqual([0, 1, 2, 3, 4, 5]);
    expect(out.items[0]!.status).not.toBe('rejected');
    expect(out.items[5]!.status).not.toBe('rejected');
    expect(out.items[1]).toMatchObject({ status: 'rejected', externalId: 'p-2', error: { code: 'VALIDATION_FAILED', field: '/text', rule: 'minLength' } });
    expect(out.items[1]!.error!.message).toBe('item 1: /text must be at least 1 characters long');
    expect(out.items[2]).toMatchObject({ status: 'rejected', error: { field: '/externalId', rule: 'required' } });
    expect(out.items[3]).toMatchObject({ status: 'rejected', error: { field: '', rule: 'type' } });
    expect(out.items[4]).toMatchObject({ status: 'rejected', externalId: 'p-5', error: { field: '/colour', rule: 'additionalProperties' } });
    expect(out.counts.rejected).toBe(4);
    expect(Object.values(out.counts).reduce((a, b) => a + b, 0)).toBe(items.length);
    // Nothing of a refused item is stored; the valid ones are.
    expect(await stored('pb')).toEqual(['p-1', 'p-6']);
  });

  it('numbers an item the register refuses, and a repeated id, by its place in the request, with its ids and a JSON pointer', async () => {
    // An LEI has 20 characters (ISO 17442): "123" cannot be one, and the register refuses it, not the schema.
    // Before, a schema refusal ahead of it shifted the register's count: this item answered index 1, no ids,
    // the register's own code (INVALID_INPUT) and the field without its leading slash.
    const items = [
      { source: 'pr', externalId: 'r-1', text: 'Gorsemoor Fittings Ltd', country: 'GB' },
      { source: 'pr', externalId: 'r-2', text: '' },
      { source: 'pr', externalId: 'r-3', text: 'Hexlow Dyes GmbH', identifiers: [{ scheme: 'lei', value: '123' }] },
      { source: 'pr', externalId: 'r-1', text: 'Gorsemoor Fittings Limited', country: 'GB' },
    ];
    const res = await k.call('write', { method: 'POST', url: '/v1/mentions/batch', payload: items });
    expect(res.statusCode, res.body).toBe(200);
    const out = res.json() as {
      items: Array<{ index: number; status: string; source?: string; externalId?: string; error?: { code: string; field: string; message: string } }>;
    };
    expect(out.items.map((i) => i.index)).toEqual([0, 1, 2, 3]);
    expect(out.items[0]!.status).not.toBe('rejected');
    expect(out.items[2]).toMatchObject({
      index: 2,
      status: 'rejected',
      source: 'pr',
      externalId: 'r-3',
      error: { code: 'VALIDATION_FAILED', field: '/identifiers/0' },
    });
    expect(out.items[2]!.error!.message).toMatch(/^item 2: identifiers\/0: LEI "123"/);
    expect(out.items[3]).toMatchObject({
      index: 3,
      status: 'rejected',
      externalId: 'r-1',
      error: { code: 'VALIDATION_FAILED', field: '/externalId', rule: 'unique' },
    });
    expect(out.items[3]!.error!.message).toContain('(items 0 and 3)');
    expect(await stored('pr')).toEqual(['r-1']);
  });

  it('still refuses a body that is not an array as a whole', async () => {
    const res = await k.call('write', { method: 'POST', url: '/v1/mentions/batch', payload: { source: 'pb', externalId: 'x', text: 'Quenby Tools Ltd' } });
    expect(res.statusCode).toBe(422);
    expect(res.json()).toMatchObject({ code: 'VALIDATION_FAILED' });
  });

  it('holds an Idempotency-Key for the batch as a whole: a retry answers the first answer, refusals included, and stores nothing twice', async () => {
    const items = [
      { source: 'pi', externalId: 'i-1', text: 'Wrenfold Pumps Ltd', country: 'GB' },
      { source: 'pi', externalId: 'i-2', text: '' },
    ];
    const headers = { 'idempotency-key': 'batch-items-1' };
    const first = await k.call('write', { method: 'POST', url: '/v1/mentions/batch', payload: items, headers });
    expect(first.statusCode, first.body).toBe(200);
    const again = await k.call('write', { method: 'POST', url: '/v1/mentions/batch', payload: items, headers });
    expect(again.statusCode).toBe(200);
    expect(again.json()).toEqual(first.json());
    expect(await stored('pi')).toEqual(['i-1']);
    const other = await k.call('write', { method: 'POST', url: '/v1/mentions/batch', payload: [items[0]], headers });
    expect(other.statusCode).toBe(422);
    expect(other.json().code).toBe('IDEMPOTENCY_KEY_REUSED');
  });
});
