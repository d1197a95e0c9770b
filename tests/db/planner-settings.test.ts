/**
 * db/planner-settings.ts: every connection of the register, on both backends, plans with the register's own
 * settings, and the write of one resolve then updates its counterparty by index rather than through a scan of the
 * whole table (the plan measured with auto_explain on a 10,000-counterparty register, PostgreSQL 15). The plan is
 * checked with EXPLAIN (no timing) on a register of 10,000 rows, as large as the one the fault was measured on.
 * Names are invented.
 */
import { sql } from 'kysely';
import { expect, it } from 'vitest';
import { describeBackends, withTestDatabase } from '../support/index.ts';
import { updateRows } from '../../db/queries/state-writes.ts';
import { PLANNER_SETTINGS } from '../../db/planner-settings.ts';

describeBackends('planner settings', (backend) => {
  it('sets random_page_cost on the connection and updates one row of a 10,000-row table by index', async () => {
    await withTestDatabase(backend, async ({ db }) => {
      const shown = await sql<{ random_page_cost: string }>`SHOW random_page_cost`.execute(db);
      expect(shown.rows[0]!.random_page_cost).toBe(PLANNER_SETTINGS.random_page_cost);
      await sql`INSERT INTO counterparty (canonical_name, created_at, updated_at)
        SELECT 'Quellmoor Pumpwerk ' || g, now(), now() FROM generate_series(1, 10000) AS g`.execute(db);
      await sql`ANALYZE counterparty`.execute(db);
      const write = updateRows('counterparty', ['version'], [{ id: 5000, version: 2 }]);
      const plan = await sql<{ 'QUERY PLAN': string }>`EXPLAIN ${write}`.execute(db);
      const text = plan.rows.map((r) => r['QUERY PLAN']).join('\n');
      expect(text).toMatch(/Index Scan using counterparty_pkey/);
      expect(text).not.toMatch(/Seq Scan on counterparty/);
    });
  });
});
