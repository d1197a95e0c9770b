/**
 * db/planner-settings.ts: every connection of the register, on both backends, plans with the register's own
 * settings, and the write of one resolve then updates its counterparty by index rather than through a scan of the
 * whole table (the plan measured with auto_explain on a 10,000-counterparty register, PostgreSQL 15). The plan is
 * checked with EXPLAIN (no timing) on a register of 10,000 rows, as large as the one the fault was measured on.
 * Names are invented.
 */
import { sql } from 'kysely';
import { expect, it } from 'vitest';
import { describe } from 'vitest';
import { describeBackends, describePostgres, withTestDatabase, createPostgresCopy, dropPostgresCopy } from '../support/index.ts';
import { openDatabase } from '../../db/open-database.ts';
import { updateRows } from '../../db/queries/state-writes.ts';
import { PLANNER_SETTINGS, withPlannerOptions } from '../../db/planner-settings.ts';

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

describe('withPlannerOptions', () => {
  it('puts the planner settings in the URL, before the options the URL gives (a later -c of one name wins)', () => {
    expect(new URL(withPlannerOptions('postgres://u@db.example:5432/reg')).searchParams.get('options')).toBe('-c random_page_cost=1.1');
    const own = withPlannerOptions('postgres://u@db.example:5432/reg?options=-c%20work_mem%3D8MB&sslmode=disable');
    expect(new URL(own).searchParams.get('options')).toBe('-c random_page_cost=1.1 -c work_mem=8MB');
    expect(new URL(own).searchParams.get('sslmode')).toBe('disable');
  });
});

describePostgres('planner settings with a URL that carries its own options', () => {
  it('applies both the URL options and the planner settings', async () => {
    const url = await createPostgresCopy();
    const withOwn = new URL(url);
    withOwn.searchParams.set('options', '-c work_mem=8MB');
    const opened = await openDatabase(withOwn.toString());
    try {
      const shown = await sql<{
        work_mem: string;
        rpc: string;
      }>`SELECT current_setting('work_mem') AS work_mem, current_setting('random_page_cost') AS rpc`.execute(opened.db);
      expect(shown.rows[0]).toEqual({ work_mem: '8MB', rpc: PLANNER_SETTINGS.random_page_cost });
    } finally {
      await opened.close();
      await dropPostgresCopy(url);
    }
  });
});
