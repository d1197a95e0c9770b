/**
 * `adjustWeights`: reviewers' decisions kept as labelled pairs adjust the weights in force within bounds, stored as
 * a new settings version; a dry run stores nothing. Invented names; the bounded method itself is unit-tested in
 * tests/resolvers/score/adjust-from-decisions.test.ts.
 */
import { beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/index.ts';
import { decideReview, resolveMention, storeContract, type RegisterContext } from '../../../services/register/index.ts';
import { featureWeights } from '../../../resolvers/score/index.ts';
import { adjustWeights, vectorOfEvidence } from '../../../services/register/matching/adjust-weights.ts';
import { currentModel } from '../../../services/register/matching/model.ts';
import { WHO, contextFor } from './support.ts';

const FIRMS = ['Ravelstoke Pumps', 'Dunquarry Textiles', 'Mirrowfen Optics', 'Calthwaite Seeds', 'Brisdown Ceramics', 'Hollinvar Paints'];

describeEachBackend('adjusting weights from decisions', (t) => {
  let ctx: RegisterContext;
  beforeAll(async () => {
    ctx = contextFor(t.db());
    for (const [i, firm] of FIRMS.entries()) {
      await storeContract(
        ctx,
        {
          source: 'clm',
          externalId: `A-${i}`,
          text: `This Agreement is made between ${firm} Limited, a company incorporated in England (the "Supplier"), and Tarnwick Retail Ltd (the "Buyer").`,
        },
        WHO,
      );
      const r = await resolveMention(ctx, { source: 'adjust-test', externalId: `m-${i}`, text: firm }, WHO);
      expect(r.status, firm).toBe('review');
      await decideReview(ctx, r.reviewItemId!, { decision: 'different', reason: 'another firm of that name' }, WHO);
    }
  });

  it("reads each decision's levels back from its explanation", async () => {
    const { model } = await currentModel(ctx.db);
    const vector = vectorOfEvidence(model, {
      features: [
        { feature: 'name', level: 'exact' },
        { feature: 'jurisdiction', level: null },
      ],
    });
    expect(vector![0]).toBe(model.features.name!.levels.indexOf('exact'));
    expect(vector!.slice(1).every((v) => v === null)).toBe(true);
    expect(vectorOfEvidence(model, { features: [{ feature: 'name', level: 'no such level' }] })).toBeNull();
  });

  it('a dry run shows the shifts and stores nothing; the run stores a version whose weights carry them', async () => {
    const before = await currentModel(ctx.db);
    const dry = await adjustWeights(ctx, WHO, { dryRun: true });
    expect(dry.used).toBe(FIRMS.length);
    expect(dry.version).toBeNull();
    expect((await currentModel(ctx.db)).version).toBe(before.version);
    const exact = dry.shifts.find((s) => s.feature === 'name' && s.level === 'exact');
    expect(exact).toMatchObject({ decisions: FIRMS.length, same: 0 });
    expect(exact!.shift).toBeLessThan(0);
    expect(exact!.shift).toBeGreaterThanOrEqual(-2);

    const stored = await adjustWeights(ctx, WHO);
    expect(stored.version).not.toBeNull();
    const after = await currentModel(ctx.db);
    expect(after.version).toBe(stored.version);
    expect([after.model.linkAt, after.model.newAt]).toEqual([before.model.linkAt, before.model.newAt]);
    const k = after.model.features.name!.levels.indexOf('exact');
    expect(featureWeights(after.model.features.name!)[k]).toBeCloseTo(featureWeights(before.model.features.name!)[k]! + exact!.shift, 6);
    // The same decisions again move nothing further.
    expect((await adjustWeights(ctx, WHO)).version).toBeNull();
  });
});
