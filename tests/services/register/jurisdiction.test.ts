/**
 * setJurisdiction: ISO 3166 codes checked (parseJurisdiction, resolvers/compare), one `jurisdiction_changed` event
 * that undoes exactly and replays into an empty database. Invented names. Code forms from ISO 3166-1 alpha-2
 * ("GB") and ISO 3166-2 ("US-DE": country, hyphen, up to three characters).
 */
import { beforeAll, expect, it } from 'vitest';
import { describeEachBackend, openTestDatabase } from '../../support/index.ts';
import {
  createCounterparty,
  getCounterparty,
  renameCounterparty,
  replayHistory,
  setJurisdiction,
  stateSnapshot,
  undoEvent,
  type RegisterContext,
} from '../../../services/register/index.ts';
import { WHO, contextFor, expectSameState } from './support.ts';

describeEachBackend('register: setJurisdiction', (t) => {
  let ctx: RegisterContext;
  beforeAll(() => {
    ctx = contextFor(t.db());
  });

  it('sets, changes and clears the jurisdiction, one event each, version bumped', async () => {
    const created = await createCounterparty(ctx, { name: 'Quillmere Pumps Ltd' }, WHO);
    const set = await setJurisdiction(
      ctx,
      created.counterpartyId,
      { jurisdiction: 'gb', expectedVersion: created.version },
      { ...WHO, reason: 'registered in England' },
    );
    expect(set).toMatchObject({ counterpartyId: created.counterpartyId, jurisdiction: 'GB', version: created.version + 1 });
    expect((await getCounterparty(ctx, created.counterpartyId)).counterparty.jurisdiction).toBe('GB');
    const event = await t.db().selectFrom('history_event').selectAll().where('id', '=', set.eventId!).executeTakeFirstOrThrow();
    expect(event).toMatchObject({ type: 'jurisdiction_changed', actor: WHO.actor, reason: 'registered in England' });
    expect((event.payload as { details: unknown }).details).toEqual({ counterpartyId: created.counterpartyId, from: null, to: 'GB' });
    expect(event.counterparty_ids.map(Number)).toEqual([created.counterpartyId]);

    const sub = await setJurisdiction(ctx, created.counterpartyId, { jurisdiction: 'US-DE' }, WHO);
    expect(sub.jurisdiction).toBe('US-DE');
    const cleared = await setJurisdiction(ctx, created.counterpartyId, { jurisdiction: null }, WHO);
    expect(cleared.jurisdiction).toBeNull();
    expect((await getCounterparty(ctx, created.counterpartyId)).counterparty.jurisdiction).toBeNull();
    // The same value again writes nothing.
    const same = await setJurisdiction(ctx, created.counterpartyId, { jurisdiction: null }, WHO);
    expect(same).toMatchObject({ eventId: null, version: cleared.version });
  });

  it('refuses a code that is not ISO 3166-1 alpha-2 or ISO 3166-2, naming the field, and a stale version', async () => {
    const created = await createCounterparty(ctx, { name: 'Quillmere Valves Ltd', jurisdiction: 'GB' }, WHO);
    for (const bad of ['Britain', 'GBR', 'US_DE', 'US-DELA', '']) {
      await expect(setJurisdiction(ctx, created.counterpartyId, { jurisdiction: bad }, WHO)).rejects.toMatchObject({
        code: 'INVALID_INPUT',
        details: { field: 'jurisdiction' },
      });
    }
    await expect(setJurisdiction(ctx, created.counterpartyId, { jurisdiction: 'IE', expectedVersion: created.version - 1 }, WHO)).rejects.toMatchObject({
      code: 'STALE_VERSION',
    });
    await expect(setJurisdiction(ctx, 99_999_999, { jurisdiction: 'IE' }, WHO)).rejects.toMatchObject({ code: 'NOT_FOUND' });
    expect((await getCounterparty(ctx, created.counterpartyId)).counterparty).toMatchObject({ jurisdiction: 'GB', version: created.version });
  });

  it('undo restores the state exactly; an undo blocked by a later change names it', async () => {
    const created = await createCounterparty(ctx, { name: 'Quillmere Seals Ltd', jurisdiction: 'GB' }, WHO);
    const before = await stateSnapshot(t.db());
    const set = await setJurisdiction(ctx, created.counterpartyId, { jurisdiction: 'IE' }, WHO);
    const renamed = await renameCounterparty(ctx, created.counterpartyId, { name: 'Quillmere Seals Limited' }, WHO);
    await expect(undoEvent(ctx, set.eventId!, WHO)).rejects.toMatchObject({ code: 'UNDO_BLOCKED' });
    await undoEvent(ctx, renamed.eventId!, WHO);
    await undoEvent(ctx, set.eventId!, WHO);
    expectSameState(await stateSnapshot(t.db()), before);
    expect((await getCounterparty(ctx, created.counterpartyId)).counterparty.jurisdiction).toBe('GB');
  });

  it('replays into an empty database: the state tables equal row for row', async () => {
    const created = await createCounterparty(ctx, { name: 'Quillmere Gaskets GmbH' }, WHO);
    await setJurisdiction(ctx, created.counterpartyId, { jurisdiction: 'DE' }, WHO);
    const kept = await setJurisdiction(ctx, created.counterpartyId, { jurisdiction: 'DE-BY' }, WHO);
    const undone = await setJurisdiction(ctx, created.counterpartyId, { jurisdiction: 'AT' }, WHO);
    await undoEvent(ctx, undone.eventId!, WHO);
    expect((await getCounterparty(ctx, created.counterpartyId)).counterparty.jurisdiction).toBe('DE-BY');
    expect(kept.eventId).not.toBeNull();
    const target = await openTestDatabase(t.backend);
    try {
      await replayHistory(t.db(), target.db, ctx.derived);
      expectSameState(await stateSnapshot(target.db), await stateSnapshot(t.db()));
      const row = await target.db.selectFrom('counterparty').select('jurisdiction').where('id', '=', created.counterpartyId).executeTakeFirstOrThrow();
      expect(row.jurisdiction).toBe('DE-BY');
    } finally {
      await target.close();
    }
  });
});
