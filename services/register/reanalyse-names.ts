/**
 * Re-analysis upkeep (`cpreg migrate reanalyse`): rewrites the stored analysis and the blocking keys of every stale
 * name, one set-based chunk per transaction. A name is stale when it has no stored analysis (a register from before
 * migrations/20261205180000_counterparty_name_analysis.ts), one of an older ANALYSIS_VERSION (its keys are then
 * those of the older analysis too), or one made under another country than its counterparty's jurisdiction.
 *
 * Both tables are derived, not history: nothing here is an event, and replaying the history gives the same rows
 * (replay analyses every name with the current version). Each chunk locks its names (FOR UPDATE), so a writer
 * changing one of them waits for the chunk, and a chunk that collides with a writer (a deadlock on the key counts)
 * is run again by write(). Running it twice does nothing the second time; stopping it half way leaves every chunk
 * done complete and the rest stale (still correct: stale analyses are re-analysed where they are read).
 */
import { ANALYSIS_VERSION } from '../../resolvers/analyse/index.ts';
import { lockStaleNames, replaceKeysOfNames, upsertNameAnalyses } from '../../db/queries/name-analysis.ts';
import type { RegisterContext } from './context.ts';
import { write } from './transaction.ts';

/** Names per transaction: one read, two key statements and one analysis statement each. */
export const REANALYSE_CHUNK = 1000;

export interface ReanalyseResult {
  /** Names whose analysis and keys were rewritten. */
  names: number;
  /** Transactions committed. */
  chunks: number;
  version: number;
}

export async function reanalyseNames(ctx: RegisterContext, options: { chunk?: number; progress?: (names: number) => void } = {}): Promise<ReanalyseResult> {
  const chunk = options.chunk ?? REANALYSE_CHUNK;
  if (!Number.isInteger(chunk) || chunk < 1) throw new RangeError(`chunk ${chunk}: expected a whole number of names, at least 1`);
  let after = 0;
  let names = 0;
  let chunks = 0;
  for (;;) {
    const done = await write(ctx, async (cs) => {
      const stale = await lockStaleNames(cs.trx, ANALYSIS_VERSION, after, chunk);
      if (stale.length === 0) return null;
      const rewritten = stale.map((n) => ({ n, stored: ctx.derived.nameAnalysis(n.name, n.jurisdiction), keys: ctx.derived.nameKeys(n) }));
      await replaceKeysOfNames(
        cs.trx,
        rewritten.map(({ n, keys }) => ({ nameId: n.id, counterpartyId: n.counterpartyId, keys })),
      );
      await upsertNameAnalyses(
        cs.trx,
        rewritten.map(({ n, stored }) => ({ name_id: n.id, analysis: stored.analysis, analysis_version: stored.version, country: stored.country })),
      );
      return { last: stale[stale.length - 1]!.id, count: stale.length };
    });
    if (!done) break;
    after = done.last;
    names += done.count;
    chunks++;
    options.progress?.(names);
  }
  return { names, chunks, version: ANALYSIS_VERSION };
}
