/**
 * The batch's bulk reads answer exactly what the per-mention reads answer: candidateDetailsBatch equals
 * candidateDetails probe by probe (same per-key cap, ranking, limit and identifier holders), and a batch's memo
 * of scored candidates equals scoring each probe alone. Names are invented.
 */
import { expect, it } from 'vitest';
import { describeBackends, withTestDatabase } from '../../support/index.ts';
import { createRegisterContext, resolveMention } from '../../../services/register/index.ts';
import { candidateDetails, candidateDetailsBatch, candidateDetailsWithTokenCounts } from '../../../db/queries/blocking-keys.ts';
import { tokenCountsAndSize } from '../../../db/queries/rarity-counts.ts';
import { DF_CAP } from '../../../services/register/matching/idf.ts';
import { analyse } from '../../../services/register/matching/analysis.ts';
import { keysOfAnalysis } from '../../../services/register/matching/keys.ts';
import { BatchReads } from '../../../services/register/matching/batch-reads.ts';
import { MAX_CANDIDATES, scoredCandidates } from '../../../services/register/matching/candidates.ts';
import { DEFAULT_MATCH_MODEL } from '../../../resolvers/score/default-model.ts';
import { WHO } from './support.ts';

const REGISTER = [
  'Larchmont Pottery Ltd',
  'Larchmont Pottery Holdings Ltd',
  'Larchmont Ceramics Ltd',
  'Vossberg Kältetechnik GmbH',
  'Vossberg Kaeltetechnik AG',
  'Silverbirch Robotics Inc.',
  'Silverbirch Marine Inc.',
  'Tidewell Fisheries AS',
];
const PROBES = ['Larchmont Pottery Limited', 'Vossberg Kaltetechnik GmbH', 'Silverbirch Robotics', 'Tidewell Fisheries', 'Quillon Dynamics SA', 'Larchmont'];

describeBackends('batch reads', (backend) => {
  it('answer what the per-mention reads answer, probe by probe', async () => {
    await withTestDatabase(backend, async (opened) => {
      const ctx = createRegisterContext(opened.db);
      const ids: number[] = [];
      for (const [i, text] of REGISTER.entries()) ids.push((await resolveMention(ctx, { source: 'seed', externalId: String(i), text }, WHO)).counterpartyId!);
      // An identifier held by a counterparty no key finds, so that identifier holders are part of the comparison
      // (written directly: the lookup is what is tested, not the upkeep).
      await opened.db
        .insertInto('counterparty_identifier')
        .values({
          counterparty_id: ids[7]!,
          scheme: 'other',
          value: '150483782',
          label: null,
          strong: false,
          source: 'test',
          mention_id: null,
          confirmed_by: null,
          created_at: new Date().toISOString(),
        })
        .execute();
      const probes = PROBES.map((text, i) => ({ analysis: analyse(text), identifiers: i === 0 ? [{ scheme: 'other' as const, value: '150483782' }] : [] }));
      const batch = await candidateDetailsBatch(
        opened.db,
        probes.map((p) => ({ keys: keysOfAnalysis(p.analysis), identifiers: p.identifiers, text: p.analysis.normalised })),
        { limit: 3 },
      );
      for (const [i, probe] of probes.entries()) {
        const alone = await candidateDetails(opened.db, keysOfAnalysis(probe.analysis), probe.identifiers, { limit: 3, text: probe.analysis.normalised });
        expect({ probe: PROBES[i], details: batch[i] }).toEqual({ probe: PROBES[i], details: alone });
      }
      expect(batch.some((d) => d.length > 1)).toBe(true);
      expect(batch[0]!.some((d) => d.counterpartyId === ids[7])).toBe(true);

      const reads = new BatchReads(opened.db);
      await reads.prefetch(probes, MAX_CANDIDATES);
      for (const [i, probe] of probes.entries()) {
        const alone = await scoredCandidates(opened.db, { ...probe, country: null }, DEFAULT_MATCH_MODEL);
        const shared = await scoredCandidates(opened.db, { ...probe, country: null }, DEFAULT_MATCH_MODEL, new Set(), reads);
        expect({ probe: PROBES[i], scored: shared }).toEqual({ probe: PROBES[i], scored: alone });
      }
    });
  });

  it('read token counts with the candidates exactly as the rarity read does, for every token their names analyse to', async () => {
    await withTestDatabase(backend, async (opened) => {
      const ctx = createRegisterContext(opened.db);
      const made = new Set<number>();
      for (const [i, text] of REGISTER.entries()) made.add((await resolveMention(ctx, { source: 'seed', externalId: String(i), text }, WHO)).counterpartyId!);
      const probes = PROBES.map((text) => ({ analysis: analyse(text), identifiers: [] }));
      const probeTokens = [...new Set(probes.flatMap((p) => p.analysis.tokens))];
      const read = await candidateDetailsWithTokenCounts(
        opened.db,
        probes.map((p) => ({ keys: keysOfAnalysis(p.analysis), identifiers: [] })),
        { limit: 3 },
        { tokens: probeTokens, cap: DF_CAP },
      );
      expect(read.details).toEqual(
        await candidateDetailsBatch(
          opened.db,
          probes.map((p) => ({ keys: keysOfAnalysis(p.analysis), identifiers: [] })),
          { limit: 3 },
        ),
      );
      const counts = read.counts!;
      const alone = await tokenCountsAndSize(opened.db, [...counts.counts.keys()], DF_CAP);
      expect(counts).toEqual(alone);
      // The register's size is its highest counterparty id (matching/idf.ts): here the counterparties made.
      expect(counts.size).toBe(Math.max(...made));
      // Every token the scoring will ask for is there: the probes' and those of each candidate's names.
      const wanted = new Set(probeTokens);
      for (const list of read.details) for (const cp of list) for (const n of cp.names) for (const t of analyse(n.name, cp.jurisdiction).tokens) wanted.add(t);
      expect([...wanted].filter((t) => !counts.counts.has(t))).toEqual([]);
      expect(wanted.has('kaltetechnik') || wanted.has('kaeltetechnik')).toBe(true);
    });
  });
});
