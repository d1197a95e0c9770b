/**
 * A ChangeSet is the only way the register writes its state tables. Inside one transaction it locks, reads and
 * changes rows, and records each change as a row image (Op). The ops then become the payload of one history
 * event (history/commit.ts), which is what makes replay from empty and exact undo possible.
 */
import { sql, type Kysely, type Transaction } from 'kysely';
import type { Database } from '../../../db/types.ts';
import { deepEqual } from './deep-equal.ts';
import { canonicalPatch, canonicalRow, columnsOf, COUNTERPARTY_COLUMNS, MENTION_COLUMNS, STATE_TABLES, toDbValues } from './tables.ts';
import type { Row, StateTable } from './tables.ts';
import { syncDerived, type DerivedContext } from './derived.ts';

export type Op =
  | { op: 'insert'; table: StateTable; row: Row }
  /** `refs`: the row's counterparty and mention columns at the time, so the event knows whose row it changed. */
  | { op: 'update'; table: StateTable; id: number; before: Row; after: Row; refs: Row }
  | { op: 'delete'; table: StateTable; row: Row };

export type Db = Kysely<Database> | Transaction<Database>;

function rowKey(table: StateTable, id: number): string {
  return `${table}:${id}`;
}


/** Temporary ids of buffered rows whose real id is drawn when the buffer is written (above every real id, in
 * the order the rows were made, so that comparing ids before and after the write gives the same answer). */
const TEMP_ID_BASE = 2 ** 52;

/** A history event waiting in the buffer (history/commit.ts). */
export interface BufferedEvent {
  id: number;
  values: Row;
  ops: Op[];
}

interface WriteBuffer {
  /** Rows inserted since the last flush, by table, as row keys (their latest image is in the row cache). */
  inserts: Map<StateTable, number[]>;
  /** Changed columns of existing rows since the last flush, by row key. */
  updates: Map<string, { table: StateTable; id: number; after: Row }>;
  blockingKeys: { key: string; counterparty_id: number; name_id: number }[];
  events: BufferedEvent[];
}

export class ChangeSet {
  readonly ops: Op[] = [];
  /** Merged id → survivor, as found while locking (records.ts lockActive). */
  readonly aliases = new Map<number, number>();
  private readonly rows = new Map<string, Row>();
  /** Buffered mode (batch writes): set by `startBuffering`, written by `flush`. */
  private buffer: WriteBuffer | null = null;
  /** Ids reserved for new rows, per table, taken in order (buffered or not). */
  private pools = new Map<StateTable, number[]>();
  private nextTemp = TEMP_ID_BASE;
  /** Real ids of temporary ids already written. */
  private readonly realIds = new Map<number, number>();
  /**
   * Counterparty → ids of all its counterparty_name rows, for counterparties whose names this ChangeSet holds
   * completely (locked by `loadNames`, or created here). Kept in step by insert/update/delete. Buffered mode only.
   */
  private readonly names = new Map<number, Set<number>>();

  constructor(
    readonly trx: Transaction<Database>,
    private readonly derived: DerivedContext,
  ) {}

  /**
   * Locks rows (SELECT … FOR UPDATE, in id order so that two transactions never wait on each other in a cycle)
   * and returns their canonical images, in id order. Missing ids are absent from the result. Rows this
   * ChangeSet already holds (locked, inserted or changed by it) are answered from its cache.
   */
  async lock(table: StateTable, ids: number[]): Promise<Row[]> {
    const wanted = [...new Set(ids)].sort((a, b) => a - b);
    if (wanted.length === 0) return [];
    const missing = wanted.filter((id) => !this.rows.has(rowKey(table, id)));
    if (missing.length > 0) {
      const result = await sql<Row>`SELECT * FROM ${sql.table(table)} WHERE id IN (${sql.join(missing)}) ORDER BY id FOR UPDATE`.execute(
        this.trx,
      );
      for (const r of result.rows) {
        const row = canonicalRow(table, r);
        this.rows.set(rowKey(table, row.id as number), row);
      }
    }
    return wanted.map((id) => this.rows.get(rowKey(table, id))).filter((r): r is Row => r !== undefined);
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
    this.buffer = { inserts: new Map(), updates: new Map(), blockingKeys: [], events: [] };
  }

