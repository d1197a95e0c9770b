/**
 * Loading a register of known counterparties in bulk (a vendor master, a migration from another system, the
 * benchmarks' registers): one counterparty per row, no matching between rows (the source has deduplicated them).
 *
 * Set-based, one transaction (write()) per chunk of LOAD_CHUNK rows, leaving what the register's own write path
 * leaves: the counterparties, their names, the names' blocking keys (and through the triggers the key counts:
 * migrations/20261205102000_blocking_key_count.ts) and one `created` history event for the chunk (its ops: every
 * row, as replay and undo need them): the rows createCounterpartyRow and addNameSighting would have written one by
 * one, under ids drawn in one statement.
 *
 * On PostgreSQL the rows are built here (the same values and images a ChangeSet makes: create-counterparty-row.ts counterpartyValues
 * and nameValues, state/tables.ts canonicalRow) and sent with COPY, one per table (db/queries/copy-rows.ts): no
 * statement parameters, no JSON unpacked on the server. Elsewhere (PGlite), or with `via: 'statements'`, a
 * buffered ChangeSet writes them in one statement of set-based inserts. Both leave the same rows, keys, counts and
 * events (tests/services/register/bulk-load.test.ts compares them row for row).
 *
 * Rows are checked before anything is written: a bad row stops the load with an error naming its line; the chunks
 * already committed stay (each is complete), and the error says how many rows were loaded.
 *
 * A large load (a register's first, a benchmark's) can go in one transaction instead (`oneTransaction`, PostgreSQL):
 * the same chunks, events and rows, but blocking_key's indexes and keys built once at the end rather than row by
 * row, and the key counts added once from the loaded keys (db/queries/load-indexes.ts); row by row, blocking_key was
 * most of a chunk's server time. The register's names and keys are locked until it commits.
 */
import type { Transaction } from 'kysely';
import type { PoolClient } from 'pg';
import type { Database } from '../../db/types.ts';
import type { RegisterContext, ActorInput } from './context.ts';
import type { ChangeSet, Op } from './state/change-set.ts';
import type { StoredNameAnalysis } from '../../db/queries/blocking-keys.ts';
import { write } from './transaction.ts';
import { addNameSighting, nameValues } from './add-name-sighting.ts';
import { checkName } from './check-name.ts';
import { counterpartyValues, createCounterpartyRow } from './create-counterparty-row.ts';
import { checkJurisdiction } from './jurisdiction.ts';
import { commitEvent, eventRow, type EventInput } from './history/commit.ts';
import { RegisterError, invalid } from './errors.ts';
import { canonicalRow, columnsOf, type Row, type StateTable } from './state/tables.ts';
import { jsonbImage } from './state/jsonb-image.ts';
import { analyse } from './matching/analysis.ts';
import { transactionClient } from '../../db/transaction-client.ts';
import { copyRows } from '../../db/queries/copy-rows.ts';
import { drawIds } from '../../db/queries/state-writes.ts';
import { addLoadedKeyCounts, dropIndexesForLoad, restoreIndexes } from '../../db/queries/load-indexes.ts';

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
  /**
   * `copy` (default): COPY where the backend has it (PostgreSQL), else the statements; `statements`: always the
   * buffered ChangeSet's statements (the reference the COPY path is compared with).
   */
  via?: 'copy' | 'statements';
  /**
   * One transaction for the whole load (PostgreSQL; elsewhere, or with `via: 'statements'`, the load goes in
   * chunks): for a large load, a register's first load above all. blocking_key's indexes and keys and
   * counterparty_name's plain indexes are built once at the end instead of row by row, and the key counts added
   * once from the loaded keys (db/queries/load-indexes.ts). The events, rows and counts are those of the chunked
   * load; but nobody reads or writes the register's names and keys until it commits, a bad row or any failure
   * leaves nothing of the load, and `progress` counts rows copied, not committed.
   */
  oneTransaction?: boolean;
}

/**
 * Loads rows from any iterator in chunks; returns the number of counterparties created. The next chunk is checked
 * and its names analysed while the database writes the current one (in slices, so that the write's round trips are
 * answered in between): the two processes work at once instead of in turn. Chunks are still written one after the
 * other, in order.
 */
