/**
 * Replays the history from empty into a scratch database (an in-memory embedded one, migrated) with the
 * register's own replay, then compares the state tables row for row with the live register. Each
 * difference names its table and row id. The blocking keys of stale names (given) are left out: verify reports
 * those names as stale (stale-analyses.ts), with the command that rewrites them.
 */
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { openDatabase } from '../../db/open-database.ts';
import { migrateToLatest } from '../../db/migrate.ts';
import { createRegisterContext, replayHistory, stateSnapshot, type StateSnapshot } from '../register/index.ts';
import type { Violation } from './invariants.ts';

type Row = Record<string, unknown>;

export interface ReplayCheckResult {
  events: number;
  violations: Violation[];
}

/**
 * `live` is read once for the snapshot and once for the replay: pass a database (or transaction) that
 * sees one consistent state, or differences may only mean that something was written in between.
 */
export async function checkReplay(live: Kysely<Database>, staleNameIds: ReadonlySet<number> = new Set()): Promise<ReplayCheckResult> {
  const scratch = await openDatabase('memory:', { command: 'cpreg verify (replay scratch)' });
  try {
    await migrateToLatest(scratch.db);
    const { events } = await replayHistory(live, scratch.db, createRegisterContext(scratch.db).derived);
    const [actual, replayed] = [await stateSnapshot(live), await stateSnapshot(scratch.db)];
    // Keys of stale names are those of an older analysis: reported as stale names (stale-analyses.ts), not here.
    if (staleNameIds.size > 0)
      for (const snapshot of [actual, replayed]) snapshot.blocking_key = snapshot.blocking_key.filter((k) => !staleNameIds.has(Number(k.name_id)));
    return { events, violations: compareSnapshots(actual, replayed) };
  } finally {
    await scratch.close();
  }
}

function rowKey(table: string, row: Row): string {
  return table === 'blocking_key' ? `${String(row.key)}|${String(row.counterparty_id)}|${String(row.name_id)}` : String(row.id);
}

/** Differences between the live register and its replay, one violation per differing row. */
export function compareSnapshots(live: StateSnapshot, replayed: StateSnapshot): Violation[] {
  const out: Violation[] = [];
  for (const table of Object.keys(live) as (keyof StateSnapshot)[]) {
    const replayRows = new Map(replayed[table].map((r) => [rowKey(table, r), r]));
    const seen = new Set<string>();
    for (const row of live[table]) {
      const key = rowKey(table, row);
      seen.add(key);
      const other = replayRows.get(key);
      const ids = { table, rowId: key };
      if (!other) {
        out.push({ check: 'replay_differs', message: `${table} row ${key} is in the register but not in the replayed history`, ids });
        continue;
      }
      const columns = Object.keys(row).filter((c) => JSON.stringify(row[c]) !== JSON.stringify(other[c]));
      if (columns.length > 0)
        out.push({ check: 'replay_differs', message: `${table} row ${key} differs from the replayed history in ${columns.join(', ')}`, ids });
    }
    for (const key of replayRows.keys()) {
      if (!seen.has(key))
        out.push({
          check: 'replay_differs',
          message: `${table} row ${key} follows from the history but is missing from the register`,
          ids: { table, rowId: key },
        });
    }
  }
  return out;
}