  /** Ids drawn beforehand for the rows this ChangeSet will insert, per table, used in order. */
  reserveIds(reserved: Map<StateTable, number[]>): void {
    this.pools = reserved;
  }

  /** Writes the buffer and leaves buffered mode. */
  async stopBuffering(): Promise<void> {
    await this.flush();
    this.buffer = null;
  }

  /** The real id of a temporary id once it is written (any other id as it is). */
  realId(id: number): number {
    return this.realIds.get(id) ?? id;
  }

  /** Locks every name of these counterparties and keeps them as their complete name lists. */
  async loadNames(counterpartyIds: number[]): Promise<void> {
    const ids = [...new Set(counterpartyIds)].filter((id) => !this.names.has(id)).sort((a, b) => a - b);
    if (ids.length === 0) return;
    const result = await sql<Row>`SELECT * FROM counterparty_name WHERE counterparty_id IN (${sql.join(ids)}) ORDER BY id FOR UPDATE`.execute(this.trx);
    for (const id of ids) this.names.set(id, new Set());
    for (const r of result.rows) {
      const row = canonicalRow('counterparty_name', r);
      const key = rowKey('counterparty_name', row.id as number);
      // A row changed earlier by this ChangeSet keeps its cached image.
      if (!this.rows.has(key)) this.rows.set(key, row);
      this.names.get(row.counterparty_id as number)!.add(row.id as number);
    }
  }

  /** All name rows of a counterparty, when this ChangeSet holds them (buffered mode; see `names`). */
  async namesOf(counterpartyId: number): Promise<Row[] | undefined> {
    if (!this.buffer) return undefined;
    if (!this.names.has(counterpartyId)) await this.loadNames([counterpartyId]);
    return [...this.names.get(counterpartyId)!].map((id) => this.rows.get(rowKey('counterparty_name', id))!);
  }

  private trackName(row: Row, present: boolean): void {
    const set = this.names.get(row.counterparty_id as number);
    if (!set) return;
    if (present) set.add(row.id as number);
    else set.delete(row.id as number);
  }

  private async newId(table: StateTable): Promise<number> {
    // Names get a temporary id (drawn for real at flush): how many a batch adds is not known beforehand.
    if (table === 'counterparty_name') return this.nextTemp++;
    const pool = this.pools.get(table);
    if (pool && pool.length > 0) return pool.shift()!;
    const result = await sql<{ id: string | number }>`SELECT nextval(pg_get_serial_sequence(${table}, 'id')) AS id`.execute(this.trx);
    return Number(result.rows[0]!.id);
  }

  /** Buffered mode: a history event written at the next flush, under a temporary id (see `realId`). */
  bufferEvent(values: Row, ops: Op[]): number {
    const id = this.nextTemp++;
    this.buffer!.events.push({ id, values, ops });
    return id;
  }

