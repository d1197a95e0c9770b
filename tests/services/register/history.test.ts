/**
 * History: append-only, dependency-aware undo that names the blocking events, exact undo, replay from empty.
 * Names are invented.
 */
import { sql } from 'kysely';
import fc from 'fast-check';
import { beforeAll, expect, it } from 'vitest';
import { seededRandom } from '../../../resolvers/prng.ts';
import { describeEachBackend, openTestDatabase } from '../../support/index.ts';
import {
  mergeCounterparties,
  RegisterError,
  replayHistory,
  resolveMention,
  splitCounterparty,
  stateSnapshot,
  undoEvent,
  type RegisterContext,
} from '../../../services/register/index.ts';
import { WHO, contextFor, expectSameState, randomName, runWorkload } from './support.ts';

describeEachBackend('register history', (t) => {
  let ctx: RegisterContext;
  beforeAll(() => {
    ctx = contextFor(t.db());
  });

  it('refuses to change or delete a history event', async () => {
    await resolveMention(ctx, { source: 'h0', externalId: '1', text: 'Lanterndale Ceramics Ltd' }, WHO);
    await expect(sql`UPDATE history_event SET actor = 'someone else'`.execute(t.db())).rejects.toThrow(/append-only/);
    await expect(sql`DELETE FROM history_event`.execute(t.db())).rejects.toThrow(/append-only/);
  });

  it('refuses an undo while a later event depends on it, naming that event; undone in order it restores the state', async () => {
    const before = await stateSnapshot(t.db());
    const first = await resolveMention(ctx, { source: 'h1', externalId: '1', text: 'Pellbridge Surveying Limited', country: 'GB' }, WHO);
    expect(first.status).toBe('new');
    const second = await resolveMention(ctx, { source: 'h1', externalId: '2', text: 'Pellbridge Surveying Ltd', country: 'GB' }, WHO);
    expect(second.status).toBe('linked');
    expect(second.counterpartyId).toBe(first.counterpartyId);
    const refused = await undoEvent(ctx, first.eventId!, WHO).catch((e: unknown) => e);
    expect(refused).toBeInstanceOf(RegisterError);
    expect((refused as RegisterError).code).toBe('UNDO_BLOCKED');
    expect((refused as RegisterError).message).toContain(String(second.eventId));
    expect((refused as RegisterError).details.blockingEvents).toEqual([expect.objectContaining({ id: second.eventId, type: 'linked' })]);
    await undoEvent(ctx, second.eventId!, WHO);
    await undoEvent(ctx, first.eventId!, WHO);
    expectSameState(await stateSnapshot(t.db()), before);
    await expect(undoEvent(ctx, first.eventId!, WHO)).rejects.toMatchObject({ code: 'ALREADY_UNDONE' });
    const undoRow = await t.db().selectFrom('history_event').select('id').where('undoes_event_id', '=', first.eventId!).executeTakeFirstOrThrow();
    await expect(undoEvent(ctx, Number(undoRow.id), WHO)).rejects.toMatchObject({ code: 'NOT_UNDOABLE' });
  });

  it('replays the history of a random workload into an empty database, state tables equal row for row', async () => {
    const stats = await runWorkload(ctx, seededRandom(20261202), 120, 'w1');
    // The workload exercised more than resolution (the refusals are the register doing its job).
    expect(stats.steps).toBe(120);
    const types = await t.db().selectFrom('history_event').select('type').distinct().execute();
    expect(types.map((r) => r.type)).toEqual(expect.arrayContaining(['created', 'linked', 'merged', 'split', 'undone', 'renamed']));
    const target = await openTestDatabase(t.backend);
    try {
      await replayHistory(t.db(), target.db, ctx.derived);
      expectSameState(await stateSnapshot(target.db), await stateSnapshot(t.db()));
    } finally {
      await target.close();
    }
  });

  it('property: after any sequence of link / merge / split / undo, undoing the newest standing event restores the state exactly', async () => {
    let run = 0;
    const command = fc.oneof(
      fc.record({ kind: fc.constant('link' as const), seed: fc.nat() }),
      fc.record({ kind: fc.constant('merge' as const), a: fc.nat(), b: fc.nat() }),
      fc.record({ kind: fc.constant('split' as const), m: fc.nat(), toNew: fc.boolean(), target: fc.nat() }),
      fc.record({ kind: fc.constant('undo' as const) }),
    );
    await fc.assert(
      fc.asyncProperty(fc.array(command, { minLength: 3, maxLength: 10 }), async (commands) => {
        const source = `p${run++}`;
        const stack: { eventId: number; before: Awaited<ReturnType<typeof stateSnapshot>> }[] = [];
        let n = 0;
        for (const c of commands) {
          const before = await stateSnapshot(t.db());
          let eventId: number | null = null;
          try {
            if (c.kind === 'link') {
              const r = await resolveMention(ctx, { source, externalId: String(n++), text: randomName(seededRandom(c.seed)) }, WHO);
              eventId = r.eventId;
            } else if (c.kind === 'merge' || c.kind === 'split') {
              const ids = (
                await t
                  .db()
                  .selectFrom('mention')
                  .select('counterparty_id')
                  .where('source', '=', source)
                  .where('counterparty_id', 'is not', null)
                  .orderBy('id')
                  .execute()
              ).map((r) => Number(r.counterparty_id));
              if (c.kind === 'merge' && ids.length > 0) {
                eventId = (await mergeCounterparties(ctx, { ids: [ids[c.a % ids.length]!, ids[c.b % ids.length]!] }, WHO)).eventId;
              } else if (c.kind === 'split' && ids.length > 0) {
                const mentions = await t
                  .db()
                  .selectFrom('mention')
                  .select(['id', 'counterparty_id'])
                  .where('source', '=', source)
                  .where('counterparty_id', 'is not', null)
                  .orderBy('id')
                  .execute();
                const m = mentions[c.m % mentions.length]!;
                const target = c.toNew ? undefined : ids[c.target % ids.length];
                eventId = (
                  await splitCounterparty(
                    ctx,
                    Number(m.counterparty_id),
                    { mentionIds: [Number(m.id)], ...(target !== undefined ? { targetId: target } : {}) },
                    WHO,
                  )
                ).eventId;
              }
            } else if (stack.length > 0) {
              const last = stack.pop()!;
              await undoEvent(ctx, last.eventId, WHO);
              expectSameState(await stateSnapshot(t.db()), last.before);
            }
          } catch (error) {
            // Refusals are allowed (merging one counterparty with itself, splitting into itself); nothing changed.
            if (!(error instanceof RegisterError)) throw error;
            expectSameState(await stateSnapshot(t.db()), before);
          }
          if (eventId !== null) stack.push({ eventId, before });
        }
        // Unwind everything: the register is back where the sequence started.
        while (stack.length > 0) {
          const last = stack.pop()!;
          await undoEvent(ctx, last.eventId, WHO);
          expectSameState(await stateSnapshot(t.db()), last.before);
        }
      }),
      { numRuns: t.backend === 'pglite' ? 12 : 20, seed: 6 },
    );
  });
});
