/**
 * A ChangeSet is the only way the register writes its state tables. Inside one transaction it locks, reads and
 * changes rows, and records each change as a row image (Op, state/ops.ts). The ops then become the payload of one
 * history event (history/commit.ts), which is what makes replay from empty and exact undo possible.
 *
 * Parts: the rows it holds (state/row-cache.ts), the ids drawn beforehand for its new rows, and, while buffering,
 * the write buffer (state/write-buffer.ts) that reaches the database in a few set-based statements at `flush`.
 * The SQL is in db/queries/state-writes.ts.
 */
import type { Kysely, Transaction } from 'kysely';
import type { Database } from '../../../db/types.ts';
import { deleteById, drawIds, drawIdsAndLock, insertReturning, lockNamesOf, lockRows, nextId, updateById } from '../../../db/queries/state-writes.ts';
import { explanationBodies, insertExplanation } from '../../../db/queries/explanations.ts';
import { deepEqual } from './deep-equal.ts';
import { syncDerived, type DerivedContext } from './derived.ts';
import { asJsonb, jsonbImage } from './jsonb-image.ts';
import { refsOf, touchedBy, type Op } from './ops.ts';
import { RowCache } from './row-cache.ts';
import { canonicalPatch, canonicalRow, toDbValues, type Row, type StateRow, type StateTable, type StateValues } from './tables.ts';
import { TEMP_ID_BASE, WriteBuffer, type BufferedEvent } from './write-buffer.ts';

export type { Op } from './ops.ts';
export { touchedBy } from './ops.ts';
export type { BufferedEvent } from './write-buffer.ts';

export type Db = Kysely<Database> | Transaction<Database>;

/** Narrows a row of a generic table: what a ChangeSet holds under a table is a row of that table. */
function isNameRow(table: StateTable, _row: object): _row is StateRow<'counterparty_name'> {
  return table === 'counterparty_name';
}

/** Tables whose ids a ChangeSet draws beforehand: the state tables and the history (events, explanations). */
export type IdTable = StateTable | 'history_event' | 'explanation';

export class ChangeSet {
  readonly ops: Op[] = [];
  /** Merged id → survivor, as found while locking (records.ts lockActive). */
  readonly aliases = new Map<number, number>();
  private readonly cache = new RowCache();
  /** Buffered mode (the resolve path): set by `startBuffering`, written by `flush`. */
  private buffer: WriteBuffer | null = null;
  /** Ids reserved for new rows, per table, taken in order (buffered or not). */
  private pools = new Map<IdTable, number[]>();
  private nextTemp = TEMP_ID_BASE;
  /** Real ids of temporary ids already written. */
  private readonly realIds = new Map<number, number>();
  /** Bodies of the explanations this ChangeSet stored or read, by id (as jsonb keeps them). */
  private readonly explanations = new Map<number, Row>();

  constructor(
    readonly trx: Transaction<Database>,
    private readonly derived: DerivedContext,
  ) {}

  /**
   * Locks rows (SELECT … FOR UPDATE, in id order so that two transactions never wait on each other in a cycle)
   * and returns their canonical images, in id order. Missing ids are absent from the result. Rows this
   * ChangeSet already holds (locked, inserted or changed by it) are answered from its cache.
   */
  async lock<T extends StateTable>(table: T, ids: number[]): Promise<StateRow<T>[]> {
    const wanted = [...new Set(ids)].sort((a, b) => a - b);
    if (wanted.length === 0) return [];
    const missing = wanted.filter((id) => !this.cache.has(table, id));
    if (missing.length > 0) for (const r of await lockRows(this.trx, table, missing)) this.cache.set(table, canonicalRow(table, r));
    return wanted.map((id) => this.cache.get(table, id)).filter((r): r is StateRow<T> => r !== undefined);
  }

  get buffering(): boolean {
    return this.buffer !== null;
  }

  /**
   * Buffered mode: inserts and updates change the cached images and record their ops at once, and reach the
   * database in a few set-based statements at `flush` (which the caller runs before any read of its own that
   * could see them, and before the transaction ends).
   */
  startBuffering(): void {
    this.buffer ??= new WriteBuffer();
  }

  /** Writes the buffer and leaves buffered mode. */
  async stopBuffering(): Promise<void> {
    await this.flush();
    this.buffer = null;
  }

  /** Draws ids for the rows this ChangeSet will insert, per table, in one statement; they are used in order. */
  async reserveIds(counts: Partial<Record<IdTable, number>>): Promise<void> {
    const drawn = await drawIds(this.trx, new Map(Object.entries(counts) as [IdTable, number][]));
    for (const [table, ids] of drawn) this.pools.set(table, [...(this.pools.get(table) ?? []), ...ids]);
  }

