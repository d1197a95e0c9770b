/**
 * `verify` on a register built by a random workload: sound → no violation; then each kind of violation is
 * planted with plain SQL (the way a bug or a hand edit would) and must be reported with its ids. Ends with the
 * CLI on an embedded directory: exit 0 when sound, 1 with the violation listed after a planted fault.
 */
import { sql } from 'kysely';
import { beforeAll, describe, expect, it } from 'vitest';
import { seededRandom } from '../../resolvers/prng.ts';
import { createRegisterContext, mergeCounterparties, resolveMention, type RegisterContext } from '../../services/register/index.ts';
import { verifyRegister, type VerifyReport } from '../../services/verify/index.ts';
import { createMigratedDataDir, describeEachBackend, removeTempDir, withTestDatabase } from '../support/index.ts';
import { runCli } from '../support/cli.ts';
import { runWorkload } from '../services/register/support.ts';

const WHO = { actor: 'test:verify' };

function violationsOf(report: VerifyReport, check: string) {
  return report.checks.find((c) => c.check === check)?.violations ?? [];
}

describeEachBackend('cpreg verify', (t) => {
  let ctx: RegisterContext;
  beforeAll(async () => {
    ctx = createRegisterContext(t.db());
    await runWorkload(ctx, seededRandom(10_2026), 60, 'v');
    // A sure merge, so that merged rows exist whatever the workload did. The LEI is invented, with valid ISO 17442
    // check digits (ISO 7064 MOD 97-10, computed with resolvers/identifiers/lei.ts).
    const a = await resolveMention(
      ctx,
      { source: 'v', externalId: 'm-a', text: 'Pellowby Instruments Ltd', identifiers: [{ scheme: 'lei', value: 'CPREG0EXAMPLE0000185' }] },
      WHO,
    );
    const b = await resolveMention(ctx, { source: 'v', externalId: 'm-b', text: 'Quarrendon Valves GmbH' }, WHO);
    await mergeCounterparties(ctx, { ids: [a.counterpartyId!, b.counterpartyId!], survivorId: a.counterpartyId!, reason: 'test' }, WHO);
  });

  it('finds nothing wrong with a register built by the register itself, replay included', async () => {
    const report = await verifyRegister(t.db());
    expect(report.checks.filter((c) => !c.ok)).toEqual([]);
    expect(report.ok).toBe(true);
    expect(report.counts.replayedEvents).toBe(report.counts.historyEvents);
    expect(report.checks.map((c) => c.check)).toEqual([
      'mention_not_on_active_counterparty',
      'merged_counterparty_owns_rows',
      'redirect_chain_broken',
      'strong_identifier_shared',
      'review_decision_not_reflected',
      'ingest_counts_do_not_reconcile',
      'canonical_name_rule',
      'name_analysis_stale',
      'replay_differs',
    ]);
  });

  it('reports each planted violation with its ids', async () => {
    const db = t.db();
    const active = await db.selectFrom('counterparty').select('id').where('status', '=', 'active').orderBy('id').execute();
    const merged = await db.selectFrom('counterparty').select(['id', 'merged_into']).where('status', '=', 'merged').orderBy('id').executeTakeFirstOrThrow();
    const linked = await db.selectFrom('mention').select(['id', 'counterparty_id']).where('status', '=', 'linked').orderBy('id').executeTakeFirstOrThrow();
    const name = await db.selectFrom('counterparty_name').select('id').where('counterparty_id', '=', active[0]!.id).orderBy('id').executeTakeFirstOrThrow();
    const mergedId = Number(merged.id);

    // 1. a linked mention whose counterparty is merged
    await db.updateTable('mention').set({ counterparty_id: mergedId }).where('id', '=', linked.id).execute();
    // 2. a merged counterparty owning a name
    await db.updateTable('counterparty_name').set({ counterparty_id: mergedId }).where('id', '=', name.id).execute();
    // 3. a redirect loop (two merged counterparties pointing at each other; the constraints allow it)
    const now = new Date().toISOString();
    const [x, y] = await db
      .insertInto('counterparty')
      .values([
        { canonical_name: 'Loopwell Ltd', created_at: now, updated_at: now },
        { canonical_name: 'Loopwell Limited', created_at: now, updated_at: now },
      ])
      .returning('id')
      .execute();
    await db.updateTable('counterparty').set({ status: 'merged', merged_into: y!.id }).where('id', '=', x!.id).execute();
    await db.updateTable('counterparty').set({ status: 'merged', merged_into: x!.id }).where('id', '=', y!.id).execute();
    // 4. one LEI on two active counterparties (the partial unique index is dropped in this copy only, as a bug would bypass it)
    await sql`DROP INDEX counterparty_identifier_strong_uq`.execute(db);
    const lei = await db
      .selectFrom('counterparty_identifier')
      .select(['counterparty_id'])
      .where('scheme', '=', 'lei')
      .where('value', '=', 'CPREG0EXAMPLE0000185')
      .executeTakeFirstOrThrow();
    const other = active.find((r) => Number(r.id) !== Number(lei.counterparty_id))!;
    await db
      .insertInto('counterparty_identifier')
      .values({ counterparty_id: other.id, scheme: 'lei', value: 'CPREG0EXAMPLE0000185', strong: true, created_at: new Date().toISOString() })
      .execute();
    // 5. a review item marked decided with nothing else recorded
    const review = await db
      .insertInto('review_item')
      .values({
        kind: 'duplicate',
        left_counterparty_id: active[0]!.id,
        right_counterparty_id: other.id,
        status: 'decided',
        decision: 'different',
        decided_by: 'someone',
        decided_at: new Date().toISOString(),
        created_at: new Date().toISOString(),
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    // 6. an ingest run whose counts do not add up
    const run = await db
      .insertInto('ingest_run')
      .values({ source: 'v', actor: 'test', status: 'finished', counts: JSON.stringify({ read: 5, linked: 3, new: 1 }) })
      .returning('id')
      .executeTakeFirstOrThrow();
    // 7. a change that no event records
    await db.updateTable('counterparty').set({ canonical_name: 'Edited Behind The History Ltd' }).where('id', '=', other.id).execute();
    // 8. a canonical name the canonical-value rules would not choose (a counterparty no person renamed)
    const unlocked = await db
      .selectFrom('counterparty')
      .select('id')
      .where('status', '=', 'active')
      .where('name_locked_by', 'is', null)
      .where('id', '!=', other.id)
      .orderBy('id', 'desc')
      .executeTakeFirstOrThrow();
    await db.updateTable('counterparty').set({ canonical_name: 'planted lower-case name ltd' }).where('id', '=', unlocked.id).execute();

    const report = await verifyRegister(db);
    expect(report.ok).toBe(false);
    expect(violationsOf(report, 'mention_not_on_active_counterparty')).toEqual([
      expect.objectContaining({ ids: { mentionId: Number(linked.id), counterpartyId: mergedId } }),
    ]);
    expect(violationsOf(report, 'merged_counterparty_owns_rows')).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ ids: { counterpartyId: mergedId, nameId: Number(name.id) } }),
        expect.objectContaining({ ids: { counterpartyId: mergedId, mentionId: Number(linked.id) } }),
      ]),
    );
    expect(violationsOf(report, 'redirect_chain_broken')).toEqual([
      expect.objectContaining({ message: `the redirect chain of ${x!.id} loops at ${x!.id}` }),
      expect.objectContaining({ message: `the redirect chain of ${y!.id} loops at ${y!.id}` }),
    ]);
    expect(violationsOf(report, 'strong_identifier_shared')).toEqual([
      expect.objectContaining({ ids: { scheme: 'lei', counterpartyIds: [Number(lei.counterparty_id), Number(other.id)].sort((x, y) => x - y).join(',') } }),
    ]);
    const reviewMessages = violationsOf(report, 'review_decision_not_reflected').map((v) => v.message);
    expect(reviewMessages).toEqual(
      expect.arrayContaining([
        `review item ${review.id}: no labelled pair records the decision`,
        `review item ${review.id}: no review_decided event in the history`,
        `review item ${review.id}: decided "different" but no cannot-link keeps the two apart`,
      ]),
    );
    expect(violationsOf(report, 'ingest_counts_do_not_reconcile')).toEqual([expect.objectContaining({ ids: { ingestRunId: Number(run.id) } })]);
    expect(violationsOf(report, 'canonical_name_rule')).toEqual(
      expect.arrayContaining([expect.objectContaining({ ids: { counterpartyId: Number(unlocked.id) } })]),
    );
    const replay = violationsOf(report, 'replay_differs').map((v) => v.message);
    expect(replay).toEqual(
      expect.arrayContaining([
        `counterparty row ${other.id} differs from the replayed history in canonical_name`,
        `counterparty row ${x!.id} is in the register but not in the replayed history`,
        `mention row ${linked.id} differs from the replayed history in counterparty_id`,
      ]),
    );
  });
});

