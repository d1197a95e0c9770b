/**
 * The migration to compact stored analyses (migrations/20261205210000_compact_name_analysis.ts), down and up over a
 * register: the rows of the version before are dropped (no code of this version uses them), the column is json,
 * `cpreg migrate reanalyse`'s upkeep writes every name again in the compact form, and verify passes. Invented names.
 */
import { sql } from 'kysely';
import { expect, it } from 'vitest';
import { describeEachBackend } from '../support/index.ts';
import { createMigrator, migrateToLatest } from '../../db/migrate.ts';
import { ANALYSIS_VERSION } from '../../resolvers/analyse/index.ts';
import { createRegisterContext, resolveMention } from '../../services/register/index.ts';
import { reanalyseNames } from '../../services/register/reanalyse-names.ts';
import { verifyRegister } from '../../services/verify/index.ts';

const WHO = { actor: 'test:compact-analysis' };

describeEachBackend('compact name analysis migration', (t) => {
  it('drops the older rows, makes the column json, and the upkeep writes every name compactly again', async () => {
    const ctx = createRegisterContext(t.db());
    await resolveMention(ctx, { source: 's', externalId: '1', text: 'Harrowfield Quarries Ltd', country: 'GB' }, WHO);
    await resolveMention(ctx, { source: 's', externalId: '2', text: 'Velmora Textil GmbH', country: 'DE' }, WHO);
    const columnType = async () =>
      (
        await sql<{ t: string }>`SELECT format_type(atttypid, atttypmod) AS t FROM pg_attribute
          WHERE attrelid = 'counterparty_name_analysis'::regclass AND attname = 'analysis'`.execute(t.db())
      ).rows[0]!.t;
    expect(await columnType()).toBe('json');

    const down = await createMigrator(t.db()).migrateTo('20261205180000_counterparty_name_analysis');
    expect(down.error).toBeUndefined();
    expect(await columnType()).toBe('jsonb');
    // A row as version 2 wrote it (the whole analysis).
    const name = await t.db().selectFrom('counterparty_name').select('id').orderBy('id').executeTakeFirstOrThrow();
    await sql`INSERT INTO counterparty_name_analysis (name_id, analysis, analysis_version, country)
      VALUES (${name.id}, ${JSON.stringify({ input: 'Harrowfield Quarries Ltd', core: 'harrowfield quarries' })}::jsonb, 2, 'GB')`.execute(t.db());

    await migrateToLatest(t.db());
    expect(await columnType()).toBe('json');
    expect((await sql<{ n: number }>`SELECT count(*)::int AS n FROM counterparty_name_analysis`.execute(t.db())).rows[0]!.n).toBe(0);
    expect((await verifyRegister(t.db())).checks.find((c) => c.check === 'name_analysis_stale')!.violationCount).toBe(2);

    expect((await reanalyseNames(ctx)).names).toBe(2);
    const rows = (await sql<{ analysis: unknown; analysis_version: number }>`SELECT analysis, analysis_version FROM counterparty_name_analysis`.execute(t.db()))
      .rows;
    expect(rows.map((r) => r.analysis_version)).toEqual([ANALYSIS_VERSION, ANALYSIS_VERSION]);
    for (const r of rows) expect(typeof r.analysis === 'string' ? JSON.parse(r.analysis) : r.analysis).not.toHaveProperty('x');
    expect((await verifyRegister(t.db())).ok).toBe(true);
    // Two verifies (each replays the history into a new database) and two migrations: slow on a loaded machine.
  }, 300_000);
});
