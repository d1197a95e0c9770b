/**
 * What the keys, ingest, export and reconcile commands share: opening (and migrating) the database, the CLI actor `cli:<operating-system user>`, and progress on stderr — a bar with rate and
 * time left on a terminal, a plain line every few seconds otherwise.
 */
import { userInfo } from 'node:os';
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import { countOf, singularOf } from '../cli/count-words.ts';

export { countOf, pluralOf, singularOf } from '../cli/count-words.ts';

/** Opens the command's database (services/cli/open-command-database.ts: which one, created or refused), migrated; runs `fn`; closes. */
export async function withDatabase<T>(
  target: string | undefined,
  command: string,
  access: 'reads' | 'matches' | 'writes',
  fn: (db: Kysely<Database>) => Promise<T>,
): Promise<T> {
  const { openCommandDatabase } = await import('../cli/open-command-database.ts');
  // 'matches': reads that look names up in the register (its candidate ranking needs the search extensions).
  const database = await openCommandDatabase(target, command, { writes: access === 'writes', matches: access === 'matches' });
  try {
    return await fn(database.db);
  } finally {
    await database.close();
  }
}

export function cliActor(): string {
  let name = process.env.USER ?? 'unknown';
  try {
    name = userInfo().username;
  } catch {
    // no passwd entry (containers): keep $USER
  }
  return `cli:${name}`;
}

export interface ProgressState {
  done: number;
  /** Fraction done (0..1) when known. */
  fraction?: number;
  /** Extra words after the counts ("12 rejected"). */
  note?: string;
}

function duration(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) return '--:--';
  const s = Math.round(seconds);
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const pad = (n: number) => String(n).padStart(2, '0');
  return h > 0 ? `${h}:${pad(m)}:${pad(s % 60)}` : `${pad(m)}:${pad(s % 60)}`;
}

/** Seconds of work, and a share of it done, before a time left is worth printing: earlier guesses mislead. */
const ESTIMATE_AFTER_S = 3;
const ESTIMATE_AFTER_FRACTION = 0.02;

/**
 * Progress on stderr; `quiet` (e.g. --json with no TTY) still prints the periodic lines to stderr. `unit` is the
 * plural ("rows", "vendor rows", "entities"); one item reads in the singular. Rate and time left count from the
 * first update, not from the reporter's creation (opening a database before the first row is no part of the work),
 * and the time left appears only once enough of the work is done to judge it.
 */
export function progressReporter(label: string, unit: string, out: NodeJS.WriteStream = process.stderr, intervalMs = 5000) {
  const one = singularOf(unit);
  let first: { at: number; done: number; fraction: number } | undefined;
  let lastLine = 0;
  const tty = Boolean(out.isTTY);
  return {
    update(state: ProgressState): void {
      const now = performance.now();
      first ??= { at: now, done: state.done, fraction: state.fraction ?? 0 };
      const elapsed = (now - first.at) / 1000;
      const rate = elapsed > 0 ? (state.done - first.done) / elapsed : 0;
      const progressed = state.fraction === undefined ? 0 : state.fraction - first.fraction;
      const judged = elapsed >= ESTIMATE_AFTER_S && progressed >= ESTIMATE_AFTER_FRACTION;
      const left = judged ? (elapsed * (1 - state.fraction!)) / progressed : NaN;
      const count = countOf(state.done, one, unit);
      const rateText = elapsed > 0 && state.done > first.done ? `${Math.round(rate).toLocaleString('en-US')}/s` : '';
      if (tty) {
        const width = 24;
        const filled = Math.round((state.fraction ?? 0) * width);
        const bar = `[${'#'.repeat(filled)}${'.'.repeat(width - filled)}]`;
        const pct = state.fraction === undefined ? '' : ` ${(state.fraction * 100).toFixed(0).padStart(3)}%`;
        const tail = [rateText, judged ? `about ${duration(left)} left` : ''].filter(Boolean).join(', ');
        out.write(`\r${label} ${bar}${pct} ${count}${tail ? ` (${tail})` : ''}${state.note ? ` ${state.note}` : ''}\u001b[K`);
      } else if (now - lastLine >= intervalMs || lastLine === 0) {
        lastLine = now;
        const parts = [
          rateText,
          state.fraction === undefined ? '' : `${(state.fraction * 100).toFixed(0)}%`,
          judged ? `about ${duration(left)} left` : '',
        ].filter(Boolean);
        out.write(`${label}: ${count}${parts.length > 0 ? ` (${parts.join(', ')})` : ''}${state.note ? `, ${state.note}` : ''}\n`);
      }
    },
    finish(): void {
      if (tty) out.write('\n');
    },
  };
}
