/**
 * Fields the console needs from /v1 (issue 9: legal form shown in search and review, the network readable by
 * name): the plain counterparty list answers each legal form, relations in the network carry the related
 * counterparty's canonical name, mention reads carry the legal form analysed from their text. Invented names;
 * the designator families (ltd, gmbh, bv) are those resolvers/analyse gives (its own tests check them against
 * ../shared/reference/iso20275-elf-code-list.csv).
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { writeSettings } from '../../../db/queries/settings.ts';
import { describeEachBackend } from '../../support/database.ts';
import { keyedApp, type KeyedApp } from './support.ts';

describeEachBackend('/v1 fields for the console', (ctx) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  async function create(name: string): Promise<number> {
    const res = await k.call('admin', { method: 'POST', url: '/v1/counterparties', payload: { name } });
    expect(res.statusCode, res.body).toBe(201);
    return res.json().counterpartyId as number;
  }

  it('GET /v1/counterparties without q answers the legal form of each canonical name, as the search does', async () => {
    const ltd = await create('Wexcombe Joinery Ltd');
    const bare = await create('Wexcombe Joinery Works');
    const all = (await k.call('read', { method: 'GET', url: '/v1/counterparties?limit=500' })).json().items as { id: number; legalForm: string | null }[];
    expect(all.find((x) => x.id === ltd)?.legalForm).toBe('ltd');
    expect(all.find((x) => x.id === bare)).toMatchObject({ legalForm: null });
    const searched = (await k.call('read', { method: 'GET', url: '/v1/counterparties?q=Wexcombe%20Joinery%20Ltd' })).json().items as {
      id: number;
      legalForm: string | null;
    }[];
    expect(searched.find((x) => x.id === ltd)?.legalForm).toBe('ltd');
  });

  it('the network answer names the counterparty at the other end of each relation', async () => {
    const parent = await create('Ostrevin Holdings GmbH');
    const child = await create('Ostrevin Werkzeuge GmbH');
    const added = await k.call('admin', {
      method: 'POST',
      url: `/v1/counterparties/${parent}/relations`,
      payload: { toId: child, type: 'parent_of', reason: 'group chart' },
    });
    expect(added.statusCode, added.body).toBeLessThan(300);
    const fromParent = (await k.call('read', { method: 'GET', url: `/v1/counterparties/${parent}/network` })).json();
    expect(fromParent.relations).toEqual([
      expect.objectContaining({
        fromCounterpartyId: parent,
        toCounterpartyId: child,
        type: 'parent_of',
        relatedCounterpartyId: child,
        relatedCanonicalName: 'Ostrevin Werkzeuge GmbH',
      }),
    ]);
    const fromChild = (await k.call('read', { method: 'GET', url: `/v1/counterparties/${child}/network` })).json();
    expect(fromChild.relations).toEqual([expect.objectContaining({ relatedCounterpartyId: parent, relatedCanonicalName: 'Ostrevin Holdings GmbH' })]);
  });

  it('mention reads carry the legal form analysed from the text (text as written and family), null without one', async () => {
    const first = (
      await k.call('write', {
        method: 'POST',
        url: '/v1/mentions',
        payload: { source: 'gaps', externalId: 'm1', text: 'Lindqvarn Analytics B.V.', country: 'NL' },
      })
    ).json();
    const second = (
      await k.call('write', { method: 'POST', url: '/v1/mentions', payload: { source: 'gaps', externalId: 'm2', text: 'Lindqvarn Analytics', country: 'NL' } })
    ).json();
    const id = first.counterpartyId as number;
    const mentions = (await k.call('read', { method: 'GET', url: `/v1/counterparties/${id}/mentions` })).json().items as { id: number; legalForm: unknown }[];
    expect(mentions.find((m) => m.id === first.mentionId)?.legalForm).toEqual({ text: 'B.V.', family: 'bv' });
    const one = (await k.call('read', { method: 'GET', url: `/v1/mentions/${second.mentionId}` })).json();
    expect(one).toMatchObject({ text: 'Lindqvarn Analytics', legalForm: null });
  });
});

describeEachBackend('/v1 review items: the mention side', (ctx) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('carries the legal form analysed from the mention text', async () => {
    // Nothing links and nothing is new: any candidate goes to a person (thresholds chosen for the test).
    await writeSettings(ctx.db(), { linkAt: 1000, newAt: -1000, weights: {}, updatedBy: 'test' });
    await k.call('write', { method: 'POST', url: '/v1/mentions', payload: { source: 'rv', externalId: '1', text: 'Tamsworth Ceramics Ltd', country: 'GB' } });
    const second = (
      await k.call('write', {
        method: 'POST',
        url: '/v1/mentions',
        payload: { source: 'rv', externalId: '2', text: 'Tamsworth Ceramics Limited', country: 'GB' },
      })
    ).json();
    expect(second.status).toBe('review');
    const items = (await k.call('read', { method: 'GET', url: '/v1/review-items' })).json().items as { mention: { id: number; legalForm: unknown } | null }[];
    const item = items.find((i) => i.mention?.id === second.mentionId);
    expect(item?.mention?.legalForm).toEqual({ text: 'Limited', family: 'ltd' });
  });
});