describe('cpreg verify (command line, embedded)', () => {
  it('exits 0 on a sound register and 1 listing the violation after a planted fault', async () => {
    const dir = await createMigratedDataDir();
    try {
      await withTestDatabase(
        { at: dir },
        (opened) => resolveMention(createRegisterContext(opened.db), { source: 'cli', externalId: '1', text: 'Ferncastle Mouldings Ltd' }, WHO),
        { command: 'verify test' },
      );
      const good = await runCli(['verify', '--db', dir, '--json']);
      expect(good.stderr).toBe('');
      expect(good.code).toBe(0);
      expect(JSON.parse(good.stdout)).toMatchObject({ ok: true, counts: { counterparties: 1, mentions: 1 } });

      await withTestDatabase(
        { at: dir },
        (again) =>
          again.db
            .insertInto('ingest_run')
            .values({ source: 'cli', actor: 'test', status: 'finished', counts: JSON.stringify({ read: 2, linked: 1 }) })
            .execute(),
        { command: 'verify test' },
      );
      const bad = await runCli(['verify', '--db', dir]);
      expect(bad.code).toBe(1);
      expect(bad.stdout).toContain('FAIL: every finished ingest run accounts for each row it read: not so for 1 case (ingest_counts_do_not_reconcile)');
      expect(bad.stdout).toContain('ingest run 1: read 2 but the outcomes add up to 1');
      expect(bad.stdout).toMatch(/register NOT verified/);
    } finally {
      removeTempDir(dir);
    }
  }, 120_000);
});
