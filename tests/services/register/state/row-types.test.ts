/**
 * The row types of the register's state tables (StateRow, derived from the kysely table types of db/types.ts) and
 * the column kinds that write and read every row image (services/register/state/tables.ts) describe the same columns,
 * each of a kind its type allows (issue 21 item 3: columns were described twice with no test tying them).
 * tables-schema.test.ts ties the kinds to the migrated database; this ties them to the types.
 *
 * The check is made by the compiler: `npm run check` (tsc) fails on a disagreement and names the table and the
 * columns; vitest runs the same file and checks the one runtime fact the types rest on (canonicalRow sets every
 * listed column).
 */
import type { Selectable } from 'kysely';
import { expect, expectTypeOf, it } from 'vitest';
import type { Database } from '../../../../db/types.ts';
import { STATE_TABLES, canonicalRow, columnsOf, type StateColumns, type StateRow, type StateTable } from '../../../../services/register/state/tables.ts';

/** A column as kysely reads it (timestamps still Dates, so that they can be told from text). */
type Read<T extends StateTable> = Selectable<Database[T]>;

/** The kinds a column read as V may be listed with. */
type KindsFor<V> = [NonNullable<V>] extends [Date]
  ? 'ts'
  : [NonNullable<V>] extends [boolean]
    ? 'bool'
    : [NonNullable<V>] extends [number]
      ? 'int8' | 'int' | 'num'
      : [NonNullable<V>] extends [string]
        ? 'text'
        : 'json';

/** Columns of the type whose listed kind its type does not allow (or that are not listed at all). */
type KindMismatches<T extends StateTable> = {
  [K in keyof Read<T>]: K extends keyof StateColumns<T> ? (StateColumns<T>[K] extends KindsFor<Read<T>[K]> ? never : K) : K;
}[keyof Read<T>];

/** Per table, every column the two descriptions disagree on. */
type Disagreements = {
  [T in StateTable]: Exclude<keyof StateColumns<T>, keyof StateRow<T>> | Exclude<keyof StateRow<T>, keyof StateColumns<T>> | KindMismatches<T>;
};

it('lists the same columns as the row types, each of a kind its type allows (checked by tsc)', () => {
  expectTypeOf<Disagreements>().toEqualTypeOf<{ [T in StateTable]: never }>();
  expectTypeOf<StateRow<'counterparty'>['created_at']>().toEqualTypeOf<string>();
  expectTypeOf<StateRow<'review_item'>['decided_at']>().toEqualTypeOf<string | null>();
  expectTypeOf<StateRow<'mention'>['counterparty_id']>().toEqualTypeOf<number | null>();
});

it('canonicalRow sets every listed column, so a StateRow has each of its columns', () => {
  for (const table of STATE_TABLES) expect(Object.keys(canonicalRow(table, {})), table).toEqual(columnsOf(table));
});
