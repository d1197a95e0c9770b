/**
 * The summary of a decision says which rule decided (services/register/resolve/summaries.ts): a new counterparty
 * kept apart by a distinguishing word names the word, and a pair reviewed below newAt because the names agree
 * closely does not claim to lie between the thresholds. Invented names.
 */
import { beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/index.ts';
import { resolveMention, type RegisterContext } from '../../../services/register/index.ts';
import { currentModel } from '../../../services/register/matching/model.ts';
import { WHO, contextFor } from './support.ts';

describeEachBackend('decision summaries', (t) => {
  let ctx: RegisterContext;

  beforeAll(async () => {
    ctx = contextFor(t.db());
    await resolveMention(ctx, { source: 'erp', externalId: 's-1', text: 'Merrow Finance S.r.l.', country: 'IT' }, WHO);
    await resolveMention(ctx, { source: 'erp', externalId: 's-2', text: 'Kestrelvane Tooling GmbH', country: 'DE' }, WHO);
  });

  it('a series number that keeps two names apart is named in the summary and the explanation', async () => {
    const r = await resolveMention(ctx, { source: 'erp', externalId: 's-3', text: 'Merrow Finance II S.r.l.', country: 'IT' }, WHO);
    expect(r.status).toBe('new');
    const explanation = r.explanation as { summary: string; heldBackBy?: string; distinguishingTokens?: string[] };
    expect(explanation.summary).toMatch(
      /^best candidate Merrow Finance S\.r\.l\. scored [-\d.]+, held back: a distinguishing word differs \(number\) \(ii\): a new counterparty$/,
    );
    expect(explanation.heldBackBy).toBe('a distinguishing word differs (number)');
    expect(explanation.distinguishingTokens).toEqual(['ii']);
  });

  it('close names reviewed below the new-record threshold say so, not that they lie between the thresholds', async () => {
    const { model } = await currentModel(t.db());
    const r = await resolveMention(ctx, { source: 'erp', externalId: 's-4', text: 'Kestrelvane Tooling AG', country: 'DE' }, WHO);
    expect(r.status).toBe('review');
    const explanation = r.explanation as { summary: string };
    // The pair's score sits at or below newAt here (another legal form in one country weighs against it).
    const score = Number(/scored ([-\d.]+)/.exec(explanation.summary)?.[1]);
    expect(score).toBeLessThanOrEqual(model.newAt);
    expect(explanation.summary).toMatch(
      /at or below the new-record threshold \([-\d.]+\), but the names agree closely \(\w+\): one company or two, a person decides$/,
    );
    expect(explanation.summary).not.toContain('between');
  });
});
