/**
 * The ids of the rows a ChangeSet adds. Ids drawn beforehand (`reserveIds`, one statement for a whole chunk) are
 * taken in order, per table. Names and history events with none reserved get a temporary id instead: how many a
 * batch adds is not known beforehand, so the flush draws their real ids in one statement (state/write-buffer.ts)
 * and this keeps the real id of each temporary one, for the writer that answers it (`realId`). A new counterparty
 * whose id alone would cost a statement (a single resolve that locks no row) gets a temporary id too, and the write
 * itself draws its real one (state/write-buffer.ts).
 */
import type { StateTable } from './tables.ts';

/** Tables whose ids a ChangeSet draws beforehand: the state tables and the history (events, explanations). */
export type IdTable = StateTable | 'history_event' | 'explanation';

/** Temporary ids sit above every real id, in the order the rows were made, so that comparing ids before and after
 * the flush gives the same answer. */
export const TEMP_ID_BASE = 2 ** 52;

export function isTemporaryId(id: number): boolean {
  return id >= TEMP_ID_BASE;
}

export class IdPools {
  /** Ids reserved for new rows, per table, taken in order. */
  private readonly pools = new Map<IdTable, number[]>();
  private nextTemp = TEMP_ID_BASE;
  /** Real ids of temporary ids already written. */
  private readonly realIds = new Map<number, number>();

  /** Keeps ids drawn for a table (in ascending order) after those already reserved. */
  add(drawn: ReadonlyMap<IdTable, readonly number[]>): void {
    for (const [table, ids] of drawn) this.pools.set(table, [...(this.pools.get(table) ?? []), ...ids]);
  }

  /**
   * How many ids each table still lacks for `counts` new rows: ids held already (a single resolve's, drawn with its
   * first statement: ChangeSet.keepIds) are not drawn again.
   */
  lacking(counts: Partial<Record<IdTable, number>>): Map<IdTable, number> {
    return new Map((Object.entries(counts) as [IdTable, number][]).map(([t, n]) => [t, Math.max(0, n - this.held(t))] as const));
  }

  /** How many reserved ids of a table are left. */
  held(table: IdTable): number {
    return this.pools.get(table)?.length ?? 0;
  }

  /** The next reserved id of a table, if any is left. */
  take(table: IdTable): number | undefined {
    return this.pools.get(table)?.shift();
  }

  /** The next reserved id of a table, else a temporary one (drawn for real at the flush). */
  takeOrTemporary(table: IdTable): number {
    return this.take(table) ?? this.nextTemp++;
  }

  /** Records the real ids a flush drew for temporary ones. */
  written(map: ReadonlyMap<number, number>): void {
    for (const [temp, id] of map) this.realIds.set(temp, id);
  }

  /** The real id of a temporary id once it is written (any other id as it is). */
  realId(id: number): number {
    return this.realIds.get(id) ?? id;
  }
}

/**
 * Refuses an answer that still holds a temporary id (a writer answered a name's or an event's id without writing
 * the buffer first and asking for its real id): a defect, said loudly rather than answered as a wrong id.
 */
export function assertNoTemporaryIds(answer: unknown, path = 'answer'): void {
  if (typeof answer === 'number') {
    if (isTemporaryId(answer)) throw new Error(`${path} holds the temporary id ${answer}: write the buffer and answer ChangeSet.realId (a defect)`);
    return;
  }
  if (answer === null || typeof answer !== 'object' || answer instanceof Date || ArrayBuffer.isView(answer)) return;
  if (Array.isArray(answer)) answer.forEach((v, i) => assertNoTemporaryIds(v, `${path}/${i}`));
  else for (const [key, v] of Object.entries(answer)) assertNoTemporaryIds(v, `${path}/${key}`);
}