  /** Writes everything buffered: the rows, their derived keys and the events, in a few statements. */
  async flush(): Promise<void> {
    const buffer = this.buffer;
    if (!buffer) return;
    const temps: number[] = [];
    for (const id of buffer.inserts.get('counterparty_name') ?? []) if (id >= TEMP_ID_BASE) temps.push(id);
    const eventTemps = buffer.events.map((e) => e.id);
    const map = new Map<number, number>();
    if (temps.length + eventTemps.length > 0) {
      const drawn = await sql<{ t: string; id: string | number }>`
        SELECT t, nextval(pg_get_serial_sequence(t, 'id')) AS id
        FROM unnest(${sql.val(['counterparty_name', 'history_event'])}::text[], ${sql.val([temps.length, eventTemps.length])}::int[]) AS k(t, n),
             generate_series(1, k.n)`.execute(this.trx);
      const real = (t: string) => drawn.rows.filter((r) => r.t === t).map((r) => Number(r.id)).sort((a, b) => a - b);
      const nameIds = real('counterparty_name');
      const eventIds = real('history_event');
      temps.forEach((temp, i) => map.set(temp, nameIds[i]!));
      eventTemps.forEach((temp, i) => map.set(temp, eventIds[i]!));
      for (const [temp, id] of map) this.realIds.set(temp, id);
      this.renameTemporaryNames(map, buffer);
    }
    for (const table of STATE_TABLES) {
      const keys = buffer.inserts.get(table);
      if (!keys || keys.length === 0) continue;
      // Canonical images are what jsonb_populate_recordset reads: jsonb as JSON, timestamps as ISO text.
      const rows = keys.map((id) => this.rows.get(rowKey(table, map.get(id) ?? id))!);
      await insertRows(this.trx, table, columnsOf(table), rows);
    }
    const byColumns = new Map<string, { table: StateTable; columns: string[]; rows: Row[] }>();
    for (const { table, id, after } of buffer.updates.values()) {
      const columns = Object.keys(after).sort();
      const key = `${table}:${columns.join(',')}`;
      if (!byColumns.has(key)) byColumns.set(key, { table, columns, rows: [] });
      byColumns.get(key)!.rows.push({ id, ...after });
    }
    for (const { table, columns, rows } of byColumns.values()) {
      await sql`UPDATE ${sql.table(table)} AS t SET ${sql.join(columns.map((c) => sql`${sql.ref(c)} = r.${sql.ref(c)}`))}
        FROM jsonb_populate_recordset(NULL::${sql.table(table)}, ${JSON.stringify(rows)}::jsonb) AS r WHERE t.id = r.id`.execute(this.trx);
    }
    if (buffer.blockingKeys.length > 0) {
      const keys = buffer.blockingKeys.map((k) => ({ ...k, name_id: map.get(k.name_id) ?? k.name_id }));
      await sql`INSERT INTO blocking_key (key, counterparty_id, name_id)
        SELECT key, counterparty_id, name_id FROM jsonb_populate_recordset(NULL::blocking_key, ${JSON.stringify(keys)}::jsonb)
        ON CONFLICT DO NOTHING`.execute(this.trx);
    }
    if (buffer.events.length > 0) {
      const rows = buffer.events.map((e) => ({ ...e.values, id: map.get(e.id)!, payload: { ...(e.values.payload as Row), ops: e.ops } }));
      await insertRows(this.trx, 'history_event', ['id', 'type', 'actor', 'at', 'reason', 'payload', 'counterparty_ids', 'mention_ids', 'undoes_event_id', 'request_id'], rows);
    }
    buffer.inserts = new Map();
    buffer.updates = new Map();
    buffer.blockingKeys = [];
    buffer.events = [];
  }

  /** Gives the names inserted under temporary ids their real ids, everywhere this ChangeSet keeps them. */
  private renameTemporaryNames(map: Map<number, number>, buffer: WriteBuffer): void {
    const opsLists = [this.ops, ...buffer.events.map((e) => e.ops)];
    const done = new Set<Op>();
    for (const ops of opsLists) {
      for (const op of ops) {
        if (op.table !== 'counterparty_name' || done.has(op)) continue;
        done.add(op);
        if (op.op === 'update') op.id = map.get(op.id) ?? op.id;
        else if (map.has(op.row.id as number)) op.row.id = map.get(op.row.id as number);
      }
    }
    for (const [temp, id] of map) {
      const key = rowKey('counterparty_name', temp);
      const row = this.rows.get(key);
      if (!row) continue;
      this.rows.delete(key);
      this.rows.set(rowKey('counterparty_name', id), { ...row, id });
    }
    for (const set of this.names.values()) {
      for (const temp of [...set]) {
        if (!map.has(temp)) continue;
        set.delete(temp);
        set.add(map.get(temp)!);
      }
    }
  }

