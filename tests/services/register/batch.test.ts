/**
 * Batch resolution clusters the batch together with the register: the outcome (statuses, which mentions share a
 * counterparty, even the new ids) does not depend on the order of the input. Names are invented.
 */
import { expect, it } from 'vitest';
import { describeBackends, withTestDatabase } from '../../support/index.ts';
import { createRegisterContext, resolveBatch, resolveMention } from '../../../services/register/index.ts';
import type { MentionInput } from '../../../resolvers/vocabulary.ts';
import { seededRandom } from '../../../resolvers/prng.ts';
import { WHO } from './support.ts';

const REGISTER = ['Larchmont Pottery Ltd', 'Vossberg Kältetechnik GmbH'];
/** Countries of the batch items, in order (the model weighs an agreeing jurisdiction). */
const COUNTRY = ['GB', 'GB', 'US', 'US', 'US', 'DE', 'NO', 'GB'];
const BATCH: MentionInput[] = [
  'Larchmont Pottery Limited',
  'LARCHMONT POTTERY LTD',
  'Silverbirch Robotics Inc.',
  'Silverbirch Robotics Incorporated',
  'Silverbirch Robotics',
  'Vossberg Kaeltetechnik GmbH',
  'Tidewell Fisheries AS',
  'we',
].map((text, i) => ({ source: 'batch', externalId: `b${i}`, text, country: COUNTRY[i]! }));

async function run(backend: 'pglite' | 'postgres', inputs: MentionInput[]) {
  return withTestDatabase(backend, async (opened) => {
    const ctx = createRegisterContext(opened.db);
    for (const [i, text] of REGISTER.entries()) await resolveMention(ctx, { source: 'seed', externalId: String(i), text, country: i === 0 ? 'GB' : 'DE' }, WHO);
    const results = await resolveBatch(ctx, inputs, WHO);
    expect(results).toHaveLength(inputs.length);
    return new Map(
      results.map((r, i) => [
        inputs[i]!.externalId,
        'mentionId' in r ? { status: r.status, counterpartyId: r.counterpartyId } : { status: r.status, counterpartyId: null },
      ]),
    );
  });
}

describeBackends('batch resolution', (backend) => {
  it('gives the same outcome for any order of the input', async () => {
    const forward = await run(backend, BATCH);
    const shuffled = [...BATCH];
    const rng = seededRandom(7);
    for (let i = shuffled.length - 1; i > 0; i--) {
      const j = rng.int(i + 1);
      [shuffled[i], shuffled[j]] = [shuffled[j]!, shuffled[i]!];
    }
    const backward = await run(backend, [...BATCH].reverse());
    const mixed = await run(backend, shuffled);
    expect(backward).toEqual(forward);
    expect(mixed).toEqual(forward);
    // And the outcome is the intended one: variants cluster, the register's records are found.
    const cp = (id: string) => forward.get(id)!.counterpartyId;
    expect(cp('b0')).toBe(cp('b1'));
    expect(cp('b2')).toBe(cp('b3'));
    expect(forward.get('b7')!.status).toBe('unbound_term');
    expect(cp('b0')).not.toBe(cp('b2'));
    expect(new Set([forward.get('b2')!.status, forward.get('b3')!.status])).toEqual(new Set(['new', 'linked']));
  });
});
