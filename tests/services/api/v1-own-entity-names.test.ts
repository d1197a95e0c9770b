/**
 * POST /v1/own-entities with `otherNames` (issue 16, item 6): an own entity declared with a trading name is ours when
 * a mention or a contract names it so, over the API on both backends. Invented names only.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/database.ts';
import { keyedApp, type KeyedApp } from './support.ts';

const CONTRACT = `This Distribution Agreement is made on 3 March 2025 between Orvanel Trading, of 4-2 Minato Street, Tokyo (the "Distributor"), and Pellingham Freight Limited, a company incorporated in England and Wales (the "Carrier").`;

describeEachBackend('/v1/own-entities other names', (ctx) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('adds an own entity with a trading name, lists it, and resolves the trading name to it', async () => {
    const own = await k.call('admin', {
      method: 'POST',
      url: '/v1/own-entities',
      payload: { name: 'Orvanel Japan K.K.', country: 'JP', otherNames: [{ name: 'Orvanel Trading', kind: 'trade' }] },
    });
    expect(own.statusCode, own.body).toBe(201);
    expect(own.json()).toMatchObject({ created: true, otherNamesAdded: ['Orvanel Trading'] });
    const list = await k.call('read', { method: 'GET', url: '/v1/own-entities' });
    expect(list.json().items).toEqual([expect.objectContaining({ name: 'Orvanel Japan K.K.', otherNames: [{ name: 'Orvanel Trading', kind: 'trade' }] })]);

    const contract = await k.call('write', { method: 'POST', url: '/v1/contracts', payload: { source: 'clm', externalId: 'OJ-1', text: CONTRACT } });
    expect(contract.statusCode, contract.body).toBeLessThan(300);
    const statuses = contract.json().parties.map((p: { status: string }) => p.status);
    expect(statuses).toEqual(['own_entity', 'new']);

    const mention = await k.call('write', { method: 'POST', url: '/v1/mentions', payload: { source: 'erp', externalId: 'oj-1', text: 'Orvanel Trading' } });
    expect(mention.json()).toMatchObject({ status: 'own_entity', counterpartyId: null });

    // Posting the entity again with a name it lacks adds that name (200: the entity was already listed).
    const again = await k.call('admin', {
      method: 'POST',
      url: '/v1/own-entities',
      payload: { name: 'Orvanel Japan K.K.', country: 'JP', otherNames: [{ name: 'Orvanel Nihon', kind: 'former' }] },
    });
    expect(again.statusCode, again.body).toBe(200);
    expect(again.json()).toMatchObject({ created: false, otherNamesAdded: ['Orvanel Nihon'] });
  });

  it('refuses an other name of a kind an own entity cannot have, naming the field', async () => {
    const bad = await k.call('admin', {
      method: 'POST',
      url: '/v1/own-entities',
      payload: { name: 'Orvanel Korea Co., Ltd.', otherNames: [{ name: 'Orvanel KR', kind: 'observed' }] },
    });
    expect(bad.statusCode).toBeGreaterThanOrEqual(400);
    expect(bad.statusCode).toBeLessThan(500);
    expect(bad.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(bad.body).toContain('otherNames');
  });
});
