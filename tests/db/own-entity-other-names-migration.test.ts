/**
 * The migration that gives our own entities their other names (migrations/20261205160000_own_entity_other_names.ts),
 * down and up again over a register with history: down drops the column and the key from the history's row images,
 * up adds the column and gives every own_entity row image written before it `other_names: []`, so the history still
 * replays to the state tables row for row and an own entity's creation still undoes. Invented names.
 */
import { type Kysely } from 'kysely';
import { beforeAll, expect, it } from 'vitest';
import { describeEachBackend, openTestDatabase } from '../support/index.ts';
import type { Database } from '../../db/types.ts';
import { createMigrator, migrateToLatest } from '../../db/migrate.ts';
import { addOwnEntity, createRegisterContext, replayHistory, stateSnapshot, undoEvent } from '../../services/register/index.ts';
import { expectSameState } from '../services/register/support.ts';

const WHO = { actor: 'test:backfill' };
type Op = { op: string; table: string; row?: Record<string, unknown> };

async function ownEntityImage(db: Kysely<Database>, eventId: number): Promise<Record<string, unknown>> {
  const event = await db.selectFrom('history_event').select('payload').where('id', '=', eventId).executeTakeFirstOrThrow();
  return (event.payload as unknown as { ops: Op[] }).ops.find((op) => op.table === 'own_entity')!.row!;
}

describeEachBackend('own entity other names migration', (t) => {
  let eventId: number;

  beforeAll(async () => {
    const added = await addOwnEntity(createRegisterContext(t.db()), { name: 'Orvanel Benelux B.V.', country: 'NL' }, WHO);
    eventId = added.eventId!;
  });

  it('down removes the column and the key from row images; up puts both back; replay and undo still agree', async () => {
    expect(await ownEntityImage(t.db(), eventId)).toHaveProperty('other_names', []);
    const down = await createMigrator(t.db()).migrateTo('20261205130000_explanation');
    expect(down.error).toBeUndefined();
    expect(await ownEntityImage(t.db(), eventId)).not.toHaveProperty('other_names');

    await migrateToLatest(t.db());
    expect(await ownEntityImage(t.db(), eventId)).toHaveProperty('other_names', []);
    const row = await t.db().selectFrom('own_entity').select('other_names').executeTakeFirstOrThrow();
    expect(row.other_names).toEqual([]);

    const target = await openTestDatabase(t.backend);
    try {
      await replayHistory(t.db(), target.db, createRegisterContext(target.db).derived);
      expectSameState(await stateSnapshot(target.db), await stateSnapshot(t.db()));
    } finally {
      await target.close();
    }
    await undoEvent(createRegisterContext(t.db()), eventId, WHO);
    expect(await t.db().selectFrom('own_entity').select('id').execute()).toEqual([]);
  });
});
