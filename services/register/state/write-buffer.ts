/**
 * The write buffer of a ChangeSet: rows inserted and columns changed since the last flush, the blocking keys of
 * new names and the history events, written at the flush in a few set-based statements (db/queries/state-writes.ts).
 * Names and events carry temporary ids until then (how many a batch adds is not known beforehand): the flush
 * draws their real ids in one statement and renames them everywhere the ChangeSet keeps them. A single resolve's
 * events and its one new counterparty are drawn by the write itself instead (one round trip fewer).
 */
import type { Transaction } from 'kysely';
import type { Database } from '../../../db/types.ts';
import {
  drawIds,
  insertBlockingKeys,
  insertDrawingIds,
  insertRows,
  runWritesDrawing,
  updateRows,
  type DrawnInWrite,
  type SetWrite,
} from '../../../db/queries/state-writes.ts';
import { insertExplanations } from '../../../db/queries/explanations.ts';
import { upsertNameAnalysesWrite, type NameAnalysisRow } from '../../../db/queries/name-analysis.ts';
import { isTemporaryId } from './id-pools.ts';
import type { Op } from './ops.ts';
import type { RowCache } from './row-cache.ts';
import { columnsOf, COUNTERPARTY_COLUMNS, STATE_TABLES, type Row, type StateTable } from './tables.ts';

/** A history event waiting in the buffer (history/commit.ts). */
export interface BufferedEvent {
  id: number;
  values: Row;
  ops: Op[];
}

const EVENT_COLUMNS_BUT_ID = ['type', 'actor', 'at', 'reason', 'payload', 'counterparty_ids', 'mention_ids', 'undoes_event_id', 'request_id'];
const EVENT_COLUMNS = ['id', ...EVENT_COLUMNS_BUT_ID];

export class WriteBuffer {
  /** Rows inserted since the last flush, by table, as ids (their latest image is in the row cache). */
  private inserts = new Map<StateTable, number[]>();
  private inserted = new Set<string>();
  /** Changed columns of rows stored before, by table and id. */
  private updates = new Map<string, { table: StateTable; id: number; after: Row }>();
  private blockingKeys: { key: string; counterparty_id: number; name_id: number }[] = [];
  private analyses: NameAnalysisRow[] = [];
  private events: BufferedEvent[] = [];
  private explanations: { id: number; body: Row }[] = [];

  insert(table: StateTable, id: number): void {
    if (!this.inserts.has(table)) this.inserts.set(table, []);
    this.inserts.get(table)!.push(id);
    this.inserted.add(`${table}:${id}`);
  }

  /** A change to a row; one inserted in this buffer is written with its latest image already. */
  update(table: StateTable, id: number, after: Row): void {
    const key = `${table}:${id}`;
    if (this.inserted.has(key)) return;
    const pending = this.updates.get(key);
    this.updates.set(key, { table, id, after: { ...(pending?.after ?? {}), ...after } });
  }

  nameKeys(keys: readonly string[], counterpartyId: number, nameId: number): void {
    for (const key of keys) this.blockingKeys.push({ key, counterparty_id: counterpartyId, name_id: nameId });
  }

  /** The stored analysis of a new name (derived.ts), written with it. */
  nameAnalysis(row: NameAnalysisRow): void {
    this.analyses.push(row);
  }

  explanation(id: number, body: Row): void {
    this.explanations.push({ id, body });
  }

  event(event: BufferedEvent): void {
    this.events.push(event);
  }

  /** Ids of the rows of a table inserted since the last flush. */
  insertedIds(table: StateTable): readonly number[] {
    return this.inserts.get(table) ?? [];
  }

  get empty(): boolean {
    return (
      this.inserts.size === 0 &&
      this.updates.size === 0 &&
      this.events.length === 0 &&
      this.blockingKeys.length === 0 &&
      this.analyses.length === 0 &&
      this.explanations.length === 0
    );
  }

