/**
 * Issue 19 item 4: POST /v1/contracts also takes the parties a contract system already knows. The given parties are
 * reconciled with the parties read from the text and the disagreements reported; identifiers given for a party the
 * text names reach its mention; a bad given identifier refuses the request before anything is stored. Invented names
 * and numbers (the company number only fits the 8-digit Companies House format resolvers/identifiers checks).
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/database.ts';
import { keyedApp, type KeyedApp } from './support.ts';

const TEXT =
  'This Services Agreement is made between Hartsell Cold Chain Limited, a company incorporated in England (the "Provider"), and Dallowmere Foods Ltd (the "Client").';

describeEachBackend('POST /v1/contracts with the parties a contract system knows', (ctx) => {
  let k: KeyedApp;
  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('reconciles given and parsed parties, reports what differs, and adds the given identifiers to the party they belong to', async () => {
    const parties = [
      { name: 'Hartsell Cold Chain Limited', role: 'Provider', identifiers: [{ scheme: 'gb_company', value: '01234567' }] },
      { name: 'DALLOWMERE FOODS LTD', definedTerm: 'the Customer' },
      { name: 'Quenby Tools Ltd', role: 'Guarantor' },
    ];
    const res = await k.call('write', { method: 'POST', url: '/v1/contracts', payload: { source: 'clm', externalId: 'GP-1', text: TEXT, parties } });
    expect(res.statusCode, res.body).toBe(200);
    const body = res.json();
    const position = (name: string) => (body.contract.parties as Array<{ position: number; text: string }>).find((p) => p.text.startsWith(name))!.position;
    expect(body.reconciliation.matched).toEqual([
      { given: 0, position: position('Hartsell') },
      { given: 1, position: position('Dallowmere') },
    ]);
    expect(body.reconciliation.givenNotInText).toEqual([2]);
    expect(body.reconciliation.parsedNotGiven).toEqual([]);
    expect(body.reconciliation.disagreements).toEqual([
      { given: 1, position: position('Dallowmere'), field: 'definedTerm', givenValue: 'the Customer', parsedValue: 'Client' },
    ]);
    expect(body.identifiersAdded).toHaveLength(1);
    const mention = await k.call('read', { method: 'GET', url: `/v1/mentions/${body.identifiersAdded[0].mentionId}` });
    expect(mention.json().identifiers).toEqual(expect.arrayContaining([expect.objectContaining({ scheme: 'gb_company', value: '01234567' })]));
    // Sent again: the contract is already stored, the identifier already held: nothing more is added.
    const again = await k.call('write', { method: 'POST', url: '/v1/contracts', payload: { source: 'clm', externalId: 'GP-1', text: TEXT, parties } });
    expect(again.json()).toMatchObject({ alreadyStored: true, identifiersAdded: [] });
  });

  it('refuses a bad given identifier by its field before storing the contract', async () => {
    const res = await k.call('write', {
      method: 'POST',
      url: '/v1/contracts',
      payload: {
        source: 'clm',
        externalId: 'GP-2',
        text: TEXT,
        parties: [{ name: 'Hartsell Cold Chain Limited', identifiers: [{ scheme: 'lei', value: 'NOT-AN-LEI' }] }],
      },
    });
    expect(res.statusCode).toBe(422);
    expect(res.body).toContain('parties/0/identifiers/0');
    expect((await k.call('read', { method: 'GET', url: '/v1/contracts?source=clm&externalId=GP-2' })).json().items).toEqual([]);
  });
});
