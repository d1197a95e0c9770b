/**
 * Happy paths of the /v1 routes over fastify inject, on both backends: mentions (single, batch as JSON and
 * NDJSON), contracts, review decisions, the change feed across a merge and its undo, exports, jobs, groups,
 * network, own entities and score statistics. Invented names only.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { setTimeout as sleep } from 'node:timers/promises';
import { describeEachBackend } from '../../support/database.ts';
import { keyedApp, type KeyedApp } from './support.ts';

const CONTRACT = `MASTER SERVICES AGREEMENT

This Master Services Agreement is made on 3 March 2024 between Quorvel Analytics Limited, a company incorporated in England and Wales with company number 04512233 ("Provider"), and Tansbury Freight Holdings Inc., a Delaware corporation ("Client").

1. The Provider shall deliver the services to the Client.

Signed for and on behalf of Quorvel Analytics Limited by Dana Whitlow, Director.
Signed for and on behalf of Tansbury Freight Holdings Inc. by Marco Ellery, CFO.
`;

describeEachBackend('/v1 routes', (ctx) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('resolves one mention and answers the stored result for the same mention again', async () => {
    const body = { source: 'clm', externalId: 'm-1', text: 'Pellingham Robotics GmbH', country: 'DE' };
    const first = await k.call('write', { method: 'POST', url: '/v1/mentions', payload: body });
    expect(first.statusCode, first.body).toBe(200);
    const result = first.json();
    expect(result).toMatchObject({ source: 'clm', externalId: 'm-1', status: 'new', alreadyIngested: false });
    expect(result.counterpartyId).toEqual(expect.any(Number));
    expect(typeof result.explanation).toBe('object');
    const again = await k.call('write', { method: 'POST', url: '/v1/mentions', payload: body });
    expect(again.json()).toMatchObject({ mentionId: result.mentionId, alreadyIngested: true, counterpartyId: result.counterpartyId });
    const got = await k.call('read', { method: 'GET', url: `/v1/mentions/${result.mentionId}` });
    expect(got.json()).toMatchObject({ id: result.mentionId, text: 'Pellingham Robotics GmbH' });
  });

  it('resolves a batch as a JSON array and as NDJSON, results in input order, bad items rejected in place', async () => {
    const items = [
      { source: 'erp', externalId: 'b-1', text: 'Corvallen Textiles S.A.', country: 'FR' },
      { source: 'erp', externalId: 'b-2', text: 'Corvallen Textiles SA', country: 'FR' },
      { source: 'erp', externalId: 'b-3', text: 'Ostrander Mills Ltd', country: 'GB', identifiers: [{ scheme: 'lei', value: '5493001KJTIIGC8Y1R13' }] },
    ];
    const res = await k.call('write', { method: 'POST', url: '/v1/mentions/batch', payload: items });
    expect(res.statusCode, res.body).toBe(200);
    const out = res.json();
    expect(out.items.map((i: { index: number }) => i.index)).toEqual([0, 1, 2]);
    expect(out.items[0].externalId).toBe('b-1');
    expect(out.items[1].externalId).toBe('b-2');
    // 5493001KJTIIGC8Y1R13 fails the ISO 17442 check digits (…R12 is the valid form: ISO 7064 MOD 97-10).
    expect(out.items[2]).toMatchObject({ status: 'rejected', index: 2 });
    expect(out.items[0].counterpartyId).toBe(out.items[1].counterpartyId);
    const ndjson = [
      { source: 'erp', externalId: 'b-4', text: 'Marlowe Pumps Inc.', country: 'US' },
      { source: 'erp', externalId: 'b-1', text: 'Corvallen Textiles S.A.', country: 'FR' },
    ]
      .map((i) => JSON.stringify(i))
      .join('\n');
    const res2 = await k.call('write', { method: 'POST', url: '/v1/mentions/batch', payload: ndjson, headers: { 'content-type': 'application/x-ndjson' } });
    expect(res2.statusCode, res2.body).toBe(200);
    expect(res2.json().items.map((i: { externalId: string }) => i.externalId)).toEqual(['b-4', 'b-1']);
    expect(res2.json().counts).toMatchObject({ already_ingested: 1 });
    const bad = await k.call('write', {
      method: 'POST',
      url: '/v1/mentions/batch',
      payload: '{"source":"erp"}\nnot json',
      headers: { 'content-type': 'application/x-ndjson' },
    });
    expect(bad.statusCode).toBe(400);
    expect(bad.json()).toMatchObject({ code: 'MALFORMED_JSON', line: 2 });
  });

  it('stores a contract, finds its parties with roles, and reads it by id and by source id', async () => {
    const res = await k.call('write', {
      method: 'POST',
      url: '/v1/contracts',
      payload: { source: 'clm', externalId: 'MSA-77', title: 'Master Services Agreement', text: CONTRACT },
    });
    expect(res.statusCode, res.body).toBe(200);
    const stored = res.json();
    const names = stored.parties.map((p: { canonicalName: string | null }) => p.canonicalName);
    expect(names.join(' | ')).toContain('Quorvel Analytics');
    expect(stored.parties.map((p: { role: string | null }) => p.role)).toEqual(expect.arrayContaining(['Provider', 'Client']));
    const byId = await k.call('read', { method: 'GET', url: `/v1/contracts/${stored.contractId}` });
    expect(byId.json()).toMatchObject({ id: stored.contractId, externalId: 'MSA-77' });
    const bySource = await k.call('read', { method: 'GET', url: '/v1/contracts/by-source?source=clm&externalId=MSA-77' });
    expect(bySource.json().id).toBe(stored.contractId);
    const list = await k.call('read', { method: 'GET', url: '/v1/contracts?q=master%20services' });
    expect(list.json().items.map((c: { id: number }) => c.id)).toContain(stored.contractId);
    const provider = stored.parties.find((p: { role: string }) => p.role === 'Provider');
    const network = await k.call('read', { method: 'GET', url: `/v1/counterparties/${provider.counterpartyId}/network` });
    expect(network.statusCode).toBe(200);
    expect(network.json().contracts[0]).toMatchObject({ externalId: 'MSA-77', roles: ['Provider'] });
    expect(
      network
        .json()
        .parties.map((p: { name: string }) => p.name)
        .join(' '),
    ).toContain('Tansbury');
    const cp = await k.call('read', { method: 'GET', url: `/v1/counterparties/${provider.counterpartyId}` });
    expect(cp.json().contracts).toHaveLength(1);
  });

  it('follows a merge and its undo in the change feed', async () => {
    const start = (await k.call('read', { method: 'GET', url: '/v1/changes?limit=1000' })).json();
    let cursor = start.nextCursor as string;
    while (true) {
      const page = (await k.call('read', { method: 'GET', url: `/v1/changes?cursor=${cursor}&limit=1000` })).json();
      if (page.items.length === 0) break;
      cursor = page.nextCursor;
    }
    const a = (await k.call('admin', { method: 'POST', url: '/v1/counterparties', payload: { name: 'Wrexford Signal Ltd', jurisdiction: 'GB' } })).json();
    const b = (await k.call('admin', { method: 'POST', url: '/v1/counterparties', payload: { name: 'Wrexford Signalling Ltd', jurisdiction: 'GB' } })).json();
    const merged = await k.call('admin', {
      method: 'POST',
      url: '/v1/counterparties/merge',
      payload: {
        items: [
          { id: a.counterpartyId, etag: a.etag },
          { id: b.counterpartyId, etag: b.etag },
        ],
        reason: 'one company',
      },
    });
    expect(merged.statusCode, merged.body).toBe(200);
    const undo = await k.call('admin', { method: 'POST', url: `/v1/history/${merged.json().eventId}/undo`, payload: { reason: 'not one company' } });
    expect(undo.statusCode, undo.body).toBe(200);
    const feed = (await k.call('read', { method: 'GET', url: `/v1/changes?cursor=${cursor}` })).json();
    const types = feed.items.map((e: { type: string }) => e.type);
    expect(types).toEqual(['created', 'created', 'merged', 'undone']);
    const mergeEvent = feed.items[2];
    expect(mergeEvent.details).toMatchObject({ survivorId: a.counterpartyId, mergedIds: [b.counterpartyId] });
    expect(feed.items[3].undoesEventId).toBe(mergeEvent.id);
    const next = (await k.call('read', { method: 'GET', url: `/v1/changes?cursor=${feed.nextCursor}` })).json();
    expect(next.items).toEqual([]);
    const history = (await k.call('read', { method: 'GET', url: `/v1/counterparties/${b.counterpartyId}/history` })).json();
    expect(history.items.map((e: { type: string }) => e.type)).toEqual(['undone', 'merged', 'created']);
  });

  it('lists and decides review items, groups mentions, lists own entities and score statistics', async () => {
    const own = await k.call('admin', { method: 'POST', url: '/v1/own-entities', payload: { name: 'Orrinwood Group Holdings B.V.', country: 'NL' } });
    expect([200, 201]).toContain(own.statusCode);
    const list = await k.call('read', { method: 'GET', url: '/v1/own-entities' });
    expect(list.json().items.map((o: { name: string }) => o.name)).toContain('Orrinwood Group Holdings B.V.');
    const ownMention = await k.call('write', {
      method: 'POST',
      url: '/v1/mentions',
      payload: { source: 'clm', externalId: 'own-1', text: 'Orrinwood Group Holdings B.V.', country: 'NL' },
    });
    expect(ownMention.json().status).toBe('own_entity');
    const groups = await k.call('read', { method: 'GET', url: '/v1/counterparty-groups?limit=200' });
    expect(groups.statusCode).toBe(200);
    const corvallen = groups.json().items.find((g: { canonicalName: string }) => g.canonicalName.startsWith('Corvallen'));
    expect(corvallen.mentions.map((m: { externalId: string }) => m.externalId).sort()).toEqual(['b-1', 'b-2']);
    const items = await k.call('read', { method: 'GET', url: '/v1/review-items' });
    expect(items.statusCode).toBe(200);
    for (const item of items.json().items.slice(0, 1)) {
      const decided = await k.call('admin', {
        method: 'POST',
        url: `/v1/review-items/${item.id}/decision`,
        payload: { decision: 'different', reason: 'test' },
      });
      expect(decided.statusCode, decided.body).toBe(200);
    }
    const stats = await k.call('read', { method: 'GET', url: '/v1/stats/scores' });
    expect(stats.statusCode).toBe(200);
    expect(stats.json()).toMatchObject({ linkAt: expect.any(Number), newAt: expect.any(Number) });
    const total = stats.json().buckets.reduce((s: number, b: { count: number }) => s + b.count, 0);
    expect(total).toBe(stats.json().count);
  });

  it('streams exports with formula-injection neutralisation of text cells', async () => {
    await k.call('write', {
      method: 'POST',
      url: '/v1/mentions',
      payload: { source: 'clm', externalId: 'inj-1', text: '=HYPERLINK("http://x.example","Pay") Ltd' },
    });
    await k.call('admin', {
      method: 'POST',
      url: '/v1/counterparties',
      payload: { name: 'Fenwarrow Audio Ltd', jurisdiction: 'GB', identifiers: [{ scheme: 'phone', value: '+44 20 7946 0958' }] },
    });
    const links = await k.call('read', { method: 'GET', url: '/v1/exports/links?format=csv' });
    expect(links.statusCode).toBe(200);
    expect(links.headers['content-type']).toMatch(/^text\/csv/);
    expect(links.body).toContain(`"'=HYPERLINK(""http://x.example"",""Pay"") Ltd"`);
    expect(links.body).not.toMatch(/,"?=HYPERLINK/);
    const register = await k.call('read', { method: 'GET', url: '/v1/exports/register?format=csv' });
    expect(register.body).toContain('phone:+442079460958');
    const nd = await k.call('read', { method: 'GET', url: '/v1/exports/links?format=ndjson' });
    const rows = nd.body
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l));
    expect(rows.find((r: { external_id: string }) => r.external_id === 'inj-1').text).toBe('=HYPERLINK("http://x.example","Pay") Ltd');
  });

  it('takes an NDJSON upload as a job (202) and reports its counts', async () => {
    const lines = [
      { externalId: 'j-1', text: 'Brisbane Harbour Tugs Pty Ltd', country: 'AU' },
      { externalId: 'j-2', text: 'Kelmscott Brewing LLC', country: 'US' },
      { externalId: 'j-3' },
    ].map((l) => JSON.stringify(l));
    const res = await k.call('write', {
      method: 'POST',
      url: '/v1/jobs/ingest?source=upload',
      payload: `${lines.join('\n')}\nnot json\n`,
      headers: { 'content-type': 'application/x-ndjson' },
    });
    expect(res.statusCode, res.body).toBe(202);
    const id = res.json().id;
    expect(res.headers.location).toBe(`/v1/jobs/${id}`);
    let job = res.json();
    for (let i = 0; i < 300 && (job.status === 'running' || job.status === 'queued'); i++) {
      await sleep(100);
      job = (await k.call('read', { method: 'GET', url: `/v1/jobs/${id}` })).json();
    }
    expect(job.status, JSON.stringify(job)).toBe('finished');
    expect(job.result.counts).toMatchObject({ read: 4, rejected: 2, new: 2 });
    expect(job.result.rejected.map((r: { line: number }) => r.line)).toEqual([3, 4]);
    const sweep = await k.call('admin', { method: 'POST', url: '/v1/jobs/sweep' });
    expect(sweep.statusCode).toBe(202);
  });
});
