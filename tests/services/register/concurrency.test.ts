/**
 * Statelessness and concurrency: two service instances, each with its own connection pool, over one database give
 * the same answers; overlapping merges and links run at the same time lose nothing and leave no half-done state.
 * On PGlite (one process, one connection) the two instances share the connection: the test then shows that no
 * answer depends on in-process state. Names are invented.
 */
import { sql } from 'kysely';
import { afterAll, beforeAll, expect, it } from 'vitest';
import type { OpenedDatabase } from '../../../db/open-database.ts';
import { describeEachBackend, openTestDatabase } from '../../support/index.ts';
import { createRegisterContext, mergeCounterparties, resolveMention, type RegisterError, type RegisterContext } from '../../../services/register/index.ts';
import { WHO } from './support.ts';

const VARIANTS = ['Wrenfield Instruments Ltd', 'Wrenfield Instruments Limited', 'WRENFIELD INSTRUMENTS LTD', 'Wrenfield Instruments Ltd.'];

describeEachBackend('register across instances', (t) => {
  let second: OpenedDatabase | undefined;
  let a: RegisterContext;
  let b: RegisterContext;
  beforeAll(async () => {
    a = createRegisterContext(t.db());
    if (t.backend === 'postgres') {
      second = await openTestDatabase({ at: t.database().url! }, { poolSize: 5 });
      b = createRegisterContext(second.db);
    } else {
      b = createRegisterContext(t.db());
    }
  });
  afterAll(async () => {
    await second?.close();
  });

  it('two instances give the same answers', async () => {
    const inputs = ['Ferncastle Logistics GmbH', 'Ferncastle Logistik GmbH', 'Ostlund Acoustics AB', 'Ferncastle Logistics'].map((text, i) => ({
      source: 'two',
      externalId: String(i),
      text,
      country: text.includes('AB') ? 'SE' : 'DE',
    }));
    const fromA = [];
    for (const input of inputs) fromA.push(await resolveMention(a, input, WHO));
    // The same mentions through the other instance: the stored answers, nothing done twice.
    for (const [i, input] of inputs.entries()) {
      const again = await resolveMention(b, input, WHO);
      expect(again.alreadyIngested).toBe(true);
      expect({ status: again.status, counterpartyId: again.counterpartyId }).toEqual({ status: fromA[i]!.status, counterpartyId: fromA[i]!.counterpartyId });
    }
    // A new spelling through the other instance finds what the first created.
    const viaB = await resolveMention(b, { source: 'two', externalId: 'b1', text: 'FERNCASTLE LOGISTICS GMBH', country: 'DE' }, WHO);
    expect(viaB.status).toBe('linked');
    expect(viaB.counterpartyId).toBe(fromA[0]!.counterpartyId);
  });

  it('concurrent mentions of one new company through both instances create it once', async () => {
    const results = await Promise.all(
      VARIANTS.flatMap((text, i) => [
        resolveMention(a, { source: 'race', externalId: `a${i}`, text, country: 'GB' }, WHO),
        resolveMention(b, { source: 'race', externalId: `b${i}`, text, country: 'GB' }, WHO),
      ]),
    );
    const ids = new Set(results.map((r) => r.counterpartyId));
    expect(results.every((r) => r.status === 'linked' || r.status === 'new')).toBe(true);
    expect(results.filter((r) => r.status === 'new')).toHaveLength(1);
    expect(ids.size).toBe(1);
  });

  it('overlapping merges at the same time lose nothing', async () => {
    const stems = ['Ashgrove Cartography', 'Bellwether Tanneries', 'Corran Hydraulics', 'Dunmore Upholstery', 'Eskdale Seedworks', 'Fallowfield Chandlers'];
    const cps: number[] = [];
    for (const [i, stem] of stems.entries()) {
      const one = await resolveMention(a, { source: 'merge', externalId: `${i}-1`, text: `${stem} Ltd`, country: 'GB' }, WHO);
      const two = await resolveMention(b, { source: 'merge', externalId: `${i}-2`, text: `${stem} Limited`, country: 'GB' }, WHO);
      expect(one.status).toBe('new');
      expect(two.counterpartyId).toBe(one.counterpartyId);
      cps.push(one.counterpartyId!);
    }
    const pairs = cps.map((id, i) => [id, cps[(i + 1) % cps.length]!]);
    const outcomes = await Promise.allSettled(pairs.map((ids, i) => mergeCounterparties(i % 2 ? a : b, { ids }, WHO)));
    for (const o of outcomes) {
      // A merge may find its two already one (a concurrent merge got there first); nothing else may fail.
      if (o.status === 'rejected') expect((o.reason as RegisterError).code).toBe('CONFLICT');
    }
    const merged = outcomes.flatMap((o) => (o.status === 'fulfilled' ? o.value.mergedIds : []));
    expect(merged).toHaveLength(cps.length - 1);
    const db = t.db();
    const active = await db.selectFrom('counterparty').select('id').where('id', 'in', cps).where('status', '=', 'active').execute();
    expect(active).toHaveLength(1);
    const survivor = Number(active[0]!.id);
    const mentions = await db.selectFrom('mention').select(['counterparty_id']).where('source', '=', 'merge').execute();
    expect(mentions).toHaveLength(12);
    expect(new Set(mentions.map((m) => Number(m.counterparty_id)))).toEqual(new Set([survivor]));
    const leftovers = await db
      .selectFrom('counterparty_name')
      .select('id')
      .where(
        'counterparty_id',
        'in',
        cps.filter((id) => id !== survivor),
      )
      .execute();
    expect(leftovers).toHaveLength(0);
    const names = await db.selectFrom('counterparty_name').select(['name', 'seen_count']).where('counterparty_id', '=', survivor).execute();
    expect(names.reduce((sum, n) => sum + n.seen_count, 0)).toBe(12);
    const events = await sql`SELECT id FROM history_event WHERE type = 'merged' AND counterparty_ids && ${sql.val(cps)}::bigint[]`.execute(db);
    expect(events.rows).toHaveLength(outcomes.filter((o) => o.status === 'fulfilled').length);
  });
});
