/**
 * `cpreg migrate reanalyse` on an embedded directory whose names have no stored analysis (a register from before
 * stored analyses): `cpreg verify` names the stale names and the command, the command rewrites them, and verify
 * then passes. Names are invented.
 */
import { sql } from 'kysely';
import { describe, expect, it } from 'vitest';
import { createRegisterContext, resolveMention } from '../../../services/register/index.ts';
import { createMigratedDataDir, removeTempDir, withTestDatabase } from '../../support/index.ts';
import { runCli } from '../../support/cli.ts';

describe('cpreg migrate reanalyse (command line, embedded)', () => {
  it('rewrites the stale names verify lists, then verify passes', async () => {
    const dir = await createMigratedDataDir();
    try {
      await withTestDatabase({ at: dir }, async ({ db }) => {
        const ctx = createRegisterContext(db);
        await resolveMention(ctx, { source: 'cli', externalId: '1', text: 'Wendlecombe Castings Ltd' }, { actor: 'test' });
        await resolveMention(ctx, { source: 'cli', externalId: '2', text: 'Harrowgate Tiles plc' }, { actor: 'test' });
        await sql`DELETE FROM counterparty_name_analysis`.execute(db);
      });

      const stale = await runCli(['verify', '--db', dir]);
      expect(stale.code).toBe(1);
      expect(stale.stdout).toContain('not so for 2 cases (name_analysis_stale)');
      expect(stale.stdout).toContain('run `cpreg migrate reanalyse`');

      const fixed = await runCli(['migrate', 'reanalyse', '--db', dir, '--json']);
      expect(fixed.code).toBe(0);
      expect(JSON.parse(fixed.stdout)).toMatchObject({ names: 2, chunks: 1 });

      const good = await runCli(['verify', '--db', dir, '--json']);
      expect(good.code).toBe(0);
      expect(JSON.parse(good.stdout)).toMatchObject({ ok: true });
    } finally {
      removeTempDir(dir);
    }
  }, 400_000);
});
