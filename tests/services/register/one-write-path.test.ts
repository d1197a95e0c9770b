/**
 * Every register writer buffers its changes and writes them at explicit flushes (docs/register.md, "One write
 * path"). These cases fail if a flush is missing: a read that does not see an earlier change of the same
 * transaction, an id answered before the flush that draws it, a buffer left unwritten.
 */
import { beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/index.ts';
import {
  addName,
  addRelation,
  counterpartyHistory,
  createCounterparty,
  getCounterparty,
  historyEvent,
  mergeCounterparties,
  resolveMention,
  splitCounterparty,
  stateSnapshot,
  undoEvent,
  type RegisterContext,
} from '../../../services/register/index.ts';
import { commitEvent, commitWritten } from '../../../services/register/history/commit.ts';
import { write } from '../../../services/register/transaction.ts';
import { contextFor, expectSameState, WHO } from './support.ts';

// Invented names; the phone number is from Ofcom's range kept for drama (020 7946 0xxx), so it is nobody's.
const PHONE = { scheme: 'phone', value: '+442079460123' };

describeEachBackend('one write path', (t) => {
  let ctx: RegisterContext;
  beforeAll(() => {
    ctx = contextFor(t.db());
  });

  it("a merge of three sees each earlier loser's moves: one shared identifier, one name, no relation left between them", async () => {
    const survivor = await createCounterparty(ctx, { name: 'Quorvale Holdings Ltd' }, WHO);
    const b = await createCounterparty(ctx, { name: 'Quorvale Trading Ltd', otherNames: [{ name: 'Quorvale', kind: 'trade' }], identifiers: [PHONE] }, WHO);
    const c = await createCounterparty(ctx, { name: 'Quorvale Services Ltd', otherNames: [{ name: 'Quorvale', kind: 'trade' }], identifiers: [PHONE] }, WHO);
    await addRelation(ctx, { fromId: b.counterpartyId, toId: c.counterpartyId, type: 'affiliate_of' }, WHO);
    const before = await stateSnapshot(t.db());

    const merged = await mergeCounterparties(ctx, { ids: [survivor.counterpartyId, b.counterpartyId, c.counterpartyId] }, WHO);
    expect(merged.survivorId).toBe(survivor.counterpartyId);
    const detail = (await getCounterparty(ctx, survivor.counterpartyId)).counterparty;
    // C's phone and trade name meet B's, already moved to the survivor in this transaction: twins, not second rows.
    expect(detail.identifiers.filter((i) => i.scheme === 'phone').map((i) => i.value)).toEqual([PHONE.value]);
    expect(detail.names.filter((n) => n.name === 'Quorvale').map((n) => [n.kind, n.seenCount])).toEqual([['trade', 2]]);
    // B → C became survivor → C with B's move, then survivor → survivor with C's: nothing left to say.
    expect(detail.relations).toEqual([]);

    await undoEvent(ctx, merged.eventId, WHO);
    expectSameState(await stateSnapshot(t.db()), before);
  });

  it('a split into a new counterparty sees the names it just moved there: no second name made up for it', async () => {
    const cp = await createCounterparty(ctx, { name: 'Velmora Logistics Ltd' }, WHO);
    const mention = await resolveMention(ctx, { source: 'erp', externalId: 'velmora-1', text: 'Velmora Logistics Ltd' }, WHO);
    expect([mention.status, mention.counterpartyId]).toEqual(['linked', cp.counterpartyId]);
    const split = await splitCounterparty(ctx, cp.counterpartyId, { mentionIds: [mention.mentionId] }, WHO);
    expect(split.created).toBe(true);
    const names = (await getCounterparty(ctx, split.targetId)).counterparty.names;
    expect(names.map((n) => [n.name, n.seenCount])).toEqual([['Velmora Logistics Ltd', 1]]);
  });

  it("answers a new name's real id, and its event names the same id", async () => {
    const cp = await createCounterparty(ctx, { name: 'Brindlemoor Freight GmbH' }, WHO);
    const added = await addName(ctx, cp.counterpartyId, { name: 'Brindlemoor', kind: 'trade' }, WHO);
    expect(added.nameId).toBeLessThan(2 ** 52);
    const names = (await getCounterparty(ctx, cp.counterpartyId)).counterparty.names;
    expect(names.find((n) => n.name === 'Brindlemoor')?.id).toBe(added.nameId);
    const event = await historyEvent(ctx, added.eventId!);
    expect(event?.type).toBe('name_added');
    expect(event?.details.nameId).toBe(added.nameId);
  });

  /** How many history events the register holds. */
  const eventCount = async () =>
    (
      await t
        .db()
        .selectFrom('history_event')
        .select((eb) => eb.fn.countAll().as('n'))
        .executeTakeFirstOrThrow()
    ).n;

  it('refuses an answer that still holds a temporary id, and writes nothing', async () => {
    const before = await stateSnapshot(t.db());
    const feedBefore = await eventCount();
    const careless = write(ctx, async (cs) => {
      const at = new Date().toISOString();
      const cp = await cs.insert('counterparty', {
        canonical_name: 'Tessavin Works Ltd',
        kind: 'organisation',
        status: 'active',
        version: 1,
        created_at: at,
        updated_at: at,
      });
      // The event's id is temporary until the flush: answering it as it is, is the defect refused.
      return { eventId: await commitEvent(cs, { type: 'created', actor: WHO.actor, at: new Date(), details: { counterpartyId: cp.id } }) };
    });
    await expect(careless).rejects.toThrow(/temporary id/);
    expectSameState(await stateSnapshot(t.db()), before);
    const feedAfter = await eventCount();
    expect(feedAfter).toEqual(feedBefore);
  });

  it("draws a new counterparty's id in the write: its rows, its ops and its event hold the real id, the text spelling the temporary one kept", async () => {
    const { id, temp, eventId } = await write(ctx, async (cs) => {
      // One new counterparty and no row to lock: no statement now, the write draws its id (a single resolve's case).
      await cs.reserveAndLock({ counterparty: 1 }, { counterparties: [], namesOf: [] });
      const at = new Date().toISOString();
      const cp = await cs.insert('counterparty', {
        canonical_name: 'Velmora Looms Ltd',
        kind: 'organisation',
        status: 'active',
        version: 1,
        created_at: at,
        updated_at: at,
      });
      const temp = String(cp.id);
      // A text spelling the temporary id's digits is written as sent (the write replaces the id, not the text).
      await cs.update('counterparty', cp.id, { canonical_name: `Velmora Looms ${cp.id} Ltd` });
      // A jurisdiction writes the buffer at once (its names' analyses follow): a write before the event.
      await cs.update('counterparty', cp.id, { jurisdiction: 'GB' });
      // The writer still holds the temporary id: it names the same row.
      await cs.update('counterparty', cp.id, { kind: 'unknown' });
      const eventId = await commitWritten(cs, { type: 'created', actor: WHO.actor, at: new Date(at) });
      return { id: cs.realId(Number(temp)), temp, eventId };
    });
    expect(id).toBeLessThan(2 ** 52);
    const row = await t.db().selectFrom('counterparty').select(['canonical_name', 'jurisdiction', 'kind']).where('id', '=', id).executeTakeFirstOrThrow();
    expect(row).toEqual({ canonical_name: `Velmora Looms ${temp} Ltd`, jurisdiction: 'GB', kind: 'unknown' });
    const event = await t.db().selectFrom('history_event').select(['counterparty_ids', 'payload']).where('id', '=', eventId).executeTakeFirstOrThrow();
    expect(event.counterparty_ids.map(Number)).toEqual([id]);
    const ops = (event.payload as { ops: { op: string; id?: number; row?: { id: number } }[] }).ops;
    expect(ops.map((o) => o.op)).toEqual(['insert', 'update', 'update', 'update']);
    expect(ops.map((o) => o.row?.id ?? o.id)).toEqual([id, id, id, id]);
    // The digits stay in the text only (the name as updated), never as an id.
    expect(JSON.stringify(event.payload).split(temp).length - 1).toBe(1);
  });

  it('writes what a writer left in the buffer before the commit', async () => {
    const id = await write(ctx, async (cs) => {
      const at = new Date().toISOString();
      const cp = await cs.insert('counterparty', {
        canonical_name: 'Orrisdale Metals Ltd',
        kind: 'organisation',
        status: 'active',
        version: 1,
        created_at: at,
        updated_at: at,
      });
      await commitEvent(cs, { type: 'created', actor: WHO.actor, at: new Date(at), details: { counterpartyId: cp.id } });
      // No flush here: the transaction wrapper writes the buffer before the commit.
      return cp.id;
    });
    expect((await getCounterparty(ctx, id)).counterparty.canonicalName).toBe('Orrisdale Metals Ltd');
    expect((await counterpartyHistory(ctx, id)).map((e) => e.type)).toEqual(['created']);
  });
});