  /**
   * Writes everything and empties the buffer; answers the real id of each temporary id. `ops`: the ChangeSet's ops
   * not yet in an event (their name ids are renamed too).
   */
  async write(trx: Transaction<Database>, cache: RowCache, ops: Op[]): Promise<Map<number, number>> {
    // Events alone under temporary ids (a single resolve: its names reserved beforehand) draw their ids in the
    // write itself, one round trip fewer; otherwise every temporary id is drawn first and renamed.
    const drawInWrite = this.events.length > 0 && this.events.every((e) => isTemporaryId(e.id)) && !this.hasTemporaryNames();
    const map = drawInWrite ? new Map<number, number>() : await this.drawRealIds(trx, cache, ops);
    // A new counterparty under a temporary id (ChangeSet.reserveAndLock): the statement draws its id and the rows
    // that hold the temporary one are written with it (db/queries/state-writes.ts rowsParam).
    const temp = this.temporaryCounterparty();
    const drawn: DrawnInWrite | undefined = temp === undefined ? undefined : { temp };
    const writes: SetWrite[] = this.explanations.length > 0 ? [insertExplanations(this.explanations)] : [];
    for (const table of STATE_TABLES) {
      const ids = this.inserts.get(table);
      if (ids && ids.length > 0)
        writes.push(
          insertRows(
            table,
            columnsOf(table),
            ids.map((id) => cache.get(table, map.get(id) ?? id)!),
            drawn,
          ),
        );
    }
    const byColumns = new Map<string, { table: StateTable; columns: string[]; rows: Row[] }>();
    for (const { table, id, after } of this.updates.values()) {
      const columns = Object.keys(after).sort();
      const key = `${table}:${columns.join(',')}`;
      if (!byColumns.has(key)) byColumns.set(key, { table, columns, rows: [] });
      byColumns.get(key)!.rows.push({ id, ...after });
    }
    for (const { table, columns, rows } of byColumns.values()) writes.push(updateRows(table, columns, rows, drawn));
    if (this.blockingKeys.length > 0)
      writes.push(
        insertBlockingKeys(
          this.blockingKeys.map((k) => ({ ...k, name_id: map.get(k.name_id) ?? k.name_id })),
          drawn,
        ),
      );
    if (this.analyses.length > 0) writes.push(upsertNameAnalysesWrite(this.analyses.map((a) => ({ ...a, name_id: map.get(a.name_id) ?? a.name_id }))));
    let returning: SetWrite | undefined;
    if (drawInWrite) {
      const rows = this.events.map((e) => ({ ...e.values, payload: { ...(e.values.payload as Row), ops: e.ops } }));
      returning = insertDrawingIds('history_event', EVENT_COLUMNS_BUT_ID, rows, drawn);
    } else if (this.events.length > 0) {
      const rows = this.events.map((e) => ({ ...e.values, id: map.get(e.id) ?? e.id, payload: { ...(e.values.payload as Row), ops: e.ops } }));
      writes.push(insertRows('history_event', EVENT_COLUMNS, rows, drawn));
    }
    // Everything in one statement: one round trip per flush.
    const written = await runWritesDrawing(trx, writes, { ...(returning ? { returning } : {}), counterparty: temp !== undefined });
    if (drawInWrite) this.events.forEach((e, i) => map.set(e.id, written.ids[i]!));
    if (temp !== undefined) {
      map.set(temp, written.counterparty!);
      cache.renameCounterparty(temp, written.counterparty!);
      // Ops not yet in an event (a flush before the writer's event) keep their images for it: given the real id too.
      renameCounterpartyOps(ops, temp, written.counterparty!);
    }
    this.inserts = new Map();
    this.inserted = new Set();
    this.updates = new Map();
    this.blockingKeys = [];
    this.analyses = [];
    this.events = [];
    this.explanations = [];
    return map;
  }

  /** Whether a new counterparty waits under a temporary id (the write draws one at most). */
  drawsCounterparty(): boolean {
    return this.temporaryCounterparty() !== undefined;
  }

  private temporaryCounterparty(): number | undefined {
    const temps = (this.inserts.get('counterparty') ?? []).filter(isTemporaryId);
    if (temps.length > 1) throw new Error(`a write draws one counterparty id, not ${temps.length} (a defect)`);
    return temps[0];
  }

  private hasTemporaryNames(): boolean {
    return (this.inserts.get('counterparty_name') ?? []).some(isTemporaryId);
  }

  /** Real ids for the temporary ids of names and events, in one statement; renames the names everywhere. */
  private async drawRealIds(trx: Transaction<Database>, cache: RowCache, ops: Op[]): Promise<Map<number, number>> {
    const nameTemps = (this.inserts.get('counterparty_name') ?? []).filter(isTemporaryId);
    const eventTemps = this.events.map((e) => e.id).filter(isTemporaryId);
    const map = new Map<number, number>();
    if (nameTemps.length + eventTemps.length === 0) return map;
    const drawn = await drawIds(
      trx,
      new Map([
        ['counterparty_name', nameTemps.length],
        ['history_event', eventTemps.length],
      ]),
    );
    nameTemps.forEach((temp, i) => map.set(temp, drawn.get('counterparty_name')![i]!));
    eventTemps.forEach((temp, i) => map.set(temp, drawn.get('history_event')![i]!));
    const names = new Map(nameTemps.map((t) => [t, map.get(t)!]));
    renameNameOps([ops, ...this.events.map((e) => e.ops)], names);
    cache.rename('counterparty_name', names);
    return map;
  }
}

function renameNameOps(lists: Op[][], map: ReadonlyMap<number, number>): void {
  const done = new Set<Op>();
  for (const ops of lists) {
    for (const op of ops) {
      if (op.table !== 'counterparty_name' || done.has(op)) continue;
      done.add(op);
      if (op.op === 'update') op.id = map.get(op.id) ?? op.id;
      else {
        const id = op.row.id;
        if (typeof id === 'number' && map.has(id)) op.row.id = map.get(id);
      }
    }
  }
}

/** Gives a counterparty's temporary id its real one in the row images of ops (their counterparty columns). */
function renameCounterpartyOps(ops: Op[], temp: number, id: number): void {
  const rename = (table: StateTable, image: Row) => {
    for (const column of COUNTERPARTY_COLUMNS[table]) if (image[column] === temp) image[column] = id;
  };
  for (const op of ops) {
    if (op.op === 'update') {
      if (op.table === 'counterparty' && op.id === temp) op.id = id;
      for (const image of [op.before, op.after, op.refs]) rename(op.table, image);
    } else rename(op.table, op.row);
  }
}
