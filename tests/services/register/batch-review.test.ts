/**
 * Review inside a batch (services/register/batch-review.ts): two names of one batch that a person should judge
 * against each other ("Kestrelvane Tooling GmbH" / "Kestrelvane Tooling AG": one company converted, or two) end as
 * they would sent one at a time: the first a new counterparty, the second in review against it, whatever the
 * input order and whether or not the two fall in one write chunk. Names are invented.
 */
import { expect, it } from 'vitest';
import { describeEachBackend } from '../../support/index.ts';
import { resolveBatch, resolveMention } from '../../../services/register/index.ts';
import { WRITE_CHUNK } from '../../../services/register/batch.ts';
import type { MentionInput } from '../../../resolvers/vocabulary.ts';
import { WHO, contextFor } from './support.ts';

const SYLLABLES = ['bra', 'cel', 'dov', 'fen', 'gar', 'hul', 'jor', 'kem', 'lis', 'mur', 'nab', 'pol'];
/** Filler names that share no word with the pair or each other but their activity and form. */
const filler = (i: number) => `${SYLLABLES[i % 12]}${SYLLABLES[Math.floor(i / 12) % 12]}wick Freight Ltd`;

describeEachBackend('review inside a batch', (t) => {
  it('the later of two close names asks a person about the counterparty the earlier one created', async () => {
    const ctx = contextFor(t.db());
    // One at a time, for reference: the second goes to review.
    await resolveMention(ctx, { source: 'one', externalId: 'a', text: 'Kestrelvane Tooling GmbH', country: 'DE' }, WHO);
    const single = await resolveMention(ctx, { source: 'one', externalId: 'b', text: 'Kestrelvane Tooling AG', country: 'DE' }, WHO);
    expect(single.status).toBe('review');

    for (const [order, stem] of ['Ostrevane Fittings', 'Quellmora Fittings'].entries()) {
      const source = `batch${order}`;
      const pair: MentionInput[] = [
        { source, externalId: 'a', text: `${stem} GmbH`, country: 'DE' },
        { source, externalId: 'b', text: `${stem} AG`, country: 'DE' },
      ];
      // The second stem comes in the reverse order: the outcome follows the mentions' ids, not the input order.
      const inputs = order === 0 ? pair : [...pair].reverse();
      const results = await resolveBatch(ctx, inputs, WHO);
      const byId = new Map(results.map((r, i) => [inputs[i]!.externalId, r]));
      const first = byId.get('a')!;
      const second = byId.get('b')!;
      expect([first.status, second.status]).toEqual(['new', 'review']);
      if (!('mentionId' in first) || !('mentionId' in second)) throw new Error('both mentions are stored');
      const item = await t.db().selectFrom('review_item').selectAll().where('mention_id', '=', second.mentionId).executeTakeFirstOrThrow();
      expect(Number(item.right_counterparty_id)).toBe(first.counterpartyId);
      const mention = await t.db().selectFrom('mention').select(['counterparty_id', 'status']).where('id', '=', second.mentionId).executeTakeFirstOrThrow();
      expect(mention).toEqual({ counterparty_id: null, status: 'review' });
      // One counterparty, not two: the question reaches a person instead of a duplicate record.
      const counterparties = await t.db().selectFrom('counterparty').select('id').where('canonical_name', 'like', `${stem}%`).execute();
      expect(counterparties).toHaveLength(1);
    }
  });

  it('asks across write chunks, and the explanation names the batch mention it is close to', async () => {
    const ctx = contextFor(t.db());
    const inputs: MentionInput[] = [
      { source: 'chunks', externalId: 'a-first', text: 'Tremavon Castings GmbH', country: 'DE' },
      ...Array.from({ length: WRITE_CHUNK + 20 }, (_, i) => ({
        source: 'chunks',
        externalId: `m-${String(i).padStart(3, '0')}`,
        text: filler(i),
        country: 'GB',
      })),
      { source: 'chunks', externalId: 'z-last', text: 'Tremavon Castings AG', country: 'DE' },
    ];
    const results = await resolveBatch(ctx, inputs, WHO);
    const first = results[0]!;
    const last = results[results.length - 1]!;
    expect([first.status, last.status]).toEqual(['new', 'review']);
    if (!('mentionId' in first) || !('mentionId' in last)) throw new Error('both mentions are stored');
    const item = await t.db().selectFrom('review_item').selectAll().where('mention_id', '=', last.mentionId).executeTakeFirstOrThrow();
    expect(Number(item.right_counterparty_id)).toBe(first.counterpartyId);
    const explanation = last.explanation as { summary: string; matchedName: string };
    expect(explanation.matchedName).toBe('Tremavon Castings GmbH');
    expect(explanation.summary).toMatch(
      /^close to "Tremavon Castings GmbH", a mention of this batch \(scored [-\d.]+\): one company or two, a person decides$/,
    );
  });
});
