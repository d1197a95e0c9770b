/**
 * GET /v1/review-items in priority order (the default) and oldest first, and a decision with scope "group",
 * over fastify inject on both backends. Invented names; the ranking itself is unit-tested in
 * tests/resolvers/score/rank-review-items.test.ts.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/database.ts';
import { keyedApp, type KeyedApp } from './support.ts';

describeEachBackend('/v1/review-items order and group decisions', (ctx) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
    const contract = (id: string, name: string) => ({
      source: 'clm',
      externalId: id,
      text: `This Services Agreement is made between ${name}, a company incorporated in England (the "Provider"), and Dallowmere Foods Ltd (the "Client").`,
    });
    for (const [id, name] of [
      ['r-0', 'Hartsell Cold Chain Limited'],
      ['r-1', 'Wexbury Signals Limited'],
      ['r-2', 'Wexbury Signals Limited'],
    ]) {
      const stored = await k.call('write', { method: 'POST', url: '/v1/contracts', payload: contract(id!, name!) });
      expect(stored.statusCode, stored.body).toBe(200);
    }
    // Names alone (no legal form, no country): equal names with nothing to confirm them go to a person.
    for (const [id, text] of [
      ['h-1', 'Hartsell Cold Chain'],
      ['w-1', 'Wexbury Signals'],
      ['w-2', 'WEXBURY SIGNALS'],
    ]) {
      const r = await k.call('write', { method: 'POST', url: '/v1/mentions', payload: { source: 'queue', externalId: id, text } });
      expect(r.json().status, text).toBe('review');
    }
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('lists the group touching more contracts first by default, with its group, and oldest first on request', async () => {
    const ranked = await k.call('read', { method: 'GET', url: '/v1/review-items' });
    expect(ranked.statusCode, ranked.body).toBe(200);
    const items = ranked.json().items as {
      id: number;
      mention: { externalId: string };
      group: { size: number; itemIds: number[]; contracts: number };
      priority: number;
    }[];
    expect(items.map((i) => i.mention.externalId)).toEqual(['w-1', 'w-2', 'h-1']);
    expect(items[0]!.group).toMatchObject({ size: 2, contracts: 2, itemIds: [items[0]!.id, items[1]!.id] });
    expect(ranked.json().open).toBe(3);
    const oldest = await k.call('read', { method: 'GET', url: '/v1/review-items?order=oldest' });
    expect(oldest.json().items.map((i: { mention: { externalId: string } }) => i.mention.externalId)).toEqual(['h-1', 'w-1', 'w-2']);
    // Pages of the ranked order follow each other without a gap or a repeat.
    const first = await k.call('read', { method: 'GET', url: '/v1/review-items?limit=2' });
    const next = await k.call('read', { method: 'GET', url: `/v1/review-items?limit=2&cursor=${first.json().nextCursor}` });
    expect([...first.json().items, ...next.json().items].map((i: { id: number }) => i.id)).toEqual(items.map((i) => i.id));
    expect(next.json().nextCursor).toBeNull();
    const bad = await k.call('read', { method: 'GET', url: '/v1/review-items?order=newest' });
    expect(bad.statusCode).toBe(422);
    expect(bad.body).toContain('order');
  });

  it('answers the next questions of a contract system: the item of a mention, one item, and the queue narrowed', async () => {
    const all = (await k.call('read', { method: 'GET', url: '/v1/review-items' })).json().items as {
      id: number;
      mentionId: number;
      rightCounterpartyId: number;
      mention: { externalId: string };
    }[];
    const wexbury = all.find((i) => i.mention.externalId === 'w-1')!;
    const mention = await k.call('read', { method: 'GET', url: `/v1/mentions/${wexbury.mentionId}` });
    expect(mention.json()).toMatchObject({ status: 'review', reviewItemId: wexbury.id });
    const one = await k.call('read', { method: 'GET', url: `/v1/review-items/${wexbury.id}` });
    expect(one.statusCode, one.body).toBe(200);
    expect(one.json()).toMatchObject({ id: wexbury.id, status: 'open', mention: { externalId: 'w-1' }, right: { id: wexbury.rightCounterpartyId } });
    expect((await k.call('read', { method: 'GET', url: '/v1/review-items/999999' })).statusCode).toBe(404);
    const byMention = (await k.call('read', { method: 'GET', url: `/v1/review-items?mentionId=${wexbury.mentionId}` })).json().items;
    expect(byMention.map((i: { id: number }) => i.id)).toEqual([wexbury.id]);
    const byCounterparty = (await k.call('read', { method: 'GET', url: `/v1/review-items?counterpartyId=${wexbury.rightCounterpartyId}&order=oldest` })).json()
      .items;
    expect(byCounterparty.map((i: { mention: { externalId: string } }) => i.mention.externalId)).toEqual(['w-1', 'w-2']);
    expect((await k.call('read', { method: 'GET', url: '/v1/review-items?kind=duplicate' })).json().items).toEqual([]);
    expect((await k.call('read', { method: 'GET', url: '/v1/review-items?createdBefore=2000-01-01T00:00:00Z' })).json().items).toEqual([]);
    expect((await k.call('read', { method: 'GET', url: '/v1/review-items?createdAfter=2000-01-01T00:00:00Z' })).json().items).toHaveLength(3);
    expect((await k.call('read', { method: 'GET', url: '/v1/review-items?status=decided' })).json().items).toEqual([]);
    expect((await k.call('read', { method: 'GET', url: '/v1/review-items?createdBefore=yesterday' })).statusCode).toBe(422);
    // A plain calendar date (ISO 8601) is what a person types first; it used to be refused ("must match format
    // date-time"). It is read as midnight UTC; a day that does not exist is refused naming the parameter.
    expect((await k.call('read', { method: 'GET', url: '/v1/review-items?createdBefore=2000-01-01' })).json().items).toEqual([]);
    expect((await k.call('read', { method: 'GET', url: '/v1/review-items?createdAfter=2000-01-01&kind=mention_link' })).json().items).toHaveLength(3);
    expect((await k.call('read', { method: 'GET', url: '/v1/review-items?createdAfter=2000-01-01T09:30:00%2B02:00' })).json().items).toHaveLength(3);
    const noSuchDay = await k.call('read', { method: 'GET', url: '/v1/review-items?createdAfter=2026-02-30' });
    expect(noSuchDay.statusCode).toBe(422);
    expect(noSuchDay.json()).toMatchObject({ code: 'VALIDATION_FAILED', errors: [{ pointer: '/createdAfter', in: 'query' }] });
    expect(noSuchDay.json().detail).toContain('"2026-02-30" is not a date');
    // Year 0 in UTC (PostgreSQL has none) once reached the database and answered 500.
    for (const instant of ['0000-01-01T00:00:00Z', '0001-01-01T00:00:00%2B14:00']) {
      const yearZero = await k.call('read', { method: 'GET', url: `/v1/review-items?createdBefore=${instant}` });
      expect(yearZero.statusCode, instant).toBe(422);
      expect(yearZero.json()).toMatchObject({ code: 'VALIDATION_FAILED', errors: [{ pointer: '/createdBefore', in: 'query' }] });
    }
  });

  it('settles every item of the group with scope "group", and one item alone by default ("not a party" here)', async () => {
    const items = (await k.call('read', { method: 'GET', url: '/v1/review-items' })).json().items as { id: number; group: { itemIds: number[] } }[];
    const decided = await k.call('admin', {
      method: 'POST',
      url: `/v1/review-items/${items[0]!.id}/decision`,
      payload: { decision: 'same', scope: 'group', reason: 'same firm' },
    });
    expect(decided.statusCode, decided.body).toBe(200);
    expect(decided.json().settled.map((s: { reviewItemId: number }) => s.reviewItemId)).toEqual(items[0]!.group.itemIds);
    expect(decided.json().skipped).toEqual([]);
    const left = (await k.call('read', { method: 'GET', url: '/v1/review-items' })).json();
    expect(left.open).toBe(1);
    const one = await k.call('admin', { method: 'POST', url: `/v1/review-items/${left.items[0].id}/decision`, payload: { decision: 'not_a_party' } });
    expect(one.statusCode, one.body).toBe(200);
    expect(one.json().settled).toBeUndefined();
    expect(one.json().counterpartyId).toBeNull();
    const mention = await k.call('read', { method: 'GET', url: `/v1/mentions/${left.items[0].mentionId}` });
    expect(mention.json().status).toBe('not_a_party');
    expect((await k.call('read', { method: 'GET', url: '/v1/review-items' })).json().open).toBe(0);
    // Decided items stay readable, oldest first, with the decision.
    const decidedItems = (await k.call('read', { method: 'GET', url: '/v1/review-items?status=decided' })).json().items;
    expect(decidedItems.map((i: { decision: string }) => i.decision)).toEqual(['not_a_party', 'same', 'same']);
    const after = await k.call('read', { method: 'GET', url: `/v1/mentions/${left.items[0].mentionId}` });
    expect(after.json().reviewItemId).toBeNull();
  });
});
