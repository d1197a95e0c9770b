/**
 * What a ChangeSet read ahead for a chunk of mentions, one statement per kind (services/register/batch-write.ts):
 * the holders of their identifiers and the open review items of their stored mentions. Kept in step with the
 * ChangeSet's own writes, so that an answer from here is the one a read at that moment would give; a write this
 * cannot follow (an identifier row changed or deleted) drops what it knew, and the reader reads again.
 */
import type { Transaction } from 'kysely';
import type { Database } from '../../../db/types.ts';
import { holdersOf } from '../../../db/queries/identifiers.ts';
import { lockOpenItemsOfMentions } from '../../../db/queries/chunk-reads.ts';
import type { RowCache } from './row-cache.ts';
import { canonicalRow, type StateRow, type StateTable } from './tables.ts';

/** The key of an identifier: its scheme and value. */
export function identifierKey(identifier: { scheme: string; value: string }): string {
  return `${identifier.scheme}\u0000${identifier.value}`;
}

export class Prefetched {
  /** Counterparties holding each identifier read ahead: the stored ones, then those this ChangeSet added. */
  private holders = new Map<string, number[]>();
  /** Open review items of each stored mention read ahead (locked, their rows in the ChangeSet's cache). */
  private readonly openItems = new Map<number, number[]>();

  /**
   * Reads the holders of the identifiers not read yet in one statement and keeps them, with those of `unwritten`
   * (identifier rows in the ChangeSet's buffer, which the read does not see).
   */
  async readHolders(
    trx: Transaction<Database>,
    identifiers: readonly { scheme: string; value: string }[],
    unwritten: readonly StateRow<'counterparty_identifier'>[],
  ): Promise<void> {
    const todo = identifiers.filter((i) => !this.knowsHolders(i));
    if (todo.length === 0) return;
    const stored = await holdersOf(trx, [...todo]);
    const buffered = unwritten.map((r) => ({ counterpartyId: r.counterparty_id, scheme: r.scheme, value: r.value }));
    this.keepHolders(todo, [...stored, ...buffered]);
  }

  /**
   * Locks the open review items of these mentions in one statement (after the mentions: the lock order), puts the
   * rows the ChangeSet does not hold yet in its cache, and keeps which items each mention has open.
   */
  async readOpenItems(trx: Transaction<Database>, mentionIds: readonly number[], cache: RowCache): Promise<void> {
    if (mentionIds.length === 0) return;
    for (const row of (await lockOpenItemsOfMentions(trx, mentionIds)).map((r) => canonicalRow('review_item', r))) {
      if (!cache.has('review_item', row.id)) cache.set('review_item', row);
    }
    const wanted = new Set(mentionIds);
    const open = [...cache.rowsOf('review_item')].filter((r) => r.mention_id !== null && wanted.has(r.mention_id) && r.status === 'open');
    this.keepOpenItems(mentionIds, open);
  }

  /** Whether the holders of this identifier were read ahead. */
  knowsHolders(identifier: { scheme: string; value: string }): boolean {
    return this.holders.has(identifierKey(identifier));
  }

  /** Keeps the holders read for these identifiers (`rows`: every holder read, of these or others). */
  keepHolders(identifiers: readonly { scheme: string; value: string }[], rows: readonly { counterpartyId: number; scheme: string; value: string }[]): void {
    for (const i of identifiers) if (!this.holders.has(identifierKey(i))) this.holders.set(identifierKey(i), []);
    for (const r of rows) this.holders.get(identifierKey(r))?.push(r.counterpartyId);
  }

  /** The counterparties holding an identifier, when read ahead (in the order read, then added). */
  holdersOf(identifier: { scheme: string; value: string }): readonly number[] | undefined {
    return this.holders.get(identifierKey(identifier));
  }

  /** Keeps the open items read for these mentions. */
  keepOpenItems(mentionIds: readonly number[], items: readonly StateRow<'review_item'>[]): void {
    for (const m of mentionIds) if (!this.openItems.has(m)) this.openItems.set(m, []);
    for (const item of items) if (item.mention_id !== null) this.openItems.get(item.mention_id)?.push(item.id);
  }

  /** The ids of the items a mention had open when read ahead, and those opened here since; once (then read again). */
  takeOpenItems(mentionId: number): number[] | undefined {
    const items = this.openItems.get(mentionId);
    this.openItems.delete(mentionId);
    return items;
  }

  /** Follows a row the ChangeSet inserted. */
  inserted<T extends StateTable>(table: T, row: StateRow<T>): void {
    if (table === 'counterparty_identifier') {
      const r = row as StateRow<'counterparty_identifier'>;
      this.holders.get(identifierKey(r))?.push(r.counterparty_id);
    } else if (table === 'review_item') {
      const r = row as StateRow<'review_item'>;
      if (r.mention_id !== null && r.status === 'open') this.openItems.get(r.mention_id)?.push(r.id);
    }
  }

  /** Follows a row the ChangeSet changed or deleted: an identifier's holders are read again from now on. */
  changed(table: StateTable): void {
    if (table === 'counterparty_identifier') this.holders = new Map();
  }
}
