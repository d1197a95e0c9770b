/**
 * Stored name analyses (migrations/20261205180000_counterparty_name_analysis.ts, compact since
 * migrations/20261205210000_compact_name_analysis.ts): every write path stores each name's analysis in its compact
 * form with the current version and its counterparty's jurisdiction; candidates are scored on the stored analysis
 * (rebuilt from it when the process does not hold it) and only stale rows are analysed again; `verify` reports stale names as their own finding; the
 * re-analysis upkeep rewrites stale analyses and keys in chunks. Names are invented.
 */
import { sql } from 'kysely';
import { beforeAll, expect, it } from 'vitest';
import { ANALYSIS_VERSION, analyseName, rebuildAnalysis, type CompactAnalysis } from '../../../resolvers/analyse/index.ts';
import { createRegisterContext, resolveMention, setJurisdiction, type RegisterContext } from '../../../services/register/index.ts';
import { loadCounterparties } from '../../../services/register/bulk-load.ts';
import { analyse, dropAnalysisCache } from '../../../services/register/matching/analysis.ts';
import { newMatchStats } from '../../../services/register/matching/match-stats.ts';
import { keysOfAnalysis, nameBlockingKeys } from '../../../services/register/matching/keys.ts';
import { candidateDetails } from '../../../db/queries/blocking-keys.ts';
import { reanalyseNames } from '../../../services/register/reanalyse-names.ts';
import { verifyRegister } from '../../../services/verify/index.ts';
import { describeEachBackend } from '../../support/index.ts';

const WHO = { actor: 'test:stored-analysis' };

