/**
 * The register's token rarity takes N from the names it holds (db/queries/name-count.ts), as `cpreg evaluate` and
 * the model's training take it from the rows of their file, so an equal core weighs the same in both. Invented names.
 */
import { beforeAll, expect, it } from 'vitest';
import { describeEachBackend } from '../../support/index.ts';
import { resolveMention, type RegisterContext } from '../../../services/register/index.ts';
import { registerNameCount } from '../../../db/queries/name-count.ts';
import { idfFor } from '../../../services/register/matching/idf.ts';
import { BatchReads } from '../../../services/register/matching/batch-reads.ts';
import { smoothedIdf } from '../../../resolvers/compare/index.ts';
import { WHO, contextFor } from './helpers.ts';

const FIRMS = ['Ravelstoke Pumps Ltd', 'Dunquarry Textiles GmbH', 'Mirrowfen Optics B.V.', 'Calthwaite Seeds Pty Ltd'];

describeEachBackend('the register name count', (t) => {
  let ctx: RegisterContext;
  beforeAll(async () => {
    ctx = contextFor(t.db());
    for (const [i, firm] of FIRMS.entries()) await resolveMention(ctx, { source: 'count-test', externalId: `m-${i}`, text: firm }, WHO);
  });

  it('counts every name recorded (at least the rows held)', async () => {
    const rows = await ctx.db.selectFrom('counterparty_name').select((e) => e.fn.countAll<string>().as('n')).executeTakeFirstOrThrow();
    const n = await registerNameCount(ctx.db);
    expect(n).toBeGreaterThanOrEqual(Number(rows.n));
    expect(Number(rows.n)).toBeGreaterThanOrEqual(FIRMS.length);
  });

  it('is the N of the token rarity, alone and through a batch\'s reads', async () => {
    const n = await registerNameCount(ctx.db);
    const alone = await idfFor(ctx.db, ['ravelstoke', 'zzunseen']);
    const batched = await idfFor(ctx.db, ['ravelstoke', 'zzunseen'], new BatchReads(ctx.db));
    for (const idf of [alone, batched]) {
      expect(idf.documentCount).toBe(n);
      // Smoothed IDF (scikit-learn's smooth_idf form, from memory): an unseen token weighs ln((1+N)/1)+1.
      expect(idf.idf('zzunseen')).toBeCloseTo(smoothedIdf(n, 0), 9);
      expect(idf.idf('ravelstoke')).toBeCloseTo(smoothedIdf(n, 1), 9);
    }
  });
});
