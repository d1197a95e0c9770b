/**
 * The batch path's stage timing (services/register/stage-times.ts): a caller that passes a StageTimes gets every
 * stage of resolveBatch filled, stages exclusive (a nested stage is not counted in its outer one), and the same
 * results as without it. Invented names.
 */
import { expect, it } from 'vitest';
import { describeEachBackend, openTestDatabase } from '../../support/index.ts';
import { resolveBatch } from '../../../services/register/index.ts';
import { timed, type StageTimes } from '../../../services/register/stage-times.ts';
import { WHO, contextFor } from './support.ts';

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

it('counts a nested stage once: the outer stage leaves out the inner one', async () => {
  const times: StageTimes = {};
  const started = performance.now();
  await timed(times, 'outer', async () => {
    await sleep(5);
    await timed(times, 'inner', () => sleep(30));
  });
  const wall = performance.now() - started;
  expect(times.inner).toBeGreaterThanOrEqual(29);
  expect(times.outer! + times.inner!).toBeLessThanOrEqual(wall + 0.001);
  expect(times.outer!).toBeLessThan(wall - times.inner! + 0.001);
});

it('does nothing without a StageTimes', async () => {
  expect(await timed(undefined, 'any', async () => 42)).toBe(42);
});

describeEachBackend('resolveBatch stage times', (t) => {
  it('fills every stage of the batch and answers the same results as without them', async () => {
    const inputs = [
      { source: 'erp', externalId: 's-1', text: 'Harrowgate Pumpworks Limited', country: 'GB' },
      { source: 'erp', externalId: 's-2', text: 'Harrowgate Pumpworks Ltd', country: 'GB' },
      { source: 'erp', externalId: 's-3', text: 'Meldrith Optics GmbH', country: 'DE' },
      { source: 'erp', externalId: 's-3', text: 'twice', country: 'DE' },
    ];
    const stages: StageTimes = {};
    const timedRun = await resolveBatch(contextFor(t.db()), inputs, WHO, { stages });
    expect(Object.keys(stages).sort()).toEqual(['check', 'cluster', 'decide', 'flush', 'read', 'write']);
    for (const ms of Object.values(stages)) expect(ms).toBeGreaterThanOrEqual(0);
    const other = await openTestDatabase(t.backend);
    try {
      const plain = await resolveBatch(contextFor(other.db), inputs, WHO);
      const strip = (rs: typeof plain) => rs.map((r) => JSON.stringify(r));
      expect(strip(timedRun)).toEqual(strip(plain));
    } finally {
      await other.close();
    }
  });
});
