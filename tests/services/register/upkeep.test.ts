/**
 * The register's operations one by one: idempotent and changed mentions, contracts that arrive after their
 * mentions, strong identifiers, canonical names, manual upkeep, relations, reresolve and the duplicate sweep.
 * Names, identifiers and contracts are invented; LEIs are built from invented bases with the ISO 17442 check
 * digits (ISO/IEC 7064 MOD 97-10, computed by resolvers/identifiers/lei.ts, whose own tests check it).
 */
import { beforeAll, expect, it } from 'vitest';
import { leiCheckDigits } from '../../../resolvers/identifiers/index.ts';
import { writeSettings } from '../../../db/queries/settings.ts';
import { describeEachBackend } from '../../support/index.ts';
import {
  addIdentifier,
  addName,
  addRelation,
  createCounterparty,
  decideReview,
  getCounterparty,
  listReviewItems,
  removeRelation,
  renameCounterparty,
  reresolve,
  resolveMention,
  setAsideMention,
  storeContract,
  sweep,
  undoEvent,
  unlinkMention,
  withdrawContract,
  withdrawMentionBySourceId,
  type RegisterContext,
} from '../../../services/register/index.ts';
import { WHO, contextFor } from './support.ts';

const lei = (base: string) => `${base}${leiCheckDigits(base)}`;
const LEI_A = lei('984500INVENTED0A01');
const LEI_B = lei('984500INVENTED0B02');