  /** The real id of a temporary id once it is written (any other id as it is). */
  realId(id: number): number {
    return this.realIds.get(id) ?? id;
  }

  /**
   * reserveIds, lock('counterparty', …) and loadNames in one statement (one round trip), for a write that knows
   * beforehand which counterparty it changes (a single resolve linking a mention). Rows this ChangeSet holds
   * already are not locked again.
   */
  async reserveAndLock(counts: Partial<Record<IdTable, number>>, lock: { counterparties: number[]; namesOf: number[] }): Promise<void> {
    const counterparties = [...new Set(lock.counterparties)].filter((id) => !this.cache.has('counterparty', id));
    const namesOf = this.namesToLoad(lock.namesOf);
    const drawn = await drawIdsAndLock(this.trx, new Map(Object.entries(counts) as [IdTable, number][]), { counterparties, namesOf });
    for (const [table, ids] of drawn.ids) this.pools.set(table, [...(this.pools.get(table) ?? []), ...ids]);
    for (const r of drawn.counterparties) this.cache.set('counterparty', canonicalRow('counterparty', r));
    this.holdNames(namesOf, drawn.names);
  }

  /** Locks every name of these counterparties and keeps them as their complete name lists. */
  async loadNames(counterpartyIds: number[]): Promise<void> {
    const ids = this.namesToLoad(counterpartyIds);
    if (ids.length === 0) return;
    this.holdNames(ids, await lockNamesOf(this.trx, ids));
  }

  private namesToLoad(counterpartyIds: readonly number[]): number[] {
    return [...new Set(counterpartyIds)].filter((id) => !this.cache.holdsNamesOf(id)).sort((a, b) => a - b);
  }

  private holdNames(counterpartyIds: readonly number[], read: readonly Row[]): void {
    for (const id of counterpartyIds) this.cache.holdNamesOf(id);
    for (const row of read.map((r) => canonicalRow('counterparty_name', r))) {
      // A row changed earlier by this ChangeSet keeps its cached image.
      if (!this.cache.has('counterparty_name', row.id)) this.cache.set('counterparty_name', row);
      this.cache.trackName(row, true);
    }
  }

  /** All name rows of a counterparty, when this ChangeSet holds them (buffered mode; see RowCache). */
  async namesOf(counterpartyId: number): Promise<StateRow<'counterparty_name'>[] | undefined> {
    if (!this.buffer) return undefined;
    await this.loadNames([counterpartyId]);
    return this.cache.namesOf(counterpartyId);
  }

  private async newId(table: StateTable): Promise<number> {
    const pool = this.pools.get(table);
    if (pool && pool.length > 0) return pool.shift()!;
    // Names get a temporary id (drawn for real at flush) unless reserved: how many a batch adds is not known beforehand.
    if (table === 'counterparty_name') return this.nextTemp++;
    return nextId(this.trx, table);
  }

  /**
   * Stores the explanation of a decision once and answers its id, for the mention and the review item to reference
   * (db/queries/explanations.ts). Not a state row: like the history, it is never changed, so it records no op.
   */
  async explain(body: Row): Promise<number> {
    const image = asJsonb(body) as Row;
    const id = this.pools.get('explanation')?.shift() ?? (await nextId(this.trx, 'explanation'));
    this.explanations.set(id, image);
    if (this.buffer) this.buffer.explanation(id, image);
    else await insertExplanation(this.trx, id, image);
    return id;
  }

  /** The body of an explanation: one this ChangeSet stored or read, else read now. */
  async explanation(id: number): Promise<Row | undefined> {
    if (!this.explanations.has(id)) for (const [key, body] of await explanationBodies(this.trx, [id])) this.explanations.set(key, body);
    return this.explanations.get(id);
  }

  /** Buffered mode: a history event written at the next flush, under a reserved id or a temporary one (see `realId`). */
  bufferEvent(values: Row, ops: Op[]): number {
    const pool = this.pools.get('history_event');
    const event: BufferedEvent = { id: pool && pool.length > 0 ? pool.shift()! : this.nextTemp++, values, ops };
    this.buffer!.event(event);
    return event.id;
  }

  /** Writes everything buffered: the rows, their derived keys and the events, in a few statements. */
  async flush(): Promise<void> {
    if (!this.buffer || this.buffer.empty) return;
    for (const [temp, id] of await this.buffer.write(this.trx, this.cache, this.ops)) this.realIds.set(temp, id);
  }