describeEachBackend('stored name analyses', (t) => {
  let ctx: RegisterContext;
  const stored = async () =>
    (
      await sql<{ name_id: string | number; name: string; analysis: unknown; analysis_version: number; country: string | null; jurisdiction: string | null }>`
        SELECT a.name_id, n.name, a.analysis, a.analysis_version, a.country, cp.jurisdiction
        FROM counterparty_name n JOIN counterparty cp ON cp.id = n.counterparty_id
        LEFT JOIN counterparty_name_analysis a ON a.name_id = n.id ORDER BY n.id`.execute(t.db())
    ).rows;
  const keysOf = async () =>
    (await sql<{ name_id: string | number; key: string }>`SELECT name_id, key FROM blocking_key ORDER BY name_id, key`.execute(t.db())).rows.map(
      (r) => `${Number(r.name_id)} ${r.key}`,
    );

  beforeAll(async () => {
    ctx = createRegisterContext(t.db());
    await resolveMention(ctx, { source: 's', externalId: '1', text: 'Brackenvale Pumps Ltd', country: 'GB' }, WHO);
    await resolveMention(ctx, { source: 's', externalId: '2', text: 'Ostermark Fenster GmbH', country: 'DE' }, WHO);
    await loadCounterparties(ctx, [{ name: 'Quillbury Anchors Inc', country: 'US' }, { name: 'Tessaly Grain Cooperative' }], WHO, { source: 'bulk' });
  });

  it('stores every name written (single resolve, bulk load) compactly, with the current version, under its jurisdiction', async () => {
    const rows = await stored();
    expect(rows.length).toBe(4);
    for (const row of rows) {
      expect(row.name_id).not.toBeNull();
      expect(row.analysis_version).toBe(ANALYSIS_VERSION);
      expect(row.country).toBe(row.jurisdiction);
      const compact = (typeof row.analysis === 'string' ? JSON.parse(row.analysis) : row.analysis) as CompactAnalysis;
      // The compact form, not the whole analysis (no fallback, no ELF code lists written out).
      expect(compact.x).toBeUndefined();
      expect(compact.l === undefined || !('e' in compact.l)).toBe(true);
      const fresh = analyseName(row.name, row.jurisdiction ? { country: row.jurisdiction } : undefined);
      expect(rebuildAnalysis(row.name, row.jurisdiction, compact)).toEqual(fresh);
    }
    expect((await verifyRegister(t.db())).ok).toBe(true);
  });

  it('scores candidates on their stored analysis and analyses again only a stale one', async () => {
    const stats = newMatchStats();
    const counting = createRegisterContext(t.db(), { stats });
    const first = await resolveMention(counting, { source: 's', externalId: '3', text: 'Brackenvale Pumps Limited', country: 'GB' }, WHO);
    expect(stats.storedAnalyses).toBeGreaterThan(0);
    expect(stats.reanalysed).toBe(0);
    // A process that holds no analysis (a new one) rebuilds the candidates' analyses from the stored rows.
    dropAnalysisCache();
    const rebuiltBefore = stats.rebuilt;
    const fresh = await resolveMention(counting, { source: 's', externalId: '3b', text: 'Brackenvale Pumps Limited', country: 'GB' }, WHO);
    expect(stats.rebuilt).toBeGreaterThan(rebuiltBefore);
    expect(stats.reanalysed).toBe(0);
    expect([fresh.status, fresh.counterpartyId]).toEqual([first.status, first.counterpartyId]);
    // A row of an older version is not used: the candidate is analysed again, and the outcome is the same.
    await sql`UPDATE counterparty_name_analysis SET analysis_version = ${ANALYSIS_VERSION - 1}`.execute(t.db());
    const again = await resolveMention(counting, { source: 's', externalId: '4', text: 'Brackenvale Pumps Limited', country: 'GB' }, WHO);
    expect(stats.reanalysed).toBeGreaterThan(0);
    expect([again.status, again.counterpartyId]).toEqual([first.status, first.counterpartyId]);
    await reanalyseNames(ctx);
  });

  it('reports stale names as their own finding with the fixing command, and the upkeep rewrites them in chunks', async () => {
    const sound = await keysOf();
    // An older register: no stored analyses at all, and one name's keys those of another analysis.
    const [victim] = await stored();
    await sql`DELETE FROM counterparty_name_analysis`.execute(t.db());
    await sql`DELETE FROM blocking_key WHERE name_id = ${victim!.name_id}`.execute(t.db());
    await sql`INSERT INTO blocking_key (key, counterparty_id, name_id)
      SELECT 't:olderkey', counterparty_id, id FROM counterparty_name WHERE id = ${victim!.name_id}`.execute(t.db());
    const report = await verifyRegister(t.db());
    const finding = report.checks.find((c) => c.check === 'name_analysis_stale')!;
    const names = (await stored()).length;
    expect(finding.ok).toBe(false);
    expect(finding.violationCount).toBe(names);
    expect(finding.violations[0]!.message).toContain('cpreg migrate reanalyse');
    // The stale name's keys are not reported a second time as replay differences.
    expect(report.checks.find((c) => c.check === 'replay_differs')!.ok).toBe(true);

    const result = await reanalyseNames(ctx, { chunk: 2 });
    expect(result).toEqual({ names, chunks: Math.ceil(names / 2), version: ANALYSIS_VERSION });
    expect(await keysOf()).toEqual(sound);
    expect((await verifyRegister(t.db())).ok).toBe(true);
    expect((await reanalyseNames(ctx)).names).toBe(0);
  });

  it('analyses a counterparty’s names again when its jurisdiction changes, live and in replay', async () => {
    const rows = await stored();
    const target = rows.find((r) => r.name === 'Tessaly Grain Cooperative')!;
    const cp = await t.db().selectFrom('counterparty_name').select('counterparty_id').where('id', '=', Number(target.name_id)).executeTakeFirstOrThrow();
    await setJurisdiction(ctx, Number(cp.counterparty_id), { jurisdiction: 'NZ' }, WHO);
    const after = (await stored()).find((r) => r.name === 'Tessaly Grain Cooperative')!;
    expect([after.country, after.analysis_version]).toEqual(['NZ', ANALYSIS_VERSION]);
    expect((await verifyRegister(t.db())).ok).toBe(true);
  });

  it('derives blocking keys from the same analysis version (a name written now has the keys of its analysis)', async () => {
    const keys = await keysOf();
    for (const row of await stored()) {
      const own = keys.filter((k) => k.startsWith(`${Number(row.name_id)} `)).map((k) => k.slice(k.indexOf(' ') + 1));
      expect(own.sort()).toEqual([...new Set(nameBlockingKeys({ name: row.name }))].sort());
    }
  });

  it('a register analysed before the ue change (version 1) finds "Talvue Ltd" again once the upkeep rewrote its keys', async () => {
    const made = await resolveMention(ctx, { source: 's', externalId: 't1', text: 'Talvue Ltd', country: 'GB' }, WHO);
    const name = await t.db().selectFrom('counterparty_name').select(['id', 'counterparty_id']).where('name', '=', 'Talvue Ltd').executeTakeFirstOrThrow();
    // The register as version 1 left it: "ue" at a word's end was folded then ("talvu"), so the stored keys and
    // analysis were those of "Talvu Ltd" (the same tokens), none of which the current analysis of the name shares.
    await sql`DELETE FROM blocking_key WHERE name_id = ${name.id}`.execute(t.db());
    for (const key of nameBlockingKeys({ name: 'Talvu Ltd' }))
      await sql`INSERT INTO blocking_key (key, counterparty_id, name_id) VALUES (${key}, ${name.counterparty_id}, ${name.id})`.execute(t.db());
    await sql`UPDATE counterparty_name_analysis SET analysis_version = 1, analysis = ${JSON.stringify(analyse('Talvu Ltd', 'GB'))}::json
      WHERE name_id = ${name.id}`.execute(t.db());
    const probeKeys = keysOfAnalysis(analyse('Talvue Ltd', 'GB'));
    const found = async () => (await candidateDetails(t.db(), probeKeys, [], { limit: 20, country: 'GB' })).map((d) => d.counterpartyId);
    expect(await found()).not.toContain(made.counterpartyId);
    expect((await verifyRegister(t.db())).checks.find((c) => c.check === 'name_analysis_stale')!.violationCount).toBe(1);

    expect((await reanalyseNames(ctx)).names).toBe(1);
    expect(await found()).toContain(made.counterpartyId);
    const again = await resolveMention(ctx, { source: 's', externalId: 't2', text: 'Talvue Ltd', country: 'GB' }, WHO);
    expect(again.counterpartyId).toBe(made.counterpartyId);
    expect((await verifyRegister(t.db())).ok).toBe(true);
  });

  it('verify, reading a schema not yet migrated to stored analyses, says every name is stale and what to run', async () => {
    const names = (await stored()).length;
    await sql`DROP TABLE counterparty_name_analysis`.execute(t.db());
    const report = await verifyRegister(t.db());
    const finding = report.checks.find((c) => c.check === 'name_analysis_stale')!;
    expect([finding.ok, finding.violationCount]).toEqual([false, names]);
    expect(finding.violations[0]!.message).toContain('run `cpreg migrate`, then `cpreg migrate reanalyse`');
    expect(report.checks.filter((c) => !c.ok).map((c) => c.check)).toEqual(['name_analysis_stale']);
  });
});
