/**
 * Common blocking keys in the candidate lookup (db/queries/blocking-keys.ts): a key held by more counterparties
 * than the per-key limit is looked up for a probe only when none of the probe's other keys has a holder. Names are
 * invented: 260 "<word> Holdings Ltd" counterparties make "holdings" a common key (over the limit of 200).
 */
import { expect, it } from 'vitest';
import { describeBackends, withTestDatabase } from '../../support/index.ts';
import { candidateDetails } from '../../../db/queries/blocking-keys.ts';
import { createRegisterContext } from '../../../services/register/context.ts';
import { loadCounterparties } from '../../../services/register/bulk-load.ts';
import { analyse } from '../../../services/register/matching/analysis.ts';
import { keysOfAnalysis } from '../../../services/register/matching/keys.ts';

const SYLLABLES = ['bra', 'cel', 'dov', 'fen', 'gar', 'hul', 'jor', 'kem', 'lis', 'mur', 'nab', 'pol', 'quen', 'rid', 'sov', 'tam'];

/** An invented word per index: three syllables, distinct for every index below 16³. */
function word(i: number): string {
  const w = SYLLABLES[i % 16]! + SYLLABLES[Math.floor(i / 16) % 16]! + SYLLABLES[Math.floor(i / 256) % 16]!;
  return w[0]!.toUpperCase() + w.slice(1);
}

const candidatesOf = async (db: Parameters<typeof candidateDetails>[0], name: string) =>
  (await candidateDetails(db, keysOfAnalysis(analyse(name, 'GB')), [], { limit: 20, country: 'GB' })).map((d) => d.canonicalName);

describeBackends('candidate lookup: common keys', (backend) => {
  it('leave a common key out when another key finds holders, and look it up when none does', async () => {
    await withTestDatabase(backend, async (opened) => {
      const rows = Array.from({ length: 260 }, (_, i) => ({ name: `${word(i)} Holdings Ltd`, country: 'GB' }));
      rows.push({ name: 'Zyxwarden Holdings Ltd', country: 'GB' });
      await loadCounterparties(createRegisterContext(opened.db), rows, { actor: 'test' }, { source: 'test' });

      // "Zyxwarden" is held once: only its holder comes back. Looked up too, "holdings" would add up to 19 of the
      // 200 lowest ids among its 261 holders, which say nothing about this probe (the list below would be 20 long).
      expect(await candidatesOf(opened.db, 'Zyxwarden Holdings Limited')).toEqual(['Zyxwarden Holdings Ltd']);

      // "Wopvantel" is held by no one, nor is any other selective key of this probe: the common keys are looked up,
      // so a new name with a common word still meets the names that share it.
      const fallback = await candidatesOf(opened.db, 'Wopvantel Holdings Ltd');
      expect(fallback.length).toBe(20);
      expect(fallback.every((name) => name.endsWith('Holdings Ltd'))).toBe(true);
    });
  }, 120_000);
});
