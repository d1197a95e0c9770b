/**
 * Kysely types of the register's own tables: our entities, the counterparties with their names, identifiers,
 * blocking keys and relations.
 */
import type { ColumnType, Generated } from 'kysely';
import type { CounterpartyStatus, IdentifierScheme, NameKind, OwnEntityNameKind, RelationType } from '../../resolvers/vocabulary.ts';
import type { Int8, GeneratedInt8, Timestamp, JsonDefault } from './column-types.ts';

export interface OwnEntityTable {
  id: GeneratedInt8;
  name: string;
  normalised: string;
  country: string | null;
  identifiers: JsonDefault<{ scheme: IdentifierScheme; value: string; label?: string }[]>;
  /** Its other names (a trading name, a former name), a set: no two with the same normalised name. */
  other_names: JsonDefault<OwnEntityOtherName[]>;
  created_at: Timestamp;
  removed_at: Timestamp | null;
}

export interface OwnEntityOtherName {
  name: string;
  kind: OwnEntityNameKind;
}

export interface CounterpartyTable {
  id: GeneratedInt8;
  canonical_name: string;
  kind: ColumnType<'organisation' | 'person' | 'unknown', 'organisation' | 'person' | 'unknown' | undefined>;
  jurisdiction: string | null;
  status: ColumnType<CounterpartyStatus, CounterpartyStatus | undefined>;
  merged_into: Int8 | null;
  /** Set when a person chose the canonical name: the canonical-value rules then keep it. */
  name_locked_by: string | null;
  version: Generated<number>;
  created_at: Timestamp;
  updated_at: Timestamp;
}

export interface CounterpartyNameTable {
  id: GeneratedInt8;
  counterparty_id: Int8;
  name: string;
  normalised: string;
  kind: NameKind;
  legal_form: string | null;
  seen_count: Generated<number>;
  /** Where the name was first seen. */
  source: string | null;
  mention_id: Int8 | null;
  contract_id: Int8 | null;
  confirmed_by: string | null;
  created_at: Timestamp;
}

export interface CounterpartyIdentifierTable {
  id: GeneratedInt8;
  counterparty_id: Int8;
  scheme: IdentifierScheme;
  value: string;
  label: string | null;
  strong: boolean;
  source: string | null;
  mention_id: Int8 | null;
  confirmed_by: string | null;
  created_at: Timestamp;
}

export interface BlockingKeyTable {
  key: string;
  counterparty_id: Int8;
  name_id: Int8;
}

/** Derived from counterparty_name (migrations/20261205180000_counterparty_name_analysis.ts): a name's stored analysis. */
export interface CounterpartyNameAnalysisTable {
  name_id: Int8;
  /** The NameAnalysis in its compact form (resolvers/analyse/compact-analysis.ts) as json (since 20261205210000). */
  analysis: unknown;
  analysis_version: number;
  /** The country it was analysed under: its counterparty's jurisdiction then. */
  country: string | null;
}

export type RelationOrigin = 'person' | 'strong_source' | 'sweep';

export interface CounterpartyRelationTable {
  id: GeneratedInt8;
  from_counterparty_id: Int8;
  to_counterparty_id: Int8;
  type: RelationType;
  /** successor_of: the date of succession (YYYY-MM-DD). */
  since: ColumnType<string | null, string | null | undefined, string | null>;
  origin: RelationOrigin;
  status: ColumnType<'proposed' | 'confirmed', 'proposed' | 'confirmed' | undefined>;
  evidence: JsonDefault<Record<string, unknown>>;
  created_by: string;
  created_at: Timestamp;
}
