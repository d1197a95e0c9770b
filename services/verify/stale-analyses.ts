/**
 * Names whose stored analysis or blocking keys are stale (db/queries/name-analysis.ts: no stored analysis, one of
 * an older ANALYSIS_VERSION, or one made under another country than the counterparty's jurisdiction now). A finding
 * of its own, with the command that fixes it, rather than replay differences: replaying the history analyses every
 * name with the current version, so the keys of a stale name differ from the replay's, and verify leaves those keys
 * out of the replay comparison (services/verify/replay-check.ts) and reports the names here instead.
 *
 * The stored analyses themselves are not compared with the replay's: they are a function of the name, the country
 * and the version (the country a row records may be an older jurisdiction than the replay's order of writes gave),
 * so what matters is checked here directly: every row current, or the name listed as stale.
 */
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { ANALYSIS_VERSION } from '../../resolvers/analyse/index.ts';
import { allNameIds, hasNameAnalysisTable, staleNameIds, staleNames } from '../../db/queries/name-analysis.ts';
import type { Violation } from './invariants.ts';

export const STALE_CHECK = 'name_analysis_stale';

/** The command that rewrites stale analyses and keys (services/cli/commands/migrate.ts). */
export const REANALYSE_COMMAND = 'cpreg migrate reanalyse';

export async function staleAnalysisFinding(db: Kysely<Database>, listLimit: number): Promise<{ count: number; violations: Violation[] }> {
  // verify reads the schema as it is: one not yet migrated to stored analyses has every name stale.
  if (!(await hasNameAnalysisTable(db))) {
    const count = (await allNameIds(db)).size;
    const message = `the schema has no stored name analyses yet: run \`cpreg migrate\`, then \`${REANALYSE_COMMAND}\``;
    return { count, violations: count === 0 ? [] : [{ check: STALE_CHECK, message, ids: { names: count } }] };
  }
  const { count, first } = await staleNames(db, ANALYSIS_VERSION, listLimit);
  const violations = first.map((n) => ({
    check: STALE_CHECK,
    message: `name ${n.id} ${JSON.stringify(n.name)} of counterparty ${n.counterpartyId}: its stored analysis and blocking keys are not those of analysis version ${ANALYSIS_VERSION} under its jurisdiction; run \`${REANALYSE_COMMAND}\``,
    ids: { nameId: n.id, counterpartyId: n.counterpartyId },
  }));
  return { count, violations };
}

export async function staleNameIdsOf(db: Kysely<Database>): Promise<Set<number>> {
  return (await hasNameAnalysisTable(db)) ? staleNameIds(db, ANALYSIS_VERSION) : allNameIds(db);
}
