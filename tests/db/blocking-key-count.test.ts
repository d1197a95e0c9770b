/**
 * blocking_key_count (migrations/20261205102000_blocking_key_count.ts, 20261205113000_blocking_key_counterparties.ts)
 * stays equal to counting blocking_key, names and counterparties per key (capped), through every kind of write: a
 * bulk load, resolves, a merge, an undo, concurrent writers; a key at the cap is never changed again. The reference
 * is the aggregate it replaces: least(count(*), 1000) and least(count(DISTINCT counterparty_id), 1000) per key
 * (common practice: a materialised count checked against a recount). Names are invented.
 */
import { sql, type Kysely } from 'kysely';
import { expect, it } from 'vitest';
import { describeBackends, openTestDatabase } from '../support/index.ts';
import type { Database } from '../../db/types.ts';
import { createRegisterContext, mergeCounterparties, resolveMention, undoEvent } from '../../services/register/index.ts';
import { loadCounterparties } from '../../services/register/bulk-load.ts';
import { documentFrequencies } from '../../services/register/matching/idf.ts';

const WHO = { actor: 'test:key-count' };

/**
 * Keys whose stored counts differ from the capped recount (empty when the table is right): names always, and
 * counterparties below the cap (a key at the cap is no longer counted, and rarity reads its names there).
 */
async function countDrift(db: Kysely<Database>): Promise<unknown[]> {
  const result = await sql`
    SELECT coalesce(g.key, c.key) AS key, g.n AS recount, c.names AS stored, g.cps AS recount_counterparties, c.counterparties AS stored_counterparties
    FROM (SELECT key, least(count(*), 1000)::int AS n, least(count(DISTINCT counterparty_id), 1000)::int AS cps FROM blocking_key GROUP BY key) g
    FULL JOIN blocking_key_count c ON c.key = g.key
    WHERE coalesce(g.n, 0) <> coalesce(c.names, 0) OR (coalesce(c.names, 0) < 1000 AND coalesce(g.cps, 0) <> coalesce(c.counterparties, 0))`.execute(db);
  return result.rows;
}

describeBackends('blocking_key_count', (backend) => {
  {
    it('equals the capped recount after loads, resolves, a merge, an undo and concurrent writers', async () => {
      const opened = await openTestDatabase(backend);
      try {
        const ctx = createRegisterContext(opened.db);
        await loadCounterparties(
          ctx,
          ['Quenby Marlow Tiles Ltd', 'Quenby Marlow Glass Ltd', 'Ostrava Pumpworks s.r.o.'].map((name) => ({ name, country: null })),
          WHO,
          { source: 'test' },
        );
        expect(await countDrift(opened.db)).toEqual([]);
        const a = await resolveMention(ctx, { source: 't', externalId: '1', text: 'Veldhoven Anchor Systems B.V.' }, WHO);
        const b = await resolveMention(ctx, { source: 't', externalId: '2', text: 'Veldhoven Ankor Systemen BV' }, WHO);
        expect(await countDrift(opened.db)).toEqual([]);
        // Concurrent writers sharing rare words (PostgreSQL runs them at once; PGlite one after the other).
        await Promise.all(
          ['Tarnwick Rope Makers', 'Tarnwick Rope Makers Ltd', 'Rope Makers of Tarnwick', 'Tarnwick Ropes'].map((text, i) =>
            resolveMention(ctx, { source: 'c', externalId: String(i), text }, WHO),
          ),
        );
        expect(await countDrift(opened.db)).toEqual([]);
        if (a.counterpartyId !== b.counterpartyId) {
          const merged = await mergeCounterparties(ctx, { ids: [a.counterpartyId!, b.counterpartyId!] }, WHO);
          expect(await countDrift(opened.db)).toEqual([]);
          await undoEvent(ctx, merged.eventId!, WHO);
          expect(await countDrift(opened.db)).toEqual([]);
        }
        const df = await documentFrequencies(opened.db, ['quenby', 'tarnwick', 'nowhere']);
        expect(df.get('quenby')).toBe(2); // two loaded names hold it
        expect(df.get('nowhere')).toBe(0);
        // Merged, the two names belong to one counterparty: rarity counts counterparties (one), not names (two).
        const quenby = await sql<{ id: string }>`SELECT id FROM counterparty WHERE canonical_name LIKE 'Quenby%' ORDER BY id`.execute(opened.db);
        const merged = await mergeCounterparties(ctx, { ids: quenby.rows.map((r) => Number(r.id)) }, WHO);
        expect(await countDrift(opened.db)).toEqual([]);
        expect((await documentFrequencies(opened.db, ['quenby'])).get('quenby')).toBe(1);
        await undoEvent(ctx, merged.eventId!, WHO);
        expect(await countDrift(opened.db)).toEqual([]);
        expect((await documentFrequencies(opened.db, ['quenby'])).get('quenby')).toBe(2);
      } finally {
        await opened.close();
      }
    });

    it('leaves a key at the cap alone: more names and fewer names keep it at the cap', async () => {
      const opened = await openTestDatabase(backend);
      try {
        const ctx = createRegisterContext(opened.db);
        const rows = Array.from({ length: 1001 }, (_, i) => ({ name: `Pellworth Cobalt ${i + 1}`, country: null }));
        await loadCounterparties(ctx, rows, WHO, { source: 'test' });
        const stored = async () =>
          (await sql<{ names: number }>`SELECT names FROM blocking_key_count WHERE key = 't:pellworth'`.execute(opened.db)).rows[0]?.names;
        expect(await stored()).toBe(1000);
        await sql`DELETE FROM blocking_key WHERE key = 't:pellworth' AND name_id IN (SELECT name_id FROM blocking_key WHERE key = 't:pellworth' ORDER BY name_id LIMIT 5)`.execute(
          opened.db,
        );
        expect(await stored()).toBe(1000);
        expect((await documentFrequencies(opened.db, ['pellworth'])).get('pellworth')).toBe(1000);
      } finally {
        await opened.close();
      }
    }, 180_000);
  }
});
