/**
 * Our own entities by their other names (issue 16, item 6): an own entity declared with a trading name is ours when
 * a contract or a mention names it by that name, never a counterparty; the names are kept as a set; adding names
 * to an entity already listed is an event that a replay rebuilds and an undo takes back.
 * All names are invented.
 */
import { beforeAll, expect, it } from 'vitest';
import { describeEachBackend, openTestDatabase } from '../../support/index.ts';
import {
  addOwnEntity,
  ownEntities,
  replayHistory,
  resolveMention,
  stateSnapshot,
  storeContract,
  undoEvent,
  type RegisterContext,
} from '../../../services/register/index.ts';
import { WHO, contextFor, expectSameState } from './support.ts';

const OWN = 'Orvanel Japan K.K.';
const TRADING = 'Orvanel Trading';

// The own entity named only by its trading name, beside a company that is a counterparty.
const CONTRACT = `This Distribution Agreement is made on 3 March 2025 between ${TRADING}, of 4-2 Minato Street, Tokyo (the "Distributor"), and Pellingham Freight Limited, a company incorporated in England and Wales (the "Carrier").`;

describeEachBackend('own entities by their other names', (t) => {
  let ctx: RegisterContext;
  beforeAll(async () => {
    ctx = contextFor(t.db());
  });

  it('stores the other names as a set: a repeat or the legal name itself is not kept twice', async () => {
    const added = await addOwnEntity(
      ctx,
      {
        name: OWN,
        country: 'JP',
        otherNames: [
          { name: TRADING, kind: 'trade' },
          { name: 'ORVANEL TRADING', kind: 'also_known_as' },
          { name: 'Orvanel Japan KK', kind: 'also_known_as' },
        ],
      },
      WHO,
    );
    expect(added).toMatchObject({ created: true, otherNamesAdded: [TRADING] });
    const [own] = await ownEntities(ctx);
    expect(own!.otherNames).toEqual([{ name: TRADING, kind: 'trade' }]);
  });

  it('recognises a contract party named by the trading name as our own entity, not a counterparty', async () => {
    const stored = await storeContract(ctx, { source: 'clm', externalId: 'OJ-1', text: CONTRACT }, WHO);
    expect(stored.parties.map((p) => [p.role, p.status])).toEqual([
      ['Distributor', 'own_entity'],
      ['Carrier', 'new'],
    ]);
    expect(stored.parties[0]!.counterpartyId).toBeNull();
    expect(stored.contract.parties.map((p) => p.text)).toEqual([TRADING, 'Pellingham Freight Limited']);
    const asCounterparty = await t.db().selectFrom('counterparty_name').select('id').where('name', 'ilike', 'Orvanel%').execute();
    expect(asCounterparty).toHaveLength(0);
  });

  it('resolves a mention of the trading name, outside any contract, to our own entity with the name it matched', async () => {
    const mention = await resolveMention(ctx, { source: 'erp', externalId: 'oj-m1', text: TRADING }, WHO);
    expect(mention.status).toBe('own_entity');
    expect(mention.counterpartyId).toBeNull();
    expect(mention.explanation.summary).toContain(`declared trade name "${TRADING}"`);
  });

  it('adds the names an entity already listed does not have yet, as an event that undo takes back and replay rebuilds', async () => {
    const before = await stateSnapshot(t.db());
    const again = await addOwnEntity(
      ctx,
      {
        name: OWN,
        country: 'JP',
        otherNames: [
          { name: TRADING, kind: 'trade' },
          { name: 'Orvanel Nihon', kind: 'former' },
        ],
      },
      WHO,
    );
    expect(again).toMatchObject({ created: false, otherNamesAdded: ['Orvanel Nihon'] });
    expect(again.eventId).not.toBeNull();
    const formerName = await resolveMention(ctx, { source: 'erp', externalId: 'oj-m2', text: 'Orvanel Nihon' }, WHO);
    expect(formerName.status).toBe('own_entity');

    const target = await openTestDatabase(t.backend);
    try {
      await replayHistory(t.db(), target.db, ctx.derived);
      expectSameState(await stateSnapshot(target.db), await stateSnapshot(t.db()));
    } finally {
      await target.close();
    }

    const beforeUndo = await stateSnapshot(t.db());
    expect(beforeUndo.own_entity).not.toEqual(before.own_entity);
    await undoEvent(ctx, formerName.eventId!, WHO);
    await undoEvent(ctx, again.eventId!, WHO);
    expect((await stateSnapshot(t.db())).own_entity).toEqual(before.own_entity);
  });

  it('refuses a kind that is not an own entity name kind, naming the field', async () => {
    await expect(addOwnEntity(ctx, { name: OWN, otherNames: [{ name: 'Orvanel KK', kind: 'observed' as 'trade' }] }, WHO)).rejects.toThrow(
      /otherNames\/0\/kind: must be one of trade, former, also_known_as, legal/,
    );
  });
});
