/**
 * `verify`: checks every invariant of the register and, unless told not to, that replaying the history
 * from empty gives the current register. Read-only. On PostgreSQL the checks run in one REPEATABLE READ,
 * READ ONLY transaction, so a service writing meanwhile cannot make a sound register look broken.
 */
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { INVARIANT_CHECKS, type Violation } from './invariants.ts';
import { checkReplay } from './replay-check.ts';
import { REANALYSE_COMMAND, STALE_CHECK, staleAnalysisFinding, staleNameIdsOf } from './stale-analyses.ts';
import { countRows } from '../../db/queries/invariant-reads.ts';
import { countOf } from '../cli/count-words.ts';

export interface VerifyOptions {
  /** Replay the history into a scratch database and compare (default true). */
  replay?: boolean;
  /** Violations listed per check; the count is always complete (default 100). */
  listLimit?: number;
}

export interface CheckReport {
  check: string;
  ok: boolean;
  violationCount: number;
  violations: Violation[];
}

export interface VerifyReport {
  ok: boolean;
  checks: CheckReport[];
  counts: { counterparties: number; mentions: number; historyEvents: number; replayedEvents: number | null };
}

export async function verifyRegister(db: Kysely<Database>, options: VerifyOptions = {}): Promise<VerifyReport> {
  return db
    .transaction()
    .setIsolationLevel('repeatable read')
    .setAccessMode('read only')
    .execute((trx) => verifyIn(trx, options));
}

async function verifyIn(db: Kysely<Database>, options: VerifyOptions): Promise<VerifyReport> {
  const limit = options.listLimit ?? 100;
  const checks: CheckReport[] = [];
  const report = (check: string, violations: Violation[]) =>
    checks.push({ check, ok: violations.length === 0, violationCount: violations.length, violations: violations.slice(0, limit) });
  for (const [name, run] of Object.entries(INVARIANT_CHECKS)) report(name, await run(db));
  const stale = await staleAnalysisFinding(db, limit);
  checks.push({ check: STALE_CHECK, ok: stale.count === 0, violationCount: stale.count, violations: stale.violations });
  let replayedEvents: number | null = null;
  if (options.replay !== false) {
    const replay = await checkReplay(db, stale.count === 0 ? new Set() : await staleNameIdsOf(db));
    replayedEvents = replay.events;
    report('replay_differs', replay.violations);
  }
  const count = (table: 'counterparty' | 'mention' | 'history_event'): Promise<number> => countRows(db, table);
  return {
    ok: checks.every((c) => c.ok),
    checks,
    counts: { counterparties: await count('counterparty'), mentions: await count('mention'), historyEvents: await count('history_event'), replayedEvents },
  };
}

/** What each check holds when it passes, as the terminal report says it (the JSON keeps the check's id). */
export const CHECK_HOLDS: Record<string, string> = {
  mention_not_on_active_counterparty: 'every linked or new mention points to an active counterparty',
  merged_counterparty_owns_rows: 'a merged counterparty owns no names, identifiers or mentions',
  redirect_chain_broken: 'every merged id leads to an active counterparty',
  strong_identifier_shared: 'each strong identifier belongs to one active counterparty',
  review_decision_not_reflected: 'every decided review item has its recorded decision, history and effect',
  ingest_counts_do_not_reconcile: 'every finished ingest run accounts for each row it read',
  canonical_name_rule: 'every canonical name no person set is the one the canonical-value rules choose',
  [STALE_CHECK]: `every name's stored analysis and blocking keys are of the current analysis version (else: ${REANALYSE_COMMAND})`,
  replay_differs: 'replaying the history from empty gives the register as it is',
};

/** The report as lines for a terminal: each check named by what holds, its id in --json. */
export function formatVerifyReport(report: VerifyReport): string {
  const lines: string[] = [];
  const c = report.counts;
  lines.push(
    `checked ${countOf(c.counterparties, 'counterparty')}, ${countOf(c.mentions, 'mention')}, ${countOf(c.historyEvents, 'history event')}` +
      (c.replayedEvents === null ? ' (replay skipped)' : ` (replayed ${c.replayedEvents.toLocaleString('en-US')})`),
  );
  for (const check of report.checks) {
    const holds = CHECK_HOLDS[check.check] ?? check.check.replaceAll('_', ' ');
    lines.push(check.ok ? `ok:   ${holds}` : `FAIL: ${holds}: not so for ${countOf(check.violationCount, 'case')} (${check.check})`);
    for (const v of check.violations) lines.push(`       ${v.message}`);
    if (check.violationCount > check.violations.length)
      lines.push(`       … and ${(check.violationCount - check.violations.length).toLocaleString('en-US')} more (use --json --limit)`);
  }
  lines.push(report.ok ? 'register verified: no violations' : 'register NOT verified: see the violations above');
  return lines.join('\n');
}