  /** The current image of one row, locking it on first use. */
  async get<T extends StateTable>(table: T, id: number): Promise<StateRow<T> | undefined> {
    const cached = this.cache.get(table, id);
    if (cached) return cached;
    const [row] = await this.lock(table, [id]);
    return row;
  }

  /** Rows of a table inserted in the buffer and not written yet (a read of the table does not see them). */
  unwritten<T extends StateTable>(table: T): StateRow<T>[] {
    return this.buffer ? this.buffer.insertedIds(table).map((id) => this.cache.get(table, id)!) : [];
  }

  /** The image of a row this ChangeSet already read or wrote, without a query. */
  cached<T extends StateTable>(table: T, id: number): StateRow<T> | undefined {
    return this.cache.get(table, id);
  }

  async require<T extends StateTable>(table: T, id: number): Promise<StateRow<T>> {
    const row = await this.get(table, id);
    if (!row) throw new Error(`${table} ${id} vanished inside its own transaction`);
    return row;
  }

  async insert<T extends StateTable>(table: T, values: StateValues<T>): Promise<StateRow<T>> {
    if (this.buffer) {
      const id = await this.newId(table);
      const row = canonicalRow(table, jsonbImage(table, { ...values, id }));
      this.cache.set(table, row);
      this.buffer.insert(table, id);
      this.ops.push({ op: 'insert', table, row });
      if (table === 'counterparty') this.cache.holdNamesOf(id);
      if (isNameRow(table, row)) {
        this.cache.trackName(row, true);
        this.buffer.nameKeys([...new Set(this.derived.nameKeys(row))], row.counterparty_id, id);
        const stored = this.derived.nameAnalysis(row.name, (await this.get('counterparty', row.counterparty_id))?.jurisdiction ?? null);
        this.buffer.nameAnalysis({ name_id: id, analysis: stored.analysis, analysis_version: stored.version, country: stored.country });
      }
      return row;
    }
    const reserved = this.pools.get(table)?.shift();
    const given = reserved === undefined ? values : { ...values, id: reserved };
    const row = canonicalRow(table, await insertReturning(this.trx, table, toDbValues(table, given)));
    this.cache.set(table, row);
    const op: Op = { op: 'insert', table, row };
    this.ops.push(op);
    if (isNameRow(table, row)) this.cache.trackName(row, true);
    await syncDerived(this.trx, op, this.derived);
    return row;
  }

  /** Changes the given columns; records only the columns whose value really changes. */
  async update<T extends StateTable>(table: T, id: number, patch: StateValues<T>): Promise<StateRow<T>> {
    const current = await this.require(table, id);
    const image: Row = current;
    const next = canonicalPatch(table, patch);
    const before: Row = {};
    const after: Row = {};
    for (const [column, value] of Object.entries(next)) {
      if (deepEqual(image[column], value)) continue;
      before[column] = image[column];
      after[column] = value;
    }
    if (Object.keys(after).length === 0) return current;
    const op: Op = { op: 'update', table, id, before, after, refs: refsOf(table, current) };
    const row: StateRow<T> = { ...current, ...after };
    // A name's text or owner changes its derived keys: written at once (after the buffer).
    // So does a counterparty's jurisdiction: its names' stored analyses.
    const immediate =
      (table === 'counterparty_name' && ('name' in after || 'normalised' in after || 'counterparty_id' in after)) ||
      (table === 'counterparty' && 'jurisdiction' in after);
    if (this.buffer && !immediate) {
      this.cache.set(table, row);
      this.buffer.update(table, id, after);
      this.ops.push(op);
      return row;
    }
    await this.flush();
    await updateById(this.trx, table, id, toDbValues(table, after));
    this.cache.set(table, row);
    if (isNameRow(table, current) && isNameRow(table, row) && 'counterparty_id' in after) {
      this.cache.trackName(current, false);
      this.cache.trackName(row, true);
    }
    this.ops.push(op);
    await syncDerived(this.trx, op, this.derived);
    return row;
  }

  async delete<T extends StateTable>(table: T, id: number): Promise<StateRow<T>> {
    // Derived rows and the buffer's own rows may refer to it: write the buffer first.
    await this.flush();
    const current = await this.require(table, id);
    if (isNameRow(table, current)) this.cache.trackName(current, false);
    const op: Op = { op: 'delete', table, row: current };
    // Derived rows go first: they reference the row being deleted.
    await syncDerived(this.trx, op, this.derived);
    await deleteById(this.trx, table, id);
    this.cache.delete(table, id);
    this.ops.push(op);
    return current;
  }

  touched(): { counterpartyIds: number[]; mentionIds: number[] } {
    return touchedBy(this.ops);
  }
}
