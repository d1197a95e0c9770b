/**
 * A ChangeSet is the only way the register writes its state tables. Inside one transaction it locks, reads and
 * changes rows, and records each change as a row image (Op, state/ops.ts). The ops then become the payload of one
 * history event (history/commit.ts), which is what makes replay from empty and exact undo possible.
 *
 * One write path: inserts, updates and events change the cached images and record their ops at once, and reach
 * the database at the next `flush`, in a few set-based statements (state/write-buffer.ts). A writer flushes before
 * a read of its own that could miss what it wrote, and to learn the real id of a name or an event it answers
 * (`realId`); the transaction wrapper (transaction.ts) flushes before every commit. Two changes write the buffer at
 * once because the database keeps rows derived from them: a name whose text or owner changes (its blocking keys
 * follow, state/derived.ts) and a delete (written after the buffer, its derived rows first).
 *
 * Parts: the rows it holds (state/row-cache.ts), the ids of its new rows (state/id-pools.ts), the explanations
 * (state/explanations.ts) and the write buffer. The SQL is in db/queries/state-writes.ts.
 */
import type { Kysely, Transaction } from 'kysely';
import type { Database } from '../../../db/types.ts';
import { deleteById, drawIds, drawIdsAndLock, lockNamesOf, lockRows, nextId } from '../../../db/queries/state-writes.ts';
import { deepEqual } from './deep-equal.ts';
import { syncDerived, type DerivedContext } from './derived.ts';
import { Explanations } from './explanations.ts';
import { IdPools, type IdTable } from './id-pools.ts';
import { asJsonb, jsonbImage } from './jsonb-image.ts';
import { refsOf, touchedBy, type Op } from './ops.ts';
import { Prefetched } from './prefetched.ts';
import { RowCache } from './row-cache.ts';
import { canonicalPatch, canonicalRow, type Row, type StateRow, type StateTable, type StateValues } from './tables.ts';
import { WriteBuffer, type BufferedEvent } from './write-buffer.ts';

export type { Op } from './ops.ts';
export { touchedBy } from './ops.ts';
export type { BufferedEvent } from './write-buffer.ts';
export type { IdTable } from './id-pools.ts';

export type Db = Kysely<Database> | Transaction<Database>;

/** Narrows a row of a generic table: what a ChangeSet holds under a table is a row of that table. */
function isNameRow(table: StateTable, _row: object): _row is StateRow<'counterparty_name'> {
  return table === 'counterparty_name';
}

export class ChangeSet {
  readonly ops: Op[] = [];
  /** Merged id → survivor, as found while locking (lock-active.ts). */
  readonly aliases = new Map<number, number>();
  private readonly cache = new RowCache();
  private readonly buffer = new WriteBuffer();
  private readonly ids = new IdPools();
  private readonly explanations: Explanations;
  /** What a chunk read ahead (state/prefetched.ts): identifier holders, open review items of stored mentions. */
  readonly prefetched = new Prefetched();
  /** The next new counterparty takes a temporary id that the write replaces by one it draws (reserveAndLock). */
  private counterpartyInWrite = false;

  constructor(
    readonly trx: Transaction<Database>,
    private readonly derived: DerivedContext,
  ) {
    this.explanations = new Explanations(trx);
  }

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

  /** Draws ids for the rows this ChangeSet will insert, per table, in one statement; they are used in order. */
  async reserveIds(counts: Partial<Record<IdTable, number>>): Promise<void> {
    this.ids.add(await drawIds(this.trx, new Map(Object.entries(counts) as [IdTable, number][])));
  }

  /** Keeps ids drawn beforehand for this ChangeSet's new rows (a single resolve's, with its first statement). */
  keepIds(drawn: ReadonlyMap<IdTable, readonly number[]>): void {
    this.ids.add(drawn);
  }

  /** The real id of a temporary id once it is written (any other id as it is). */
  realId(id: number): number {
    return this.ids.realId(id);
  }

