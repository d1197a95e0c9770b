/**
 * The register's state tables and how their rows are written into history payloads.
 *
 * Every change to these tables goes through a ChangeSet (change-set.ts), which records row images in the
 * history event. A row image is "canonical": int8 as number, timestamps as ISO strings, jsonb as parsed JSON.
 * Both backends read back the same canonical row, so images compare with plain deep equality and a replay or
 * an undo writes back exactly what was there.
 */
import type { Selectable } from 'kysely';
import type { Database } from '../../../db/types.ts';

export const STATE_TABLES = [
  'own_entity',
  'counterparty',
  'counterparty_name',
  'counterparty_identifier',
  'counterparty_relation',
  'contract',
  'defined_term',
  'mention',
  'contract_party',
  'review_item',
  'cannot_link',
  'labelled_pair',
] as const;
export type StateTable = (typeof STATE_TABLES)[number];

export type ColumnKind = 'int8' | 'int' | 'num' | 'text' | 'bool' | 'ts' | 'json';

const COLUMN_KINDS = {
  own_entity: {
    id: 'int8',
    name: 'text',
    normalised: 'text',
    country: 'text',
    identifiers: 'json',
    other_names: 'json',
    created_at: 'ts',
    removed_at: 'ts',
  },
  counterparty: {
    id: 'int8',
    canonical_name: 'text',
    kind: 'text',
    jurisdiction: 'text',
    status: 'text',
    merged_into: 'int8',
    name_locked_by: 'text',
    version: 'int',
    created_at: 'ts',
    updated_at: 'ts',
  },
  counterparty_name: {
    id: 'int8',
    counterparty_id: 'int8',
    name: 'text',
    normalised: 'text',
    kind: 'text',
    legal_form: 'text',
    seen_count: 'int',
    source: 'text',
    mention_id: 'int8',
    contract_id: 'int8',
    confirmed_by: 'text',
    created_at: 'ts',
  },
  counterparty_identifier: {
    id: 'int8',
    counterparty_id: 'int8',
    scheme: 'text',
    value: 'text',
    label: 'text',
    strong: 'bool',
    source: 'text',
    mention_id: 'int8',
    confirmed_by: 'text',
    created_at: 'ts',
  },
  counterparty_relation: {
    id: 'int8',
    from_counterparty_id: 'int8',
    to_counterparty_id: 'int8',
    type: 'text',
    since: 'text',
    origin: 'text',
    status: 'text',
    evidence: 'json',
    created_by: 'text',
    created_at: 'ts',
  },
  contract: {
    id: 'int8',
    source: 'text',
    external_id: 'text',
    title: 'text',
    text: 'text',
    content_hash: 'text',
    parsed: 'json',
    status: 'text',
    created_at: 'ts',
    updated_at: 'ts',
  },
  defined_term: {
    id: 'int8',
    contract_id: 'int8',
    term: 'text',
    normalised: 'text',
    party_index: 'int',
    collective: 'bool',
    evidence: 'json',
  },
  mention: {
    id: 'int8',
    source: 'text',
    external_id: 'text',
    text: 'text',
    content_hash: 'text',
    contract_source: 'text',
    contract_external_id: 'text',
    contract_id: 'int8',
    role: 'text',
    country: 'text',
    address: 'text',
    identifiers: 'json',
    status: 'text',
    counterparty_id: 'int8',
    own_entity_id: 'int8',
    score: 'num',
    explanation_id: 'int8',
    evidence: 'json',
    confirmed_by: 'text',
    created_at: 'ts',
    updated_at: 'ts',
  },
  contract_party: {
    id: 'int8',
    contract_id: 'int8',
    mention_id: 'int8',
    position: 'int',
    role: 'text',
    terms: 'json',
  },
  review_item: {
    id: 'int8',
    kind: 'text',
    mention_id: 'int8',
    left_counterparty_id: 'int8',
    right_counterparty_id: 'int8',
    score: 'num',
    explanation_id: 'int8',
    evidence: 'json',
    status: 'text',
    decision: 'text',
    decided_by: 'text',
    decided_at: 'ts',
    reason: 'text',
    created_at: 'ts',
  },
  cannot_link: {
    id: 'int8',
    counterparty_id: 'int8',
    other_counterparty_id: 'int8',
    mention_id: 'int8',
    review_item_id: 'int8',
    created_by: 'text',
    reason: 'text',
    created_at: 'ts',
  },
  labelled_pair: {
    id: 'int8',
    review_item_id: 'int8',
    left_text: 'text',
    right_text: 'text',
    label: 'text',
    features: 'json',
    decided_by: 'text',
    created_at: 'ts',
  },
} as const satisfies Record<StateTable, Record<string, ColumnKind>>;
const COLUMNS: Record<StateTable, Readonly<Record<string, ColumnKind>>> = COLUMN_KINDS;

