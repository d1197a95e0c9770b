/**
 * Loading a register of known counterparties in bulk (a vendor master, a migration from another system, the
 * benchmarks' registers): one counterparty per row, no matching between rows (the source has deduplicated them).
 *
 * Set-based, and through the register's own write path, not beside it: each chunk is one write() transaction
 * whose ChangeSet runs in buffered mode, so the counterparties, their names, the names' blocking keys (and through
 * the triggers the key counts: migrations/20261205102000_blocking_key_count.ts) and one `created` history event
 * for the chunk (its ops: every row, as replay and undo need them) reach the database in a few statements per
 * chunk: the rows createCounterparty would have written one by one. Counterparty ids are drawn in one statement.
 *
 * Rows are checked before anything is written: a bad row stops the load with an error naming its line; the chunks
 * already committed stay (each is complete), and the error says how many rows were loaded.
 */
import type { RegisterContext, ActorInput } from './context.ts';
import { write } from './transaction.ts';
import { addNameSighting, checkName, createCounterpartyRow } from './records.ts';
import { checkJurisdiction } from './jurisdiction.ts';
import { commitEvent } from './history/commit.ts';
import { RegisterError } from './errors.ts';

export interface LoadRow {
  name: string;
  /** ISO 3166-1 alpha-2 or ISO 3166-2 subdivision ("US-DE"), or null. */
  country?: string | null;
}

/** Rows per transaction: large enough for set-based statements, small enough to keep a chunk's memory modest. */
export const LOAD_CHUNK = 2000;

export interface LoadOptions {
  /** Where the names come from (stored as the names' source). */
  source: string;
  /** Line number of the first row, for error messages (default 1). */
  firstLine?: number;
  /** Called after each committed chunk with the rows loaded so far. */
  progress?: (loaded: number) => void;
}

/** Loads rows from any iterator in chunks; returns the number of counterparties created. */
export async function loadCounterparties(ctx: RegisterContext, rows: Iterable<LoadRow>, who: ActorInput, options: LoadOptions): Promise<number> {
  let chunk: { row: LoadRow; line: number }[] = [];
  let line = options.firstLine ?? 1;
  let loaded = 0;
  const flush = async () => {
    if (chunk.length === 0) return;
    await loadChunk(ctx, chunk, who, options.source, loaded);
    loaded += chunk.length;
    chunk = [];
    options.progress?.(loaded);
  };
  for (const row of rows) {
    chunk.push({ row, line: line++ });
    if (chunk.length >= LOAD_CHUNK) await flush();
  }
  await flush();
  return loaded;
}

async function loadChunk(ctx: RegisterContext, chunk: { row: LoadRow; line: number }[], who: ActorInput, source: string, loadedBefore: number): Promise<void> {
  const checked = chunk.map(({ row, line }) => {
    try {
      return { name: checkName(`line ${line}: name`, row.name), jurisdiction: checkJurisdiction(`line ${line}: country`, row.country ?? null) };
    } catch (error) {
      if (error instanceof RegisterError) error.message = `${error.message} (${loadedBefore} rows loaded before this chunk; nothing of it was written)`;
      throw error;
    }
  });
  await write(ctx, async (cs) => {
    await cs.reserveIds({ counterparty: checked.length });
    const at = ctx.now();
    for (const { name, jurisdiction } of checked) {
      const cp = await createCounterpartyRow(cs, { name, jurisdiction, at });
      await addNameSighting(cs, cp.id, { name, kind: 'legal', source }, at);
    }
    // One event for the chunk: it names every counterparty it created (counterparty_ids), and undoing it takes the
    // whole chunk back, as loading it was one act.
    await commitEvent(cs, {
      type: 'created',
      actor: who.actor,
      at,
      reason: who.reason ?? null,
      details: { entity: 'counterparties', count: checked.length, loadedFrom: source },
    });
    await cs.flush();
  });
}