  /** The current image of one row, locking it on first use. */
  async get(table: StateTable, id: number): Promise<Row | undefined> {
    const cached = this.rows.get(rowKey(table, id));
    if (cached) return cached;
    const [row] = await this.lock(table, [id]);
    return row;
  }

  /** The image of a row this ChangeSet already read or wrote, without a query. */
  cached(table: StateTable, id: number): Row | undefined {
    return this.rows.get(rowKey(table, id));
  }

  async require(table: StateTable, id: number): Promise<Row> {
    const row = await this.get(table, id);
    if (!row) throw new Error(`${table} ${id} vanished inside its own transaction`);
    return row;
  }

  async insert(table: StateTable, values: Row): Promise<Row> {
    if (this.buffer) {
      const id = await this.newId(table);
      const row = canonicalRow(table, jsonbImage(table, { ...values, id }));
      this.rows.set(rowKey(table, id), row);
      if (!this.buffer.inserts.has(table)) this.buffer.inserts.set(table, []);
      this.buffer.inserts.get(table)!.push(id);
      const op: Op = { op: 'insert', table, row };
      this.ops.push(op);
      if (table === 'counterparty') this.names.set(id, new Set());
      if (table === 'counterparty_name') {
        this.trackName(row, true);
        const keys = [...new Set(this.derived.nameKeys(row as { name: string; normalised: string; kind: string }))];
        for (const key of keys) this.buffer.blockingKeys.push({ key, counterparty_id: row.counterparty_id as number, name_id: id });
      }
      return row;
    }
    const reserved = this.pools.get(table)?.shift();
    const given = reserved === undefined ? values : { ...values, id: reserved };
    const result = await sql<Row>`INSERT INTO ${sql.table(table)} ${insertClause(toDbValues(table, given))} RETURNING *`.execute(
      this.trx,
    );
    const row = canonicalRow(table, result.rows[0]!);
    this.rows.set(rowKey(table, row.id as number), row);
    const op: Op = { op: 'insert', table, row };
    this.ops.push(op);
    if (table === 'counterparty_name') this.trackName(row, true);
    await syncDerived(this.trx, op, this.derived);
    return row;
  }

  /** Changes the given columns; records only the columns whose value really changes. */
  async update(table: StateTable, id: number, patch: Row): Promise<Row> {
    const current = await this.require(table, id);
    const next = canonicalPatch(table, patch);
    const before: Row = {};
    const after: Row = {};
    for (const [column, value] of Object.entries(next)) {
      if (deepEqual(current[column], value)) continue;
      before[column] = current[column];
      after[column] = value;
    }
    if (Object.keys(after).length === 0) return current;
    // A name's text or owner changes its derived keys: written at once (after the buffer).
    const immediate = table === 'counterparty_name' && ('name' in after || 'normalised' in after || 'counterparty_id' in after);
    if (this.buffer && immediate) await this.flush();
    if (this.buffer && !immediate) {
      const key = rowKey(table, id);
      const row = { ...current, ...after };
      this.rows.set(key, row);
      if (!(this.buffer.inserts.get(table) ?? []).includes(id)) {
        const pending = this.buffer.updates.get(key);
        this.buffer.updates.set(key, { table, id, after: { ...(pending?.after ?? {}), ...after } });
      }
      const refs: Row = {};
      for (const column of [...COUNTERPARTY_COLUMNS[table], ...MENTION_COLUMNS[table]]) refs[column] = current[column];
      this.ops.push({ op: 'update', table, id, before, after, refs });
      return row;
    }
    await sql`UPDATE ${sql.table(table)} SET ${setClause(toDbValues(table, after))} WHERE id = ${id}`.execute(this.trx);
    const row = { ...current, ...after };
    this.rows.set(rowKey(table, id), row);
    if (table === 'counterparty_name' && 'counterparty_id' in after) {
      this.trackName(current, false);
      this.trackName(row, true);
    }
    const refs: Row = {};
    for (const column of [...COUNTERPARTY_COLUMNS[table], ...MENTION_COLUMNS[table]]) refs[column] = current[column];
    const op: Op = { op: 'update', table, id, before, after, refs };
    this.ops.push(op);
    await syncDerived(this.trx, op, this.derived);
    return row;
  }

