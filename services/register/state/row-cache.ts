/**
 * What a ChangeSet holds of the rows it locked, inserted or changed: the latest canonical image of each, and for
 * some counterparties the complete list of their names (locked with ChangeSet.loadNames, or created here), so that
 * a batch adds sightings and chooses canonical names without reading them again.
 */
import type { Row, StateTable } from './tables.ts';

function rowKey(table: StateTable, id: number): string {
  return `${table}:${id}`;
}

export class RowCache {
  private readonly rows = new Map<string, Row>();
  /** Counterparty → ids of all its counterparty_name rows, for counterparties whose names are held completely. */
  private readonly names = new Map<number, Set<number>>();

  get(table: StateTable, id: number): Row | undefined {
    return this.rows.get(rowKey(table, id));
  }

  has(table: StateTable, id: number): boolean {
    return this.rows.has(rowKey(table, id));
  }

  set(table: StateTable, row: Row): void {
    this.rows.set(rowKey(table, row.id as number), row);
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
  namesOf(counterpartyId: number): Row[] {
    return [...this.names.get(counterpartyId)!].map((id) => this.get('counterparty_name', id)!);
  }

  /** Keeps the held name lists in step with a name row that appears (present) or goes. */
  trackName(row: Row, present: boolean): void {
    const set = this.names.get(row.counterparty_id as number);
    if (!set) return;
    if (present) set.add(row.id as number);
    else set.delete(row.id as number);
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
}
