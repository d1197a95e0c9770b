/**
 * The column types the table types are written in (see db/types.ts).
 *
 * bigint ids: PGlite answers int8 as a JS number, `pg` as a string unless its int8 parser is set. The types say
 * `number`; db/queries normalise with Number() wherever an id is read, so both backends give the same values
 * (ids stay far below 2^53).
 */
import type { ColumnType } from 'kysely';

/** An int8 id: read as number (see header), written as number or string. */
export type Int8 = ColumnType<number, number | string | bigint, number | string | bigint>;
export type GeneratedInt8 = ColumnType<number, number | string | bigint | undefined, number | string | bigint>;
/** timestamptz: read as Date, written as Date or ISO string. */
export type Timestamp = ColumnType<Date, Date | string, Date | string>;
export type TimestampDefault = ColumnType<Date, Date | string | undefined, Date | string>;
/** jsonb: kysely passes objects through; written as JSON text or a value. */
export type Json<T = unknown> = ColumnType<T, T | string, T | string>;
export type JsonDefault<T = unknown> = ColumnType<T, T | string | undefined, T | string>;