/** The columns of a state table with their kinds, as a type: tests/services/register/state/row-types.test.ts checks them against StateRow. */
export type StateColumns<T extends StateTable> = (typeof COLUMN_KINDS)[T];

/** Columns whose value is a counterparty id: an event touching such a row touches that counterparty. */
export const COUNTERPARTY_COLUMNS: Record<StateTable, string[]> = {
  own_entity: [],
  counterparty: ['id', 'merged_into'],
  counterparty_name: ['counterparty_id'],
  counterparty_identifier: ['counterparty_id'],
  counterparty_relation: ['from_counterparty_id', 'to_counterparty_id'],
  contract: [],
  defined_term: [],
  mention: ['counterparty_id'],
  contract_party: [],
  review_item: ['left_counterparty_id', 'right_counterparty_id'],
  cannot_link: ['counterparty_id', 'other_counterparty_id'],
  labelled_pair: [],
};

/** Columns whose value is a mention id. */
export const MENTION_COLUMNS: Record<StateTable, string[]> = {
  own_entity: [],
  counterparty: [],
  counterparty_name: [],
  counterparty_identifier: [],
  counterparty_relation: [],
  contract: [],
  defined_term: [],
  mention: ['id'],
  contract_party: ['mention_id'],
  review_item: ['mention_id'],
  cannot_link: ['mention_id'],
  labelled_pair: [],
};

export type Row = Record<string, unknown>;

/** A column's canonical value (see header): kysely reads timestamptz as a Date, an image keeps its ISO text. */
type Canonical<V> = V extends Date ? string : V;

/**
 * The canonical image of a row of one state table, derived from its kysely table type (db/types.ts);
 * tests/services/register/state/row-types.test.ts ties it to the column kinds above.
 */
export type StateRow<T extends StateTable> = { [K in keyof Selectable<Database[T]>]: Canonical<Selectable<Database[T]>[K]> } & {
  /** Every state table has an int8 id; said again so that code generic in the table can read it. */
  id: number;
};

/** Values given to an insert or an update: some columns of the image. */
export type StateValues<T extends StateTable> = Partial<StateRow<T>>;

export function columnsOf(table: StateTable): string[] {
  return Object.keys(COLUMNS[table]);
}

export function columnKindsOf(table: StateTable): Readonly<Record<string, ColumnKind>> {
  return COLUMNS[table];
}

function canonicalValue(kind: ColumnKind, value: unknown): unknown {
  if (value === null || value === undefined) return null;
  switch (kind) {
    case 'int8':
    case 'int':
    case 'num':
      return typeof value === 'number' ? value : Number(value);
    case 'ts':
      return value instanceof Date ? value.toISOString() : new Date(String(value)).toISOString();
    case 'json':
      return typeof value === 'string' ? JSON.parse(value) : value;
    case 'bool':
      return Boolean(value);
    default:
      return String(value);
  }
}

/**
 * The canonical image of a row as read from either backend. The one place a Row becomes a StateRow: every column
 * of COLUMNS[table] is set, which the row-type test ties to the kysely table type.
 */
export function canonicalRow<T extends StateTable>(table: T, row: Row): StateRow<T> {
  const out: Row = {};
  for (const [column, kind] of Object.entries(COLUMNS[table])) out[column] = canonicalValue(kind, row[column]);
  return out as StateRow<T>;
}

/** Canonical values of some columns only (an update's before/after). */
export function canonicalPatch(table: StateTable, patch: Row): Row {
  const out: Row = {};
  const kinds = COLUMNS[table];
  for (const [column, value] of Object.entries(patch)) {
    const kind = kinds[column];
    if (!kind) throw new Error(`${table}.${column} is not a column of a register state table`);
    out[column] = canonicalValue(kind, value);
  }
  return out;
}

/** Values ready for a kysely insert/update: jsonb as JSON text (pg would turn a JS array into a SQL array). */
export function toDbValues(table: StateTable, values: Row): Row {
  const kinds = COLUMNS[table];
  const out: Row = {};
  for (const [column, value] of Object.entries(values)) {
    const kind = kinds[column];
    if (!kind) throw new Error(`${table}.${column} is not a column of a register state table`);
    out[column] = kind === 'json' && value !== null && value !== undefined ? JSON.stringify(value) : value;
  }
  return out;
}