export async function loadCounterparties(ctx: RegisterContext, rows: Iterable<LoadRow>, who: ActorInput, options: LoadOptions): Promise<number> {
  if (options.oneTransaction && options.via !== 'statements') {
    const loaded = await loadInOneTransaction(ctx, rows, who, options);
    if (loaded !== undefined) return loaded;
  }
  return loadChunks(
    ctx,
    rows,
    options,
    (prepared) => writeChunk(ctx, prepared, who, options),
    (loaded) => `${loaded} rows loaded before this chunk; nothing of it was written`,
  );
}

/**
 * `oneTransaction` on PostgreSQL: every chunk copied in one transaction, blocking_key's indexes and keys built once
 * at the end and the key counts added once (db/queries/load-indexes.ts). Undefined, having read no row, when the
 * backend has no COPY (the caller loads in chunks instead).
 */
async function loadInOneTransaction(ctx: RegisterContext, rows: Iterable<LoadRow>, who: ActorInput, options: LoadOptions): Promise<number | undefined> {
  return ctx.db.transaction().execute(async (trx) => {
    const client = await transactionClient(ctx.db, trx);
    if (!client) return undefined;
    const dropped = await dropIndexesForLoad(trx);
    let first: number | undefined;
    const loaded = await loadChunks(
      ctx,
      rows,
      options,
      async (prepared) => {
        const ids = await copyChunk(trx, client, prepared, options.source, chunkEvent(ctx, prepared, who, options));
        first ??= ids[0];
      },
      () => 'nothing of the load was written: it is one transaction',
    );
    await restoreIndexes(trx, dropped);
    if (first !== undefined) await addLoadedKeyCounts(trx, first);
    return loaded;
  });
}

/** The loop of both modes: chunk N+1 checked and analysed while `writeOne` writes chunk N. */
async function loadChunks(
  ctx: RegisterContext,
  rows: Iterable<LoadRow>,
  options: LoadOptions,
  writeOne: (prepared: Prepared) => Promise<void>,
  notWritten: (loaded: number) => string,
): Promise<number> {
  let loaded = 0;
  let writing: Promise<void> = Promise.resolve();
  for (const chunk of chunksOf(rows, options.firstLine ?? 1)) {
    let prepared: Prepared;
    try {
      prepared = await prepareChunk(ctx, chunk);
    } catch (error) {
      await writing;
      if (error instanceof RegisterError) error.message = `${error.message} (${notWritten(loaded)})`;
      throw error;
    }
    await writing;
    writing = writeOne(prepared).then(() => {
      loaded += prepared.length;
      options.progress?.(loaded);
    });
    // Awaited before the next write or the end; handled now so that a failure while the next chunk is prepared is
    // not reported as unhandled.
    writing.catch(() => undefined);
  }
  await writing;
  return loaded;
}

function* chunksOf(rows: Iterable<LoadRow>, firstLine: number): Generator<{ row: LoadRow; line: number }[]> {
  let chunk: { row: LoadRow; line: number }[] = [];
  let line = firstLine;
  for (const row of rows) {
    chunk.push({ row, line: line++ });
    if (chunk.length >= LOAD_CHUNK) {
      yield chunk;
      chunk = [];
    }
  }
  if (chunk.length > 0) yield chunk;
}

/** A checked row with its name's blocking keys and stored analysis (analyses also stay in the analysis cache). */
type Prepared = { name: string; jurisdiction: string | null; keys: string[]; stored: StoredNameAnalysis }[];

/** Rows analysed between two yields to the event loop while a write is in flight. */
const PREPARE_SLICE = 200;

/** Checks the rows (a bad one throws naming its line) and analyses their names, yielding between slices. */
async function prepareChunk(ctx: RegisterContext, chunk: { row: LoadRow; line: number }[]): Promise<Prepared> {
  const out: Prepared = [];
  for (const { row, line } of chunk) {
    const name = checkName(`line ${line}: name`, row.name);
    // PostgreSQL text cannot hold U+0000: refused here with its line rather than by the database.
    if (name.includes('\u0000')) throw invalid(`line ${line}: name`, 'must not contain the character U+0000');
    const jurisdiction = checkJurisdiction(`line ${line}: country`, row.country ?? null);
    // Analysed now (the write's nameValues finds it in the analysis cache), the keys as the ChangeSet derives them.
    // Its stored analysis too, under the row's jurisdiction (the COPY path writes it; the buffered path finds it in
    // the analysis cache): made here, while the database writes the chunk before, not on the write's path.
    const keys = [...new Set(ctx.derived.nameKeys({ name, normalised: analyse(name).normalised, kind: 'legal' }))];
    out.push({ name, jurisdiction, keys, stored: ctx.derived.nameAnalysis(name, jurisdiction) });
    if (out.length % PREPARE_SLICE === 0) await new Promise((resolve) => setImmediate(resolve));
  }
  return out;
}