  async delete(table: StateTable, id: number): Promise<Row> {
    // Derived rows and the buffer's own rows may refer to it: write the buffer first.
    await this.flush();
    const current = await this.require(table, id);
    if (table === 'counterparty_name') this.trackName(current, false);
    const op: Op = { op: 'delete', table, row: current };
    // Derived rows go first: they reference the row being deleted.
    await syncDerived(this.trx, op, this.derived);
    await sql`DELETE FROM ${sql.table(table)} WHERE id = ${id}`.execute(this.trx);
    this.rows.delete(rowKey(table, id));
    this.ops.push(op);
    return current;
  }

  touched(): { counterpartyIds: number[]; mentionIds: number[] } {
    return touchedBy(this.ops);
  }
}

/** The counterparty and mention ids a list of ops touched (both before and after images count). */
export function touchedBy(ops: Op[]): { counterpartyIds: number[]; mentionIds: number[] } {
  const cps = new Set<number>();
  const mentions = new Set<number>();
  const collect = (table: StateTable, image: Row) => {
    for (const column of COUNTERPARTY_COLUMNS[table]) {
      const v = image[column];
      if (typeof v === 'number') cps.add(v);
    }
    for (const column of MENTION_COLUMNS[table]) {
      const v = image[column];
      if (typeof v === 'number') mentions.add(v);
    }
  };
  for (const op of ops) {
    if (op.op === 'update') {
      collect(op.table, { ...op.refs, id: op.id });
      collect(op.table, { id: op.id, ...op.before });
      collect(op.table, { id: op.id, ...op.after });
    } else {
      collect(op.table, op.row);
    }
  }
  const sorted = (s: Set<number>) => [...s].sort((a, b) => a - b);
  return { counterpartyIds: sorted(cps), mentionIds: sorted(mentions) };
}

/** Inserts many rows in one statement (canonical values: jsonb as JSON, timestamps as ISO text; every column named). */
async function insertRows(trx: Transaction<Database>, table: string, columns: string[], rows: Row[]): Promise<void> {
  const cols = sql.join(columns.map((c) => sql.ref(c)));
  await sql`INSERT INTO ${sql.table(table)} (${cols}) SELECT ${cols} FROM jsonb_populate_recordset(NULL::${sql.table(table)}, ${JSON.stringify(rows)}::jsonb)`.execute(
    trx,
  );
}

/** jsonb's key order: shorter keys first, then by bytes. */
function jsonbKeyOrder(a: string, b: string): number {
  const la = Buffer.byteLength(a);
  const lb = Buffer.byteLength(b);
  return la !== lb ? la - lb : Buffer.compare(Buffer.from(a), Buffer.from(b));
}

function asJsonb(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(asJsonb);
  if (value === null || typeof value !== 'object') return value;
  const out: Record<string, unknown> = {};
  for (const key of Object.keys(value).sort(jsonbKeyOrder)) out[key] = asJsonb((value as Record<string, unknown>)[key]);
  return out;
}

/**
 * The image a row's values have once stored and read back: jsonb columns as JSON text parsed again, with jsonb's
 * key order (so a buffered row's image is the one an immediate INSERT … RETURNING would have given).
 */
function jsonbImage(table: StateTable, values: Row): Row {
  const db = toDbValues(table, values);
  const out: Row = { ...values };
  for (const [column, value] of Object.entries(db)) {
    if (typeof value === 'string' && value !== values[column]) out[column] = asJsonb(JSON.parse(value));
  }
  return out;
}

export function insertClause(values: Row) {
  const columns = Object.keys(values).filter((c) => values[c] !== undefined);
  return sql`(${sql.join(columns.map((c) => sql.ref(c)))}) VALUES (${sql.join(columns.map((c) => values[c]))})`;
}

export function setClause(values: Row) {
  return sql.join(Object.keys(values).map((c) => sql`${sql.ref(c)} = ${values[c]}`));
}