  /**
   * reserveIds, lock('counterparty', …) and loadNames in one statement (one round trip), for a write that knows
   * beforehand which counterparty it changes (a single resolve linking a mention). Rows this ChangeSet holds
   * already are not locked again.
   */
  async reserveAndLock(counts: Partial<Record<IdTable, number>>, lock: { counterparties: number[]; namesOf: number[] }): Promise<void> {
    const counterparties = [...new Set(lock.counterparties)].filter((id) => !this.cache.has('counterparty', id));
    const namesOf = this.namesToLoad(lock.namesOf);
    const short = this.ids.lacking(counts);
    const drawing = [...short].filter(([, n]) => n > 0);
    if (counterparties.length === 0 && namesOf.length === 0) {
      if (drawing.length === 0) return;
      // One new counterparty is all this statement would be for: its id is drawn by the write instead (one round
      // trip fewer). Its id is not drawn ahead as the others are: the register's size is its highest id (matching/idf.ts).
      if (drawing.length === 1 && drawing[0]![0] === 'counterparty' && drawing[0]![1] === 1) {
        this.counterpartyInWrite = true;
        return;
      }
    }
    const drawn = await drawIdsAndLock(this.trx, short, { counterparties, namesOf });
    this.ids.add(drawn.ids);
    for (const r of drawn.counterparties) this.cache.set('counterparty', canonicalRow('counterparty', r));
    this.holdNames(namesOf, drawn.names);
  }

  /** Reads the holders of these identifiers in one statement (state/prefetched.ts), with those in the buffer. */
  async prefetchHolders(identifiers: readonly { scheme: string; value: string }[]): Promise<void> {
    await this.prefetched.readHolders(this.trx, identifiers, this.unwritten('counterparty_identifier'));
  }

