/**
 * An explanation is stored once (migrations/20261205130000_explanation.ts): the mention and the review item it
 * files reference one explanation row, and the history's row images carry its id instead of its text. What a person
 * reads is unchanged: the resolve answer, the mention and the review item as read show the same evidence, key for
 * key and in the same order; undo and replay still restore the rows exactly. Invented names.
 */
import { beforeAll, expect, it } from 'vitest';
import { describeEachBackend, openTestDatabase } from '../../support/index.ts';
import { replayHistory, resolveMention, stateSnapshot, storeContract, undoEvent, type RegisterContext } from '../../../services/register/index.ts';
import { getMention } from '../../../db/queries/mentions.ts';
import { getReviewItem } from '../../../db/queries/review.ts';
import { WHO, contextFor, expectSameState } from './support.ts';

describeEachBackend('an explanation stored once', (t) => {
  let ctx: RegisterContext;

  beforeAll(async () => {
    ctx = contextFor(t.db());
    await storeContract(
      ctx,
      {
        source: 'clm',
        externalId: 'X-1',
        text: 'This Haulage Agreement is made between Quillacombe Freight Limited, a company incorporated in England (the "Carrier"), and Tessingham Mills Ltd (the "Customer").',
      },
      WHO,
    );
  });

  it('a mention sent to review and its item share one explanation; the history holds its id, not its text', async () => {
    const before = await stateSnapshot(t.db());
    const r = await resolveMention(ctx, { source: 'erp', externalId: 'x-1', text: 'Quillacombe Freight' }, WHO);
    expect(r.status).toBe('review');
    const mention = await t.db().selectFrom('mention').selectAll().where('id', '=', r.mentionId).executeTakeFirstOrThrow();
    const item = await t.db().selectFrom('review_item').selectAll().where('id', '=', r.reviewItemId!).executeTakeFirstOrThrow();
    expect(mention.explanation_id).not.toBeNull();
    expect(Number(item.explanation_id)).toBe(Number(mention.explanation_id));
    const stored = await t.db().selectFrom('explanation').select('body').where('id', '=', Number(mention.explanation_id)).executeTakeFirstOrThrow();
    const body = stored.body as { summary: string };
    expect(body.summary).toContain('Quillacombe');
    // The row's own evidence is only what is its own.
    expect(mention.evidence).toEqual({ recordedName: null });
    expect(item.evidence).toEqual({});

    // What a person reads, the same object in the same key order everywhere.
    expect(JSON.stringify(r.explanation)).toBe(JSON.stringify(body));
    const asRead = (await getMention(t.db(), r.mentionId))!.evidence;
    expect(asRead).toEqual({ ...body, recordedName: null });
    expect(JSON.stringify((await getReviewItem(t.db(), r.reviewItemId!))!.evidence)).toBe(JSON.stringify(body));

    const event = await t.db().selectFrom('history_event').select('payload').where('id', '=', r.eventId!).executeTakeFirstOrThrow();
    expect(JSON.stringify(event.payload)).not.toContain(body.summary);
    const ops = (event.payload as unknown as { ops: { op: string; table: string; row: Record<string, unknown> }[] }).ops;
    const images = ops.filter((op) => op.table === 'mention' || op.table === 'review_item').map((op) => op.row);
    expect(images).toHaveLength(2);
    for (const image of images) expect(image.explanation_id).toBe(Number(mention.explanation_id));

    // A replay rebuilds the same rows (the explanations are copied with the history), and undo restores them.
    const target = await openTestDatabase(t.backend);
    try {
      await replayHistory(t.db(), target.db, ctx.derived);
      expectSameState(await stateSnapshot(target.db), await stateSnapshot(t.db()));
      expect((await getMention(target.db, r.mentionId))!.evidence).toEqual(asRead);
    } finally {
      await target.close();
    }
    await undoEvent(ctx, r.eventId!, WHO);
    expectSameState(await stateSnapshot(t.db()), before);
  });

  it('the same mention again answers the same explanation', async () => {
    const first = await resolveMention(ctx, { source: 'erp', externalId: 'x-2', text: 'Tessingham Mills Limited', country: 'GB' }, WHO);
    const again = await resolveMention(ctx, { source: 'erp', externalId: 'x-2', text: 'Tessingham Mills Limited', country: 'GB' }, WHO);
    expect(again.alreadyIngested).toBe(true);
    expect(JSON.stringify(again.explanation)).toBe(JSON.stringify(first.explanation));
  });
});
