/**
 * Issue 16 item 9 through the API, on both backends: an amendment or side letter that uses the defined terms of an
 * earlier agreement binds those terms when the register holds that agreement (found by its reference number, or by
 * title with date and parties): "the Carrier" in the amendment links to the earlier contract's Carrier, and the
 * explanation says how the earlier agreement was found. Every company, contract and number here is invented.
 */
import { afterAll, beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/database.ts';
import { keyedApp, type KeyedApp } from './support.ts';

const MSA = `MASTER SERVICES AGREEMENT

This Master Services Agreement is entered into as of June 1, 2024 by and between Harrowgate Analytics, Inc., a Delaware corporation ("Customer"), and Quillon Freight LLC, a Texas limited liability company ("Carrier").`;

const US_AMENDMENT = `FIRST AMENDMENT TO MASTER SERVICES AGREEMENT

This First Amendment (this "Amendment") is entered into as of September 1, 2024 by and between Harrowgate Analytics, Inc. and Quillon Freight LLC.

Capitalized terms used but not defined in this Amendment shall have the meanings ascribed to them in the Master Services Agreement dated June 1, 2024, between Harrowgate Analytics, Inc. and Quillon Freight LLC (Contract No. MSA-2024-017).`;

const SUPPLY = `THIS AGREEMENT is dated 3 March 2025 and made between:
(1) Tollaby Logistics Limited, a company incorporated in England and Wales with company number 04417731 (the "Customer"); and
(2) Wrenfield Systems Ltd, a company incorporated in England and Wales with company number 05120877 (the "Supplier").`;

const SIDE_LETTER = `SIDE LETTER

Dear Sirs,

We refer to the supply agreement dated 3 March 2025 between us (the "Agreement"). Capitalised terms used in this letter have the meaning given to them in the Agreement.

The Supplier may deliver to the Customer's Leeds depot until 30 September 2025.`;

const FRAMEWORK = `FRAMEWORK AGREEMENT (reference RV-2023-12)

This Framework Agreement of 12 May 2023 is concluded between Vellmark Antriebstechnik GmbH, with registered office in Stuttgart (hereinafter the "Supplier"), and Brisemont Énergie SAS, with registered office in Lyon (hereinafter the "Client").`;

const EU_AMENDMENT = `AMENDMENT AGREEMENT No. 2

This Amendment Agreement is concluded between Vellmark Antriebstechnik GmbH and Brisemont Énergie SAS.

Terms defined in the Framework Agreement of 12 May 2023 (reference RV-2023-12) have the same meaning in this Amendment Agreement.`;

const UNKNOWN_EARLIER = `SIDE LETTER

We refer to the Logistics Agreement dated 9 January 2022 between Corrin Hale Ltd and Sallow Weaving Ltd. Capitalised terms used in this letter have the meaning given to them in that agreement.`;

describeEachBackend('/v1 amendments use the defined terms of an earlier agreement (issue 16 item 9)', (ctx) => {
  let k: KeyedApp;
  const post = async (url: string, payload: Record<string, unknown>) => {
    const res = await k.call('write', { method: 'POST', url, payload });
    expect(res.statusCode, res.body).toBe(200);
    return res.json();
  };
  const partyOf = (stored: { parties: { role: string | null; counterpartyId: number | null }[] }, role: string) =>
    stored.parties.find((p) => p.role === role)?.counterpartyId;
  const mention = (externalId: string, text: string, contract: string) =>
    post('/v1/mentions', { source: 'extraction', externalId, text, contract: { source: 'clm', externalId: contract } });
  let carrier: number | null | undefined;
  let supplier: number | null | undefined;
  let client: number | null | undefined;

  beforeAll(async () => {
    k = await keyedApp(ctx.db(), ctx.backend);
    carrier = partyOf(await post('/v1/contracts', { source: 'clm', externalId: 'MSA-2024-017', title: 'Master Services Agreement', text: MSA }), 'Carrier');
    supplier = partyOf(await post('/v1/contracts', { source: 'clm', externalId: 'SUP-1', title: 'Supply Agreement', text: SUPPLY }), 'Supplier');
    client = partyOf(await post('/v1/contracts', { source: 'clm', externalId: 'FW-7', text: FRAMEWORK }), 'Client');
    expect([carrier, supplier, client].every((id) => typeof id === 'number')).toBe(true);
    await post('/v1/contracts', { source: 'clm', externalId: 'AMD-1', text: US_AMENDMENT });
    await post('/v1/contracts', { source: 'clm', externalId: 'SL-1', text: SIDE_LETTER });
    await post('/v1/contracts', { source: 'clm', externalId: 'AMD-2', text: EU_AMENDMENT });
    await post('/v1/contracts', { source: 'clm', externalId: 'SL-2', text: UNKNOWN_EARLIER });
  });
  afterAll(async () => {
    await k?.app.close();
  });

  it('US: "the Carrier" in the amendment is the earlier MSA\'s Carrier, found by its contract number', async () => {
    const r = await mention('AMD-1/1', 'the Carrier', 'AMD-1');
    expect(r).toMatchObject({ status: 'linked', counterpartyId: carrier });
    expect(r.explanation.via).toBe('earlier_agreement_term');
    expect(r.explanation.earlierAgreement).toMatchObject({ externalId: 'MSA-2024-017', how: 'reference' });
    expect(r.explanation.summary).toContain(
      'uses the defined terms of Master Services Agreement (clm/MSA-2024-017, found by its reference number); there it is the term for Quillon Freight LLC',
    );
  });

  it('UK: "the Supplier" in a side letter "between us" is the supply agreement\'s Supplier, found by title and date', async () => {
    const r = await mention('SL-1/1', 'the Supplier', 'SL-1');
    expect(r).toMatchObject({ status: 'linked', counterpartyId: supplier });
    expect(r.explanation.earlierAgreement).toMatchObject({ externalId: 'SUP-1', how: 'title_and_date' });
  });

  it('translated: "the Client" in the amendment is the framework agreement\'s Client, found by the reference in its heading', async () => {
    const r = await mention('AMD-2/1', 'the Client', 'AMD-2');
    expect(r).toMatchObject({ status: 'linked', counterpartyId: client });
    expect(r.explanation.earlierAgreement).toMatchObject({ externalId: 'FW-7', how: 'reference' });
  });

  it('leaves the term unbound when the earlier agreement is not in the register', async () => {
    const r = await mention('SL-2/1', 'the Supplier', 'SL-2');
    expect(r.status).toBe('unbound_term');
    expect(r.counterpartyId).toBeNull();
  });

  it('resolves a waiting amendment term again when the earlier agreement arrives after it', async () => {
    const variation = `DEED OF VARIATION dated 1 August 2024 between Corrin Hale Ltd ("Tenant") and Sallow Weaving Ltd.

Words and expressions used in this Deed bear the same meaning as in the Warehouse Lease dated 5 May 2022 between Sallow Weaving Ltd and Corrin Hale Ltd (reference LSE-2022-5).`;
    const lease = `WAREHOUSE LEASE

This Lease is dated 5 May 2022 and made between Sallow Weaving Ltd, a company incorporated in Scotland (the "Landlord"), and Corrin Hale Ltd, a company incorporated in England and Wales (the "Tenant").`;
    await post('/v1/contracts', { source: 'clm', externalId: 'VAR-4', text: variation });
    const waiting = await mention('VAR-4/1', 'the Landlord', 'VAR-4');
    expect(waiting.status).toBe('unbound_term');
    const stored = await post('/v1/contracts', { source: 'clm', externalId: 'LSE-2022-5', title: 'Warehouse Lease', text: lease });
    const landlord = partyOf(stored, 'Landlord');
    const again = stored.reresolved.find((r: { mentionId: number }) => r.mentionId === waiting.mentionId);
    expect(again).toMatchObject({ status: 'linked', counterpartyId: landlord });
    expect(again.explanation.earlierAgreement).toMatchObject({ externalId: 'LSE-2022-5', how: 'reference' });
    const got = await k.call('read', { method: 'GET', url: `/v1/mentions/${waiting.mentionId}` });
    expect(got.json()).toMatchObject({ status: 'linked', counterpartyId: landlord });
  });

  it('binds nothing when two stored contracts agree equally with the statement', async () => {
    // A second supply agreement of the same date between the same parties: which one the letter means is unknown.
    await post('/v1/contracts', {
      source: 'clm',
      externalId: 'SUP-1-COPY',
      title: 'Supply Agreement (counterpart)',
      text: SUPPLY.replace('THIS AGREEMENT', 'THIS SUPPLY AGREEMENT'),
    });
    const r = await mention('SL-1/2', 'the Customer', 'SL-1');
    expect(r.status).toBe('unbound_term');
  });
});
