/**
 * What a ChangeSet holds of the rows it locked, inserted or changed: the latest canonical image of each, and for
 * some counterparties the complete list of their names (locked with ChangeSet.loadNames, or created here), so that
 * a batch adds sightings and chooses canonical names without reading them again.
 */
import { COUNTERPARTY_COLUMNS, type Row, type StateRow, type StateTable } from './tables.ts';

function rowKey(table: StateTable, id: number): string {
  return `${table}:${id}`;
}

export class RowCache {
  private readonly rows = new Map<string, Row>();
  /** Counterparty → ids of all its counterparty_name rows, for counterparties whose names are held completely. */
  private readonly names = new Map<number, Set<number>>();

  /** Rows are kept untyped; each is stored under its own table, which is what makes the answer's type hold. */
  get<T extends StateTable>(table: T, id: number): StateRow<T> | undefined {
    return this.rows.get(rowKey(table, id)) as StateRow<T> | undefined;
  }

  has(table: StateTable, id: number): boolean {
    return this.rows.has(rowKey(table, id));
  }

  set<T extends StateTable>(table: T, row: StateRow<T>): void {
    this.rows.set(rowKey(table, row.id), row);
  }

  /** Every row held of a table. */
  *rowsOf<T extends StateTable>(table: T): Iterable<StateRow<T>> {
    const prefix = `${table}:`;
    for (const [key, row] of this.rows) if (key.startsWith(prefix)) yield row as StateRow<T>;
  }

  delete(table: StateTable, id: number): void {
    this.rows.delete(rowKey(table, id));
  }

  holdsNamesOf(counterpartyId: number): boolean {
    return this.names.has(counterpartyId);
  }

  /** From now on the names of this counterparty are held completely (it was created here, or its names were read). */
  holdNamesOf(counterpartyId: number, nameIds: Iterable<number> = []): void {
    this.names.set(counterpartyId, new Set(nameIds));
  }

  /** All name rows of a counterparty whose names are held. */
  namesOf(counterpartyId: number): StateRow<'counterparty_name'>[] {
    return [...this.names.get(counterpartyId)!].map((id) => this.get('counterparty_name', id)!);
  }

  /** Keeps the held name lists in step with a name row that appears (present) or goes. */
  trackName(row: StateRow<'counterparty_name'>, present: boolean): void {
    const set = this.names.get(row.counterparty_id);
    if (!set) return;
    if (present) set.add(row.id);
    else set.delete(row.id);
  }

  /** Gives rows held under temporary ids their real ids. */
  rename(table: StateTable, map: ReadonlyMap<number, number>): void {
    for (const [temp, id] of map) {
      const row = this.get(table, temp);
      if (!row) continue;
      this.delete(table, temp);
      this.set(table, { ...row, id });
    }
    if (table !== 'counterparty_name') return;
    for (const set of this.names.values()) {
      for (const temp of [...set]) {
        if (!map.has(temp)) continue;
        set.delete(temp);
        set.add(map.get(temp)!);
      }
    }
  }

  /**
   * Gives a counterparty held under a temporary id its real id (drawn by the write: state/write-buffer.ts), in its
   * own row, in every held row that refers to it, and in the held name lists.
   */
  renameCounterparty(temp: number, id: number): void {
    for (const [key, row] of this.rows) {
      const table = key.slice(0, key.indexOf(':')) as StateTable;
      const columns = COUNTERPARTY_COLUMNS[table].filter((c) => row[c] === temp);
      if (columns.length === 0) continue;
      this.rows.delete(key);
      const renamed: Row = { ...row, ...Object.fromEntries(columns.map((c) => [c, id])) };
      this.rows.set(rowKey(table, renamed.id as number), renamed);
    }
    const names = this.names.get(temp);
    if (names) {
      this.names.delete(temp);
      this.names.set(id, names);
    }
  }
}
