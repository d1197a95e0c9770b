/**
 * A person's decision is never reset without a person (services/register/resolve/earlier-decision.ts): a mention a
 * reviewer confirmed that comes back with another text goes to review as a question about the counterparty the
 * reviewer chose, naming that decision; the same text again changes nothing. Through the single and the batch
 * path. Invented names.
 */
import { beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/index.ts';
import { decideReview, resolveBatch, resolveMention, storeContract, type RegisterContext } from '../../../services/register/index.ts';
import { WHO, contextFor } from './support.ts';
import { getReviewItem, listReviewItemsWhere } from '../../../db/queries/review.ts';

const REVIEWER = { actor: 'test:reviewer' };

describeEachBackend("a person's decision against a changed text", (t) => {
  let ctx: RegisterContext;
  let supplier: number;

  async function confirmed(externalId: string): Promise<void> {
    const r = await resolveMention(ctx, { source: 'erp', externalId, text: 'Quillacombe Freight' }, WHO);
    expect(r.status).toBe('review');
    await decideReview(ctx, r.reviewItemId!, { decision: 'same', reason: 'same haulier' }, REVIEWER);
  }

  async function mention(externalId: string) {
    return t.db().selectFrom('mention').selectAll().where('source', '=', 'erp').where('external_id', '=', externalId).executeTakeFirstOrThrow();
  }

  beforeAll(async () => {
    ctx = contextFor(t.db());
    const stored = await storeContract(
      ctx,
      {
        source: 'clm',
        externalId: 'E-1',
        text: 'This Haulage Agreement is made between Quillacombe Freight Limited, a company incorporated in England (the "Carrier"), and Tessingham Mills Ltd (the "Customer").',
      },
      WHO,
    );
    supplier = stored.parties.find((p) => p.canonicalName?.startsWith('Quillacombe') ?? false)!.counterpartyId!;
  });

  it('the same text again leaves the confirmed link alone', async () => {
    await confirmed('q-1');
    const again = await resolveMention(ctx, { source: 'erp', externalId: 'q-1', text: 'Quillacombe Freight' }, WHO);
    expect(again.alreadyIngested).toBe(true);
    const m = await mention('q-1');
    expect([m.status, Number(m.counterparty_id), m.confirmed_by]).toEqual(['linked', supplier, REVIEWER.actor]);
  });

  it('a changed text goes to review about the counterparty the person chose, naming the decision (single path)', async () => {
    await confirmed('q-2');
    // A text that would link on its own (same name, legal form and country): still a person's question.
    const changed = await resolveMention(ctx, { source: 'erp', externalId: 'q-2', text: 'Quillacombe Freight Limited', country: 'GB' }, WHO);
    expect(changed.status).toBe('review');
    // Read as the review queue shows it (the item's explanation is stored once and referenced).
    const item = (await getReviewItem(t.db(), changed.reviewItemId!))!;
    expect(item.rightCounterpartyId).toBe(supplier);
    const evidence = item.evidence as { earlierDecision: { confirmedBy: string; text: string; counterpartyId: number }; heldBackBy: string; summary: string };
    expect(evidence.earlierDecision).toMatchObject({ confirmedBy: REVIEWER.actor, text: 'Quillacombe Freight', counterpartyId: supplier });
    expect(evidence.heldBackBy).toBe('earlier_decision');
    expect(evidence.summary).toContain(REVIEWER.actor);
  });

  it('the same holds for a batch (the ingest path)', async () => {
    await confirmed('q-3');
    const [result] = await resolveBatch(ctx, [{ source: 'erp', externalId: 'q-3', text: 'Quillacombe Freight Limited', country: 'GB' }], WHO);
    expect(result!.status).toBe('review');
    const [item] = await listReviewItemsWhere(t.db(), { mentionId: Number((await mention('q-3')).id), status: 'open' });
    expect(item!.rightCounterpartyId).toBe(supplier);
    expect((item!.evidence as { earlierDecision?: unknown }).earlierDecision).toBeDefined();
  });

  it('a mention no person confirmed is resolved afresh as before', async () => {
    const first = await resolveMention(ctx, { source: 'erp', externalId: 'q-4', text: 'Tessingham Mills Ltd', country: 'GB' }, WHO);
    expect(first.status).toBe('linked');
    const changed = await resolveMention(ctx, { source: 'erp', externalId: 'q-4', text: 'Tessingham Mills Limited', country: 'GB' }, WHO);
    expect(changed.status).toBe('linked');
    expect(changed.counterpartyId).toBe(first.counterpartyId);
  });
});