  /** Locks the open review items of these mentions in one statement and keeps them (state/prefetched.ts). */
  async prefetchOpenItems(mentionIds: readonly number[]): Promise<void> {
    await this.prefetched.readOpenItems(this.trx, mentionIds, this.cache);
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
      this.cache.trackName(this.cache.get('counterparty_name', row.id)!, true);
    }
    // Names of theirs still in the buffer: the read did not see them.
    for (const id of this.buffer.insertedIds('counterparty_name')) this.cache.trackName(this.cache.get('counterparty_name', id)!, true);
  }

  /** All name rows of a counterparty, locked in one statement on first use and kept in step by every write here. */
  async namesOf(counterpartyId: number): Promise<StateRow<'counterparty_name'>[]> {
    await this.loadNames([counterpartyId]);
    return this.cache.namesOf(counterpartyId);
  }

  /**
   * Stores the explanation of a decision once and answers its id, for the mention and the review item to reference
   * (db/queries/explanations.ts); written with the buffer. Not a state row: it records no op.
   */
  async explain(body: Row): Promise<number> {
    const image = asJsonb(body) as Row;
    const id = this.ids.take('explanation') ?? (await nextId(this.trx, 'explanation'));
    this.explanations.keep(id, image);
    this.buffer.explanation(id, image);
    return id;
  }

  /** The body of an explanation: one this ChangeSet stored or read, else read now. */
  explanation(id: number): Promise<Row | undefined> {
    return this.explanations.body(id);
  }

  /** A history event written at the next flush, under a reserved id or a temporary one (see `realId`). */
  bufferEvent(values: Row, ops: Op[]): number {
    const event: BufferedEvent = { id: this.ids.takeOrTemporary('history_event'), values, ops };
    this.buffer.event(event);
    return event.id;
  }

  /** Writes everything buffered: the rows, their derived keys and the events, in a few statements. */
  async flush(): Promise<void> {
    this.counterpartyInWrite = false;
    if (this.buffer.empty) return;
    this.ids.written(await this.buffer.write(this.trx, this.cache, this.ops));
  }

  /** The transaction for a read that must see everything this ChangeSet changed: the buffer is written first. */
  async flushed(): Promise<Transaction<Database>> {
    await this.flush();
    return this.trx;
  }

  /** The current image of one row, locking it on first use. */
  async get<T extends StateTable>(table: T, temporaryOrReal: number): Promise<StateRow<T> | undefined> {
    // A writer may still hold a temporary id the buffer's write has replaced since.
    const id = this.realId(temporaryOrReal);
    const cached = this.cache.get(table, id);
    if (cached) return cached;
    const [row] = await this.lock(table, [id]);
    return row;
  }

  /** Rows of a table inserted in the buffer and not written yet (a read of the table does not see them). */
  unwritten<T extends StateTable>(table: T): StateRow<T>[] {
    return this.buffer.insertedIds(table).map((id) => this.cache.get(table, id)!);
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

  /** A new row, with its id: reserved, or drawn now (a name with none reserved: temporary until the flush). */
  async insert<T extends StateTable>(table: T, values: StateValues<T>): Promise<StateRow<T>> {
    const id =
      table === 'counterparty_name' || (table === 'counterparty' && this.takeCounterpartyInWrite())
        ? this.ids.takeOrTemporary(table)
        : (this.ids.take(table) ?? (await nextId(this.trx, table)));
    const row = canonicalRow(table, jsonbImage(table, { ...values, id }));
    this.cache.set(table, row);
    this.buffer.insert(table, id);
    this.ops.push({ op: 'insert', table, row });
    this.prefetched.inserted(table, row);
    if (table === 'counterparty') this.cache.holdNamesOf(id);
    if (isNameRow(table, row)) {
      this.cache.trackName(row, true);
      this.buffer.nameKeys([...new Set(this.derived.nameKeys(row))], row.counterparty_id, id);
      const stored = this.derived.nameAnalysis(row.name, (await this.get('counterparty', row.counterparty_id))?.jurisdiction ?? null);
      this.buffer.nameAnalysis({ name_id: id, analysis: stored.analysis, analysis_version: stored.version, country: stored.country });
    }
    return row;
  }

  /** Whether the next new counterparty's id is drawn by the write (once: the write draws one). */
  private takeCounterpartyInWrite(): boolean {
    const inWrite = this.counterpartyInWrite && this.ids.held('counterparty') === 0 && !this.buffer.drawsCounterparty();
    this.counterpartyInWrite = false;
    return inWrite;
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
    // The row's own id: `id` may be a temporary one written since (realId).
    id = current.id;
    const op: Op = { op: 'update', table, id, before, after, refs: refsOf(table, current) };
    const row: StateRow<T> = { ...current, ...after };
    this.cache.set(table, row);
    if (isNameRow(table, current) && isNameRow(table, row) && 'counterparty_id' in after) {
      this.cache.trackName(current, false);
      this.cache.trackName(row, true);
    }
    this.buffer.update(table, id, after);
    this.ops.push(op);
    this.prefetched.changed(table);
    // A name's text or owner changes its blocking keys, which the database keeps, and a counterparty's jurisdiction
    // its names' stored analyses: written now, and the derived rows follow.
    const derivedFollows =
      (table === 'counterparty_name' && ('name' in after || 'normalised' in after || 'counterparty_id' in after)) ||
      (table === 'counterparty' && 'jurisdiction' in after);
    if (derivedFollows) {
      await this.flush();
      await syncDerived(this.trx, op, this.derived);
      return this.cache.get(table, this.realId(id))!;
    }
    return row;
  }

  /** Deletes a row: derived rows and the buffer's own rows may refer to it, so the buffer is written first. */
  async delete<T extends StateTable>(table: T, id: number): Promise<StateRow<T>> {
    await this.flush();
    const current = await this.require(table, this.realId(id));
    if (isNameRow(table, current)) this.cache.trackName(current, false);
    const op: Op = { op: 'delete', table, row: current };
    // Derived rows go first: they reference the row being deleted.
    await syncDerived(this.trx, op, this.derived);
    await deleteById(this.trx, table, current.id);
    this.cache.delete(table, current.id);
    this.ops.push(op);
    this.prefetched.changed(table);
    return current;
  }

  touched(): { counterpartyIds: number[]; mentionIds: number[] } {
    return touchedBy(this.ops);
  }
}