describeEachBackend('register operations', (t) => {
  let ctx: RegisterContext;
  beforeAll(() => {
    ctx = contextFor(t.db());
  });

  async function eventCount(): Promise<number> {
    const row = await t
      .db()
      .selectFrom('history_event')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .executeTakeFirstOrThrow();
    return Number(row.n);
  }

  it('withdraws a mention by its (source, externalId), and names the pair it does not hold', async () => {
    const stored = await resolveMention(ctx, { source: 'erp-w', externalId: 'w1', text: 'Fernwhistle Pumps Ltd', country: 'GB' }, WHO);
    const withdrawn = await withdrawMentionBySourceId(ctx, 'erp-w', 'w1', WHO);
    expect(withdrawn).toMatchObject({ mentionId: stored.mentionId, status: 'withdrawn', previousCounterpartyId: stored.counterpartyId });
    await expect(withdrawMentionBySourceId(ctx, 'erp-w', 'no-such', WHO)).rejects.toMatchObject({
      code: 'NOT_FOUND',
      message: 'mention erp-w/no-such does not exist',
    });
  });

  it('answers a repeated mention from storage, and re-resolves a changed one with a mention_changed event', async () => {
    const first = await resolveMention(ctx, { source: 'crm', externalId: 'r1', text: 'Saltmarsh Turbines Ltd', country: 'GB' }, WHO);
    const events = await eventCount();
    const again = await resolveMention(ctx, { source: 'crm', externalId: 'r1', text: 'Saltmarsh Turbines Ltd', country: 'GB' }, WHO);
    expect(again).toMatchObject({ alreadyIngested: true, mentionId: first.mentionId, counterpartyId: first.counterpartyId, eventId: null });
    expect(await eventCount()).toBe(events);
    const changed = await resolveMention(ctx, { source: 'crm', externalId: 'r1', text: 'Oakhollow Printing GmbH', country: 'DE' }, WHO);
    expect(changed.mentionId).toBe(first.mentionId);
    expect(changed.counterpartyId).not.toBe(first.counterpartyId);
    const event = await t.db().selectFrom('history_event').select(['type', 'payload']).where('id', '=', changed.eventId!).executeTakeFirstOrThrow();
    expect(event.type).toBe('mention_changed');
    expect((event.payload as { details: { previousText: string } }).details.previousText).toBe('Saltmarsh Turbines Ltd');
  });

  it('keeps a term as unbound until its contract arrives, then resolves it through the contract', async () => {
    const early = await resolveMention(ctx, { source: 'inbox', externalId: 'e1', text: 'the Licensee', contract: { source: 'clm', externalId: 'LIC-7' } }, WHO);
    expect(early.status).toBe('unbound_term');
    const stored = await storeContract(
      ctx,
      {
        source: 'clm',
        externalId: 'LIC-7',
        title: 'Software licence',
        text: 'This Licence Agreement is made between Corvid Lane Software Limited, a company incorporated in England and Wales (the "Licensor"), and Meadowpipe Breweries Ltd, a company incorporated in Scotland (the "Licensee").',
      },
      WHO,
    );
    const licensee = stored.parties.find((p) => p.role === 'Licensee')!;
    expect(licensee.status).toBe('new');
    expect(stored.reresolved).toHaveLength(1);
    expect(stored.reresolved[0]).toMatchObject({ mentionId: early.mentionId, status: 'linked', counterpartyId: licensee.counterpartyId });
    // The same contract again is a no-op.
    const twice = await storeContract(
      ctx,
      {
        source: 'clm',
        externalId: 'LIC-7',
        title: 'Software licence',
        text: stored.contract.parties.length
          ? (await t.db().selectFrom('contract').select('text').where('id', '=', stored.contractId).executeTakeFirstOrThrow()).text
          : '',
      },
      WHO,
    );
    expect(twice.alreadyStored).toBe(true);
    // Withdrawing the contract withdraws its party mentions.
    const withdrawn = await withdrawContract(ctx, stored.contractId, WHO);
    expect(withdrawn.withdrawnMentionIds).toHaveLength(2);
    const view = await getCounterparty(ctx, licensee.counterpartyId!);
    expect(view.counterparty.contracts).toHaveLength(0);
  });

  it('a changed contract keeps its party mentions and re-resolves the ones whose text changed', async () => {
    const v1 =
      'This Agreement is made between Ravelston Quarry Products Limited, a company incorporated in Scotland (the "Seller"), and Glenmarrow Aggregates Ltd, a company incorporated in Scotland (the "Buyer").';
    const first = await storeContract(ctx, { source: 'clm', externalId: 'Q-1', text: v1 }, WHO);
    expect(first.parties).toHaveLength(2);
    const v2 =
      'This Agreement is made between Ravelston Quarry Products Limited, a company incorporated in Scotland (the "Seller"), and Tarbolton Haulage Limited, a company incorporated in Scotland (the "Buyer").';
    const second = await storeContract(ctx, { source: 'clm', externalId: 'Q-1', text: v2 }, WHO);
    expect(second.contractId).toBe(first.contractId);
    const buyer = second.parties.find((p) => p.role === 'Buyer')!;
    expect(buyer.mentionId).toBe(first.parties.find((p) => p.role === 'Buyer')!.mentionId);
    expect(buyer.counterpartyId).not.toBe(first.parties.find((p) => p.role === 'Buyer')!.counterpartyId);
    expect(second.contract.parties.map((p) => p.text)).toEqual(['Ravelston Quarry Products Limited', 'Tarbolton Haulage Limited']);
    const seller = second.parties.find((p) => p.role === 'Seller')!;
    expect(seller.alreadyIngested).toBe(true);
  });

  it('links on an equal strong identifier, confirms the name by it, and refuses the identifier to a second counterparty', async () => {
    const created = await createCounterparty(
      ctx,
      { name: 'Pendlebury Marine Coatings Limited', jurisdiction: 'GB', identifiers: [{ scheme: 'lei', value: LEI_A }] },
      WHO,
    );
    const viaLei = await resolveMention(ctx, { source: 'kyc', externalId: 'l1', text: 'PMC Coatings', identifiers: [{ scheme: 'lei', value: LEI_A }] }, WHO);
    expect(viaLei.status).toBe('linked');
    expect(viaLei.counterpartyId).toBe(created.counterpartyId);
    expect(viaLei.explanation.override).toBe('decisive_identifier');
    const other = await createCounterparty(ctx, { name: 'Harrowgate Sailmakers Ltd', jurisdiction: 'GB' }, WHO);
    await expect(addIdentifier(ctx, other.counterpartyId, { scheme: 'lei', value: LEI_A }, WHO)).rejects.toMatchObject({ code: 'IDENTIFIER_TAKEN' });
    await expect(addIdentifier(ctx, other.counterpartyId, { scheme: 'lei', value: 'NOT-AN-LEI' }, WHO)).rejects.toMatchObject({ code: 'INVALID_INPUT' });
    const added = await addIdentifier(ctx, other.counterpartyId, { scheme: 'lei', value: LEI_B }, WHO);
    expect(added.identifierId).not.toBeNull();
  });

  it("applies the canonical-value rules: a person's rename wins and stays", async () => {
    const r = await resolveMention(ctx, { source: 'crm', externalId: 'c1', text: 'Thistledown Foods', country: 'GB' }, WHO);
    await resolveMention(ctx, { source: 'crm', externalId: 'c2', text: 'Thistledown Foods Limited', country: 'GB' }, WHO);
    // Rule 2: the full legal name with its legal form beats the bare name.
    expect((await getCounterparty(ctx, r.counterpartyId!)).counterparty.canonicalName).toBe('Thistledown Foods Limited');
    await renameCounterparty(ctx, r.counterpartyId!, { name: 'Thistledown Foods Ltd' }, WHO);
    await resolveMention(ctx, { source: 'crm', externalId: 'c3', text: 'Thistledown Foods Limited', country: 'GB' }, WHO);
    const view = await getCounterparty(ctx, r.counterpartyId!);
    expect(view.counterparty.canonicalName).toBe('Thistledown Foods Ltd');
    expect(view.counterparty.nameLockedBy).toBe(WHO.actor);
    await addName(ctx, r.counterpartyId!, { name: 'Thistledown Larder', kind: 'trade' }, WHO);
    const names = (await getCounterparty(ctx, r.counterpartyId!)).counterparty.names.map((n) => `${n.kind}:${n.name}`);
    expect(names).toContain('trade:Thistledown Larder');
  });

  it('relations never merge; successor_of needs its date', async () => {
    const parent = await createCounterparty(ctx, { name: 'Greyfriars Holdings plc', jurisdiction: 'GB' }, WHO);
    const child = await createCounterparty(ctx, { name: 'Greyfriars Ropeworks Ltd', jurisdiction: 'GB' }, WHO);
    await expect(addRelation(ctx, { fromId: child.counterpartyId, toId: parent.counterpartyId, type: 'successor_of' }, WHO)).rejects.toMatchObject({
      code: 'INVALID_INPUT',
    });
    await expect(
      addRelation(ctx, { fromId: child.counterpartyId, toId: parent.counterpartyId, type: 'successor_of', since: '2021-02-30' }, WHO),
    ).rejects.toMatchObject({ code: 'INVALID_INPUT' });
    // Year 0000 is no Gregorian year (ISO 8601 reads it as 1 BC only by agreement): it was stored. Each refusal names
    // the field and the rule, never the value given (issue 17 item 6).
    for (const since of ['0000-01-01', '0000-12-31', 'not a date']) {
      const refused = addRelation(ctx, { fromId: child.counterpartyId, toId: parent.counterpartyId, type: 'successor_of', since }, WHO);
      await expect(refused).rejects.toMatchObject({ code: 'INVALID_INPUT', details: { field: 'since' } });
      await expect(refused).rejects.toSatisfy((error: Error) => !error.message.includes(since));
    }
    await expect(
      resolveMention(ctx, { source: 'ap', externalId: 'c1', text: 'Greyfriars Ropeworks Ltd', country: 'jo.bloggs@example.invalid' }, WHO),
    ).rejects.toSatisfy((error: Error & { code?: string }) => error.code === 'INVALID_INPUT' && !error.message.includes('jo.bloggs'));
    const rel = await addRelation(ctx, { fromId: parent.counterpartyId, toId: child.counterpartyId, type: 'parent_of' }, WHO);
    const view = await getCounterparty(ctx, child.counterpartyId);
    expect(view.counterparty.status).toBe('active');
    expect(view.counterparty.relations).toEqual([
      expect.objectContaining({ type: 'parent_of', fromCounterpartyId: parent.counterpartyId, toCounterpartyId: child.counterpartyId }),
    ]);
    await removeRelation(ctx, rel.relationId, WHO);
    expect((await getCounterparty(ctx, child.counterpartyId)).counterparty.relations).toEqual([]);
  });

  it('an unlinked mention is never put back by reresolve; a set-aside one is left alone', async () => {
    const a = await resolveMention(ctx, { source: 'ap', externalId: 'u1', text: 'Wickham Loom Supplies Ltd', country: 'GB' }, WHO);
    const b = await resolveMention(ctx, { source: 'ap', externalId: 'u2', text: 'Wickham Loom Supplies Limited', country: 'GB' }, WHO);
    expect(b.counterpartyId).toBe(a.counterpartyId);
    const unlinked = await unlinkMention(ctx, b.mentionId, { ...WHO, reason: 'a different company' });
    expect(unlinked.previousCounterpartyId).toBe(a.counterpartyId);
    const c = await resolveMention(ctx, { source: 'ap', externalId: 'u3', text: 'Signal Box Antiques', country: 'GB' }, WHO);
    await setAsideMention(ctx, c.mentionId, WHO);
    await reresolve(ctx, WHO);
    const after = await t
      .db()
      .selectFrom('mention')
      .select(['id', 'status', 'counterparty_id'])
      .where('id', 'in', [b.mentionId, c.mentionId])
      .orderBy('id')
      .execute();
    expect(Number(after[0]!.counterparty_id)).not.toBe(a.counterpartyId);
    expect(after[1]!.status).toBe('set_aside');
  });

  it('reresolve after a threshold change moves what no person confirmed, with every change in the history', async () => {
    const x = await resolveMention(ctx, { source: 'rr', externalId: '1', text: 'Cobbleford Valve Ltd', country: 'GB' }, WHO);
    const y = await resolveMention(ctx, { source: 'rr', externalId: '2', text: 'Cobbleford Valve Limited', country: 'GB' }, WHO);
    expect(y.status).toBe('linked');
    expect(y.counterpartyId).toBe(x.counterpartyId);
    const before = await eventCount();
    // Nothing links any more: linkAt far above any name score; what was linked goes to review.
    await writeSettings(t.db(), { linkAt: 1000, newAt: 0, weights: {}, updatedBy: WHO.actor });
    try {
      const summary = await reresolve(ctx, WHO);
      expect(summary.failed).toBe(0);
      expect(summary.changed).toBeGreaterThan(0);
      const moved = await t.db().selectFrom('mention').select(['status', 'confirmed_by']).where('id', '=', y.mentionId).executeTakeFirstOrThrow();
      expect(moved.status).toBe('review');
      expect(await eventCount()).toBe(before + summary.changed);
      // A second run changes nothing.
      expect((await reresolve(ctx, WHO)).changed).toBe(0);
    } finally {
      await t.db().deleteFrom('matcher_settings').execute();
    }
  });

  it('the sweep files a duplicate for look-alike counterparties and proposes affiliate_of for a shared phone only; it merges nothing', async () => {
    const one = await createCounterparty(ctx, { name: 'Brambleholt Joinery Limited', jurisdiction: 'GB' }, WHO);
    const two = await createCounterparty(ctx, { name: 'Brambleholt Joinery Ltd', jurisdiction: 'GB' }, WHO);
    const p = await createCounterparty(
      ctx,
      { name: 'Quayside Netmakers Ltd', jurisdiction: 'GB', identifiers: [{ scheme: 'phone', value: '+44 20 7946 0011' }] },
      WHO,
    );
    const q = await createCounterparty(
      ctx,
      { name: 'Harbourlight Chandlery Ltd', jurisdiction: 'GB', identifiers: [{ scheme: 'phone', value: '+44 20 7946 0011' }] },
      WHO,
    );
    const summary = await sweep(ctx, WHO);
    const items = await listReviewItems(ctx, { limit: 1000 });
    const pair = (a: number, b: number) => items.find((i) => [i.leftCounterpartyId, i.rightCounterpartyId].sort().join() === [a, b].sort().join());
    expect(pair(one.counterpartyId, two.counterpartyId)?.kind).toBe('duplicate');
    expect(pair(p.counterpartyId, q.counterpartyId)?.kind).toBe('affiliate');
    expect(summary.duplicateItems).toBeGreaterThan(0);
    for (const id of [one, two, p, q].map((c) => c.counterpartyId)) expect((await getCounterparty(ctx, id)).merged).toBe(false);
    // A second sweep files nothing new.
    expect((await sweep(ctx, WHO)).itemIds).toEqual([]);
    // Deciding: same → merged; undo → apart again.
    const decided = await decideReview(ctx, pair(one.counterpartyId, two.counterpartyId)!.id, { decision: 'same' }, WHO);
    expect((await getCounterparty(ctx, two.counterpartyId)).counterparty.id).toBe(decided.counterpartyId);
    await undoEvent(ctx, decided.eventId, WHO);
    expect((await getCounterparty(ctx, two.counterpartyId)).merged).toBe(false);
    const affiliate = await decideReview(ctx, pair(p.counterpartyId, q.counterpartyId)!.id, { decision: 'same' }, WHO);
    expect(affiliate.counterpartyId).toBe(q.counterpartyId);
    const rel = (await getCounterparty(ctx, p.counterpartyId)).counterparty.relations;
    expect(rel).toEqual([expect.objectContaining({ type: 'affiliate_of' })]);
  });
});
