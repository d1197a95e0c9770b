/**
 * `verify`: checks every invariant of the register and, unless told not to, that replaying the history
 * from empty gives the current register. Read-only. On PostgreSQL the checks run in one REPEATABLE READ,
 * READ ONLY transaction, so a service writing meanwhile cannot make a sound register look broken.
 */
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { INVARIANT_CHECKS, type Violation } from './invariants.ts';
import { checkReplay } from './replay-check.ts';

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
  let replayedEvents: number | null = null;
  if (options.replay !== false) {
    const replay = await checkReplay(db);
    replayedEvents = replay.events;
    report('replay_differs', replay.violations);
  }
  const count = async (table: 'counterparty' | 'mention' | 'history_event') =>
    Number((await db.selectFrom(table).select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow()).n);
  return {
    ok: checks.every((c) => c.ok),
    checks,
    counts: { counterparties: await count('counterparty'), mentions: await count('mention'), historyEvents: await count('history_event'), replayedEvents },
  };
}

/** The report as lines for a terminal. */
export function formatVerifyReport(report: VerifyReport): string {
  const lines: string[] = [];
  const c = report.counts;
  lines.push(
    `checked ${c.counterparties} counterparties, ${c.mentions} mentions, ${c.historyEvents} history events` +
      (c.replayedEvents === null ? ' (replay skipped)' : ` (replayed ${c.replayedEvents})`),
  );
  for (const check of report.checks) {
    lines.push(`${check.ok ? 'ok  ' : 'FAIL'} ${check.check}${check.ok ? '' : `: ${check.violationCount} violation(s)`}`);
    for (const v of check.violations) lines.push(`       ${v.message}`);
    if (check.violationCount > check.violations.length) lines.push(`       … and ${check.violationCount - check.violations.length} more (use --json --limit)`);
  }
  lines.push(report.ok ? 'register verified: no violations' : 'register NOT verified: see the violations above');
  return lines.join('\n');
}