async function writeChunk(ctx: RegisterContext, prepared: Prepared, who: ActorInput, options: LoadOptions): Promise<void> {
  await write(ctx, async (cs) => {
    const event = chunkEvent(ctx, prepared, who, options);
    const client = options.via === 'statements' ? undefined : await transactionClient(ctx.db, cs.trx);
    if (client) await copyChunk(cs.trx, client, prepared, options.source, event);
    else await bufferChunk(cs, prepared, options.source, event);
  });
}

/**
 * One event for a chunk: it names every counterparty it created (counterparty_ids), and undoing it takes the whole
 * chunk back, as loading it was one act.
 */
function chunkEvent(ctx: RegisterContext, prepared: Prepared, who: ActorInput, options: LoadOptions): EventInput {
  return {
    type: 'created',
    actor: who.actor,
    at: ctx.now(),
    reason: who.reason ?? null,
    details: { entity: 'counterparties', count: prepared.length, loadedFrom: options.source },
  };
}

/** The statement path: a buffered ChangeSet, written in one statement of set-based inserts. */
async function bufferChunk(cs: ChangeSet, checked: Prepared, source: string, event: EventInput): Promise<void> {
  await cs.reserveIds({ counterparty: checked.length });
  for (const { name, jurisdiction } of checked) {
    const cp = await createCounterpartyRow(cs, { name, jurisdiction, at: event.at });
    await addNameSighting(cs, cp.id, { name, kind: 'legal', source }, event.at);
  }
  await commitEvent(cs, event);
  await cs.flush();
}

/** The image a ChangeSet records for an inserted row (ChangeSet.insert). */
const image = <T extends StateTable>(table: T, values: Row) => canonicalRow(table, jsonbImage(table, values));

/**
 * The COPY path: ids drawn in one statement (counterparties, names, the event: each table's in ascending order, as
 * the statement path takes them), the rows and the event's ops built in the statement path's order (each
 * counterparty, then its name), then one COPY per table, parents first.
 */
async function copyChunk(trx: Transaction<Database>, client: PoolClient, checked: Prepared, source: string, event: EventInput): Promise<number[]> {
  const n = checked.length;
  const ids = await drawIds(
    trx,
    new Map<StateTable | 'history_event', number>([
      ['counterparty', n],
      ['counterparty_name', n],
      ['history_event', 1],
    ]),
  );
  const counterparties: Row[] = [];
  const names: Row[] = [];
  const keys: Row[] = [];
  const analyses: Row[] = [];
  const ops: Op[] = [];
  checked.forEach(({ name, jurisdiction, keys: nameKeys, stored }, i) => {
    const cp = image('counterparty', { ...counterpartyValues({ name, jurisdiction, at: event.at }), id: ids.get('counterparty')![i]! });
    const nm = image('counterparty_name', { ...nameValues(cp.id, { name, kind: 'legal', source }, event.at), id: ids.get('counterparty_name')![i]! });
    counterparties.push(cp);
    names.push(nm);
    ops.push({ op: 'insert', table: 'counterparty', row: cp }, { op: 'insert', table: 'counterparty_name', row: nm });
    for (const key of nameKeys) keys.push({ key, counterparty_id: cp.id, name_id: nm.id });
    // The name's stored analysis, as the buffered path writes it beside the name (state/change-set.ts insert).
    analyses.push({ name_id: nm.id, analysis: stored.analysis, analysis_version: stored.version, country: stored.country });
  });
  await copyRows(client, { table: 'counterparty', columns: columnsOf('counterparty'), rows: counterparties });
  await copyRows(client, { table: 'counterparty_name', columns: columnsOf('counterparty_name'), rows: names });
  await copyRows(client, { table: 'blocking_key', columns: ['key', 'counterparty_id', 'name_id'], rows: keys });
  await copyRows(client, {
    table: 'counterparty_name_analysis',
    columns: ['name_id', 'analysis', 'analysis_version', 'country'],
    json: ['analysis'],
    rows: analyses,
  });
  const row = eventRow(ids.get('history_event')![0]!, event, ops);
  await copyRows(client, { table: 'history_event', columns: Object.keys(row), json: ['payload'], rows: [row] });
  return ids.get('counterparty')!;
}
