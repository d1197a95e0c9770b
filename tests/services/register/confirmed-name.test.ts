/**
 * The confirmed-name rule (services/register/resolve/confirmed-name.ts): a name a person linked to a counterparty
 * settles the next mention written the same way, and nothing else. Invented names. An equal name with nothing else
 * known scores just below linkAt in the built-in model (docs/matching.md), so without a decision it goes to review.
 */
import { expect, it } from 'vitest';
import { describeEachBackend } from '../../support/index.ts';
import { decideReview, resolveMention, setJurisdiction, type RegisterContext } from '../../../services/register/index.ts';
import { WHO, contextFor } from './support.ts';

async function askedThenConfirmed(ctx: RegisterContext, name: string, tag: string): Promise<number> {
  const first = await resolveMention(ctx, { source: 'cn', externalId: `${tag}-1`, text: name }, WHO);
  expect(first.status).toBe('new');
  const asked = await resolveMention(ctx, { source: 'cn', externalId: `${tag}-2`, text: name }, WHO);
  expect(asked, 'an equal name alone is a question before any decision').toMatchObject({ status: 'review', counterpartyId: null });
  await decideReview(ctx, asked.reviewItemId!, { decision: 'same', reason: 'the same consultant' }, WHO);
  return first.counterpartyId!;
}

describeEachBackend('a name a person confirmed', (t) => {
  it('links the next mention written the same way, and says which decision did it', async () => {
    const ctx = contextFor(t.db());
    const id = await askedThenConfirmed(ctx, 'Tamsin Hollowell', 'a');
    const next = await resolveMention(ctx, { source: 'cn', externalId: 'a-3', text: 'TAMSIN HOLLOWELL' }, WHO);
    expect(next).toMatchObject({ status: 'linked', counterpartyId: id });
    expect(String(next.explanation.summary)).toContain('a person linked to');
    expect(next.explanation.confirmedName).toMatchObject({ text: 'Tamsin Hollowell', confirmedBy: WHO.actor });
  });

  it('does not reach another spelling, a conflicting country, or a name two counterparties bear', async () => {
    const ctx = contextFor(t.db());
    const id = await askedThenConfirmed(ctx, 'Oswin Carrowmere', 'b');
    // A country against the counterparty's: the pair is not the confirmed one.
    await setJurisdiction(ctx, id, { jurisdiction: 'GB' }, WHO);
    const abroad = await resolveMention(ctx, { source: 'cn', externalId: 'b-4', text: 'Oswin Carrowmere', country: 'AU' }, WHO);
    expect(abroad.status).not.toBe('linked');
    expect(abroad.explanation.confirmedName).toBeUndefined();
    if (abroad.status === 'review') await decideReview(ctx, abroad.reviewItemId!, { decision: 'different', reason: 'a namesake in Australia' }, WHO);
    // Now two counterparties bear the name: a mention with nothing else known is a question again.
    const ambiguous = await resolveMention(ctx, { source: 'cn', externalId: 'b-5', text: 'Oswin Carrowmere' }, WHO);
    expect(ambiguous.status, String(ambiguous.explanation.summary)).toBe('review');
    expect(ambiguous.explanation.confirmedName).toBeUndefined();
    // One letter off: the decision was about the name as written (the typo is scored as any other name).
    const typo = await resolveMention(ctx, { source: 'cn', externalId: 'b-3', text: 'Oswin Carowmere' }, WHO);
    expect(typo.explanation.confirmedName).toBeUndefined();
  });
});
