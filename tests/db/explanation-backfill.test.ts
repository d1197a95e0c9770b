/**
 * The migration that stores each explanation once (migrations/20261205130000_explanation.ts), down and up again over
 * a register with history: down puts every explanation back inline (state rows and the history's row images), up
 * splits them out again. What a person reads is the same before and after both, and the rewritten history still
 * replays to the state tables row for row and still undoes. Invented names.
 */
import { sql, type Kysely } from 'kysely';
import { beforeAll, expect, it } from 'vitest';
import { describeEachBackend, openTestDatabase } from '../support/index.ts';
import type { Database } from '../../db/types.ts';
import { createMigrator, migrateToLatest } from '../../db/migrate.ts';
import { getMention } from '../../db/queries/mentions.ts';
import { getReviewItem } from '../../db/queries/review.ts';
import {
  createRegisterContext,
  replayHistory,
  resolveMention,
  stateSnapshot,
  storeContract,
  undoEvent,
  type ResolveResult,
} from '../../services/register/index.ts';
import { expectSameState } from '../services/register/support.ts';

const WHO = { actor: 'test:backfill' };
type Op = { op: string; table: string; row?: Record<string, unknown>; before?: Record<string, unknown>; after?: Record<string, unknown> };

async function opsOf(db: Kysely<Database>, eventId: number): Promise<Op[]> {
  const event = await db.selectFrom('history_event').select('payload').where('id', '=', eventId).executeTakeFirstOrThrow();
  return (event.payload as unknown as { ops: Op[] }).ops;
}

describeEachBackend('explanations backfilled', (t) => {
  let review: ResolveResult;
  let linked: ResolveResult;

  beforeAll(async () => {
    const ctx = createRegisterContext(t.db());
    await storeContract(
      ctx,
      {
        source: 'clm',
        externalId: 'B-1',
        text: 'This Supply Agreement is made between Vennacott Tiles Limited, a company incorporated in England (the "Supplier"), and Orlestone Quarries Ltd (the "Buyer").',
      },
      WHO,
    );
    review = await resolveMention(ctx, { source: 'erp', externalId: 'b-1', text: 'Vennacott Tiles' }, WHO);
    linked = await resolveMention(ctx, { source: 'erp', externalId: 'b-2', text: 'Orlestone Quarries Limited', country: 'GB' }, WHO);
  });

  it('down puts explanations inline, up splits them out again; readers, replay and undo see the same', async () => {
    expect(review.status).toBe('review');
    const views = async () => ({
      review: JSON.stringify((await getMention(t.db(), review.mentionId))!.evidence),
      item: JSON.stringify((await getReviewItem(t.db(), review.reviewItemId!))!.evidence),
      linked: JSON.stringify((await getMention(t.db(), linked.mentionId))!.evidence),
    });
    const read = await views();

    // Down to the migration before this one (later migrations are undone on the way).
    const down = await createMigrator(t.db()).migrateTo('20261205113000_blocking_key_counterparties');
    expect(down.error).toBeUndefined();
    const inline = await sql<{ evidence: unknown }>`SELECT evidence FROM mention WHERE id = ${review.mentionId}`.execute(t.db());
    expect(JSON.stringify(inline.rows[0]!.evidence)).toBe(read.review);
    const inlineImage = (await opsOf(t.db(), review.eventId!)).find((op) => op.table === 'mention')!.row!;
    expect(inlineImage).not.toHaveProperty('explanation_id');
    expect(JSON.stringify(inlineImage.evidence)).toBe(read.review);

    await migrateToLatest(t.db());
    expect(await views()).toEqual(read);
    const mention = await t.db().selectFrom('mention').selectAll().where('id', '=', review.mentionId).executeTakeFirstOrThrow();
    const item = await t.db().selectFrom('review_item').selectAll().where('id', '=', review.reviewItemId!).executeTakeFirstOrThrow();
    expect(mention.explanation_id).not.toBeNull();
    expect(Number(item.explanation_id)).toBe(Number(mention.explanation_id));
    const images = (await opsOf(t.db(), review.eventId!)).filter((op) => op.table === 'mention' || op.table === 'review_item');
    for (const op of images) expect(op.row!.explanation_id).toBe(Number(mention.explanation_id));
    const summary = (JSON.parse(read.review) as { summary: string }).summary;
    expect(JSON.stringify(await opsOf(t.db(), review.eventId!))).not.toContain(summary);

    const target = await openTestDatabase(t.backend);
    try {
      await replayHistory(t.db(), target.db, createRegisterContext(target.db).derived);
      expectSameState(await stateSnapshot(target.db), await stateSnapshot(t.db()));
    } finally {
      await target.close();
    }
    await undoEvent(createRegisterContext(t.db()), linked.eventId!, WHO);
    await undoEvent(createRegisterContext(t.db()), review.eventId!, WHO);
    const left = await t.db().selectFrom('mention').select('id').where('source', '=', 'erp').execute();
    expect(left).toEqual([]);
  });
});
