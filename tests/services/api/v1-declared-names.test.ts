/**
 * Issue 16 item 8 through the API, on both backends: a former name or trade name a contract declares for a party
 * ("Tollaby Logistics Limited (formerly Tollaby Cold Storage Ltd)") is stored on the party's counterparty with its
 * kind; a later mention of it links to that party, inside the contract and from other contracts, and the
 * explanation says the link came through a declared former name. Every company and contract here is invented.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/database.ts';
import { keyedApp, type KeyedApp } from './support.ts';

const UK_SUPPLY = `SUPPLY AGREEMENT

This Agreement is made on 3 March 2025 between:
(1) Tollaby Logistics Limited (formerly Tollaby Cold Storage Ltd), a company incorporated in England and Wales with company number 04417731 (the "Customer"); and
(2) Wrenfield Systems Ltd, a company incorporated in England and Wales with company number 05120877 (the "Supplier").
`;

const US_SERVICES = `MASTER SERVICES AGREEMENT

This Master Services Agreement is entered into by and between Harrowgate Analytics, Inc., f/k/a Harrowgate Data Corp., a Delaware corporation ("Harrowgate"), and Quillon Freight LLC, doing business as QuickQuill Shipping, a Texas limited liability company ("Carrier").
`;

const LATER_ORDER = `PURCHASE ORDER TERMS

These terms are agreed between Ostrava Paper Mills s.r.o. (the "Buyer") and Penrose Valve Works Limited, a company incorporated in England and Wales (the "Seller").
`;

interface Name {
  name: string;
  kind: string;
}

describeEachBackend('/v1 declared former and trade names (issue 16 item 8)', (ctx) => {
  let k: KeyedApp;
  const post = async (url: string, payload: Record<string, unknown>) => {
    const res = await k.call('write', { method: 'POST', url, payload });
    expect(res.statusCode, res.body).toBe(200);
    return res.json();
  };
  const namesOf = async (id: number): Promise<Name[]> => {
    const res = await k.call('read', { method: 'GET', url: `/v1/counterparties/${id}` });
    expect(res.statusCode, res.body).toBe(200);
    return res.json().names as Name[];
  };
  let tollaby: number;

  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
    const stored = await post('/v1/contracts', { source: 'clm', externalId: 'SUP-1', text: UK_SUPPLY });
    const customer = stored.parties.find((p: { role: string | null }) => p.role === 'Customer');
    expect(customer?.status).toBe('new');
    tollaby = customer.counterpartyId as number;
    await post('/v1/contracts', { source: 'clm', externalId: 'MSA-2', text: US_SERVICES });
    await post('/v1/contracts', { source: 'clm', externalId: 'PO-3', text: LATER_ORDER });
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('stores the declared former name on the counterparty as kind former, and keeps the current name canonical', async () => {
    const names = await namesOf(tollaby);
    expect(names.find((n) => n.name === 'Tollaby Cold Storage Ltd')).toMatchObject({ kind: 'former', seenCount: 1 });
    expect(names).toEqual(expect.arrayContaining([expect.objectContaining({ name: 'Tollaby Cold Storage Ltd', kind: 'former' })]));
    const cp = (await k.call('read', { method: 'GET', url: `/v1/counterparties/${tollaby}` })).json();
    expect(cp.canonicalName).toBe('Tollaby Logistics Limited');
  });

  it('links a mention of the former name in the same contract to the party, saying so', async () => {
    const r = await post('/v1/mentions', {
      source: 'extraction',
      externalId: 'SUP-1/7',
      text: 'Tollaby Cold Storage Ltd',
      contract: { source: 'clm', externalId: 'SUP-1' },
    });
    expect(r.status).toBe('linked');
    expect(r.counterpartyId).toBe(tollaby);
    expect(r.explanation.via).toBe('declared_name');
    expect(r.explanation.summary).toContain('former name this contract declares');
    // The sighting is recorded as a former name, never as a current legal name.
    const names = await namesOf(tollaby);
    expect(names.filter((n) => n.name === 'Tollaby Cold Storage Ltd').map((n) => n.kind)).toEqual(['former']);
  });

  it('links a mention of the former name in another contract, through the declared former name', async () => {
    const r = await post('/v1/mentions', {
      source: 'extraction',
      externalId: 'PO-3/9',
      text: 'Tollaby Cold Storage Limited',
      contract: { source: 'clm', externalId: 'PO-3' },
    });
    expect(r.status).toBe('linked');
    expect(r.counterpartyId).toBe(tollaby);
    expect(r.explanation.via).toBe('former_name');
    expect(r.explanation.summary).toContain('former name of Tollaby Logistics Limited, declared in contract clm/SUP-1');
    const plain = await post('/v1/mentions', { source: 'erp', externalId: 'v-31', text: 'TOLLABY COLD STORAGE LTD' });
    expect(plain).toMatchObject({ status: 'linked', counterpartyId: tollaby });
  });

  it('stores a US f/k/a and a d/b/a: the former name links from elsewhere, the trade name is a current name', async () => {
    const fka = await post('/v1/mentions', { source: 'erp', externalId: 'v-40', text: 'Harrowgate Data Corp.' });
    expect(fka.status).toBe('linked');
    expect(fka.canonicalName).toBe('Harrowgate Analytics, Inc.');
    expect(fka.explanation.summary).toContain('declared in contract clm/MSA-2');
    const dba = await post('/v1/mentions', { source: 'erp', externalId: 'v-41', text: 'QuickQuill Shipping' });
    // A trade name is a current name, matched by the ordinary score: the bare name (no legal form, no country) scores
    // between the thresholds, so a person decides; the candidate is the party that declared it.
    expect(dba.status).toBe('review');
    expect(dba.explanation.candidates[0]).toMatchObject({ name: 'Quillon Freight LLC', matchedName: 'QuickQuill Shipping' });
    const quillon = dba.explanation.candidates[0].counterpartyId as number;
    expect(await namesOf(quillon)).toEqual(expect.arrayContaining([expect.objectContaining({ name: 'QuickQuill Shipping', kind: 'trade' })]));
  });

  it('sends a name only close to a former name to review, never links it', async () => {
    const r = await post('/v1/mentions', { source: 'erp', externalId: 'v-50', text: 'Tollaby Cold Storage Services Ltd' });
    // One more word ("Services") is another company as far as the score goes: never linked to Tollaby.
    expect(r.status).toBe('new');
    expect(r.counterpartyId).not.toBe(tollaby);
  });

  it('sends a former name that two counterparties declared to review, naming the rival', async () => {
    const a = `This Agreement is made between Brennock Mills Limited (formerly known as Ardley Textiles Limited), a company incorporated in England and Wales (the "Licensee"), and Corrin Hale Ltd (the "Licensor").`;
    const b = `This Agreement is made between Sallow Weaving Ltd (previously Ardley Textiles Limited), a company incorporated in Scotland (the "Buyer"), and Corrin Hale Ltd (the "Seller").`;
    await post('/v1/contracts', { source: 'clm', externalId: 'LIC-8', text: a });
    await post('/v1/contracts', { source: 'clm', externalId: 'SAL-9', text: b });
    const r = await post('/v1/mentions', { source: 'erp', externalId: 'v-70', text: 'Ardley Textiles Limited' });
    expect(r.status).toBe('review');
    expect(r.explanation.via).toBe('former_name');
    expect(r.explanation.summary).toMatch(/another counterparty, (Brennock Mills Limited|Sallow Weaving Ltd), declared the same former name/);
    // A person says which: the name joins that counterparty as a former name, never as its current legal name.
    const decided = await k.call('admin', {
      method: 'POST',
      url: `/v1/review-items/${r.reviewItemId}/decision`,
      payload: { decision: 'same', reason: 'the letterhead gives the company number' },
    });
    expect(decided.statusCode, decided.body).toBe(200);
    const chosen = (await k.call('read', { method: 'GET', url: `/v1/mentions/${r.mentionId}` })).json().counterpartyId as number;
    expect((await namesOf(chosen)).filter((n) => n.name === 'Ardley Textiles Limited').map((n) => n.kind)).toEqual(['former']);
  });

  it('stores the declared names of a contract party that a person links from review', async () => {
    await post('/v1/mentions', { source: 'erp', externalId: 'v-80', text: 'Wexmoor Pumps' });
    const stored = await post('/v1/contracts', {
      source: 'clm',
      externalId: 'SVC-10',
      text: `This Agreement is made between Wexmoor Pumps Ltd (formerly Wexmoor Irrigation Ltd), a company incorporated in England and Wales (the "Contractor"), and Corrin Hale Ltd (the "Client").`,
    });
    const party = stored.parties.find((p: { role: string | null }) => p.role === 'Contractor');
    expect(party.status).toBe('review');
    const decided = await k.call('admin', {
      method: 'POST',
      url: `/v1/review-items/${party.reviewItemId}/decision`,
      payload: { decision: 'same', reason: 'same company' },
    });
    expect(decided.statusCode, decided.body).toBe(200);
    const linked = (await k.call('read', { method: 'GET', url: `/v1/mentions/${party.mentionId}` })).json();
    expect(linked.status).toBe('linked');
    expect(await namesOf(linked.counterpartyId)).toEqual(expect.arrayContaining([expect.objectContaining({ name: 'Wexmoor Irrigation Ltd', kind: 'former' })]));
  });

  it('links the former name to the company that bears it as its current name today, not to its former holder', async () => {
    // An unrelated company registered the released name later (invented): the register holds both.
    await post('/v1/mentions', {
      source: 'erp',
      externalId: 'v-60',
      text: 'Harrowgate Data Corporation',
      country: 'US-NY',
      identifiers: [{ scheme: 'us_ein', value: '84-1234567' }],
    });
    const r = await post('/v1/mentions', { source: 'erp', externalId: 'v-61', text: 'Harrowgate Data Corp', country: 'US' });
    // The company that bears the name today wins on its current name; the former name never overrides it.
    expect(r).toMatchObject({ status: 'linked', canonicalName: 'Harrowgate Data Corporation' });
    expect(r.explanation.via).toBe('register');
  });

  it('stores the former name a mention itself declares ("X f/k/a Y") on the counterparty it links to, and unlinking takes it away', async () => {
    const created = await post('/v1/mentions', { source: 'erp', externalId: 'v-90', text: 'Dunmore Tiles Ltd', country: 'GB' });
    const fka = await post('/v1/mentions', { source: 'erp', externalId: 'v-91', text: 'Dunmore Tiles Ltd f/k/a Dunmore Ceramics Ltd', country: 'GB' });
    expect(fka).toMatchObject({ status: 'linked', counterpartyId: created.counterpartyId });
    expect(await namesOf(created.counterpartyId)).toEqual(expect.arrayContaining([expect.objectContaining({ name: 'Dunmore Ceramics Ltd', kind: 'former' })]));
    const unlinked = await k.call('admin', { method: 'POST', url: `/v1/mentions/${fka.mentionId}/unlink`, payload: { reason: 'test' } });
    expect(unlinked.statusCode, unlinked.body).toBe(200);
    expect((await namesOf(created.counterpartyId)).map((n) => `${n.kind}:${n.name}`)).toEqual(['legal:Dunmore Tiles Ltd']);
  });

  it('takes the declared former name away again when the contract no longer declares it', async () => {
    const changed = UK_SUPPLY.replace(' (formerly Tollaby Cold Storage Ltd)', '');
    await post('/v1/contracts', { source: 'clm', externalId: 'SUP-1', text: changed });
    const row = (await namesOf(tollaby)).find((n) => n.name === 'Tollaby Cold Storage Ltd' && n.kind === 'former') as Name & { seenCount: number };
    // Two sightings before (the contract's declaration and the mention SUP-1/7 linked through it); the declaration is gone.
    expect(row.seenCount).toBe(1);
  });
});
