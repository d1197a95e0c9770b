/**
 * Kysely types for every table of the schema (migrations/). Column names are snake_case as in SQL; services map
 * them to the camelCase JSON of the public interface.
 *
 * bigint ids: PGlite answers int8 as a JS number, `pg` as a string unless its int8 parser is set. The types say
 * `number`; db/queries normalise with Number() wherever an id is read, so both backends give the same values
 * (ids stay far below 2^53).
 */
import type { ColumnType, Generated, Insertable, Selectable, Updateable } from 'kysely';
import type { CounterpartyStatus, HistoryEventType, IdentifierScheme, NameKind, RelationType, ResolutionStatus, ApiScope } from '../resolvers/vocabulary.ts';

/** An int8 id: read as number (see header), written as number or string. */
export type Int8 = ColumnType<number, number | string | bigint, number | string | bigint>;
export type GeneratedInt8 = ColumnType<number, number | string | bigint | undefined, number | string | bigint>;
/** timestamptz: read as Date, written as Date or ISO string. */
export type Timestamp = ColumnType<Date, Date | string, Date | string>;
export type TimestampDefault = ColumnType<Date, Date | string | undefined, Date | string>;
/** jsonb: kysely passes objects through; written as JSON text or a value. */
export type Json<T = unknown> = ColumnType<T, T | string, T | string>;
export type JsonDefault<T = unknown> = ColumnType<T, T | string | undefined, T | string>;

export interface OwnEntityTable {
  id: GeneratedInt8;
  name: string;
  normalised: string;
  country: string | null;
  identifiers: JsonDefault<{ scheme: IdentifierScheme; value: string; label?: string }[]>;
  created_at: Timestamp;
  removed_at: Timestamp | null;
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

export interface ContractTable {
  id: GeneratedInt8;
  source: string;
  external_id: string;
  title: string | null;
  text: string;
  content_hash: string;
  parsed: JsonDefault<Record<string, unknown>>;
  status: ColumnType<'active' | 'withdrawn', 'active' | 'withdrawn' | undefined>;
  created_at: Timestamp;
  updated_at: Timestamp;
}

export interface DefinedTermTable {
  id: GeneratedInt8;
  contract_id: Int8;
  term: string;
  normalised: string;
  /** Index of the party the term binds (contract_party.position); null for a collective or unbound term. */
  party_index: number | null;
  collective: ColumnType<boolean, boolean | undefined>;
  evidence: JsonDefault<Record<string, unknown>>;
}

export interface MentionTable {
  id: GeneratedInt8;
  source: string;
  external_id: string;
  text: string;
  content_hash: string;
  contract_source: string | null;
  contract_external_id: string | null;
  contract_id: Int8 | null;
  role: string | null;
  country: string | null;
  address: string | null;
  identifiers: JsonDefault<{ scheme: IdentifierScheme; value: string; label?: string }[]>;
  status: ResolutionStatus;
  counterparty_id: Int8 | null;
  own_entity_id: Int8 | null;
  score: number | null;
  /** The explanation of its outcome (table explanation); null for a mention stored with its evidence inline. */
  explanation_id: ColumnType<number | null, number | null | undefined, number | null>;
  /** The mention's own keys (recorded names, conflicts); what a user reads is the explanation's body with these over it. */
  evidence: JsonDefault<Record<string, unknown>>;
  /** Set when a person confirmed the outcome: reresolve leaves the mention alone. */
  confirmed_by: string | null;
  created_at: Timestamp;
  updated_at: Timestamp;
}

/** The evidence of one decision, stored once and referenced (append-only, like the history it belongs to). */
export interface ExplanationTable {
  id: GeneratedInt8;
  body: JsonDefault<Record<string, unknown>>;
}

export interface ContractPartyTable {
  id: GeneratedInt8;
  contract_id: Int8;
  mention_id: Int8;
  position: number;
  role: string | null;
  terms: JsonDefault<string[]>;
}

export type ReviewKind = 'mention_link' | 'duplicate' | 'affiliate';
/** A reviewer's answer. `not_a_party` (mention items only): the mention names no party at all. */
export type ReviewDecision = 'same' | 'different' | 'not_a_party';
/** What a labelled pair says about two names; "not a party" answers are never labels. */
export type PairLabel = 'same' | 'different';

export interface ReviewItemTable {
  id: GeneratedInt8;
  kind: ReviewKind;
  mention_id: Int8 | null;
  left_counterparty_id: Int8 | null;
  right_counterparty_id: Int8;
  score: number | null;
  /** The explanation of the mention's outcome that filed it (mention items); sweep items keep their evidence inline. */
  explanation_id: ColumnType<number | null, number | null | undefined, number | null>;
  evidence: JsonDefault<Record<string, unknown>>;
  status: ColumnType<'open' | 'decided' | 'obsolete', 'open' | 'decided' | 'obsolete' | undefined>;
  decision: ReviewDecision | null;
  decided_by: string | null;
  decided_at: Timestamp | null;
  reason: string | null;
  created_at: Timestamp;
}

export interface CannotLinkTable {
  id: GeneratedInt8;
  counterparty_id: Int8;
  other_counterparty_id: Int8 | null;
  mention_id: Int8 | null;
  review_item_id: Int8 | null;
  created_by: string;
  reason: string | null;
  created_at: Timestamp;
}

export interface LabelledPairTable {
  id: GeneratedInt8;
  review_item_id: Int8 | null;
  left_text: string;
  right_text: string;
  label: PairLabel;
  features: JsonDefault<Record<string, unknown>>;
  decided_by: string;
  created_at: Timestamp;
}

export interface HistoryEventTable {
  id: GeneratedInt8;
  type: HistoryEventType;
  actor: string;
  at: Timestamp;
  reason: string | null;
  payload: Json<Record<string, unknown>>;
  counterparty_ids: ColumnType<number[], number[] | undefined, number[]>;
  mention_ids: ColumnType<number[], number[] | undefined, number[]>;
  undoes_event_id: Int8 | null;
  request_id: string | null;
}

export interface ApiKeyTable {
  id: string;
  label: string;
  scope: ApiScope;
  secret_hash: string;
  created_at: TimestampDefault;
  revoked_at: Timestamp | null;
  last_used_at: Timestamp | null;
}

export interface IdempotencyRecordTable {
  key_id: string;
  idempotency_key: string;
  method: string;
  path: string;
  body_hash: string;
  status_code: number | null;
  response: Json<unknown> | null;
  created_at: TimestampDefault;
  /** Set in the transaction that commits the request's work (migration 20261205000000). */
  work_committed_at: Timestamp | null;
}

export interface IngestRunTable {
  id: GeneratedInt8;
  source: string;
  input_name: string | null;
  actor: string;
  status: ColumnType<'running' | 'finished' | 'failed' | 'interrupted', 'running' | 'finished' | 'failed' | 'interrupted' | undefined>;
  counts: JsonDefault<Record<string, number>>;
  started_at: TimestampDefault;
  finished_at: Timestamp | null;
  error: string | null;
}

export interface JobTable {
  id: GeneratedInt8;
  kind: string;
  status: ColumnType<'queued' | 'running' | 'finished' | 'failed', 'queued' | 'running' | 'finished' | 'failed' | undefined>;
  actor: string;
  params: JsonDefault<Record<string, unknown>>;
  progress: JsonDefault<Record<string, unknown>>;
  result: Json<unknown> | null;
  error: string | null;
  created_at: TimestampDefault;
  updated_at: TimestampDefault;
  finished_at: Timestamp | null;
  /** What the planner of a partitioned job decided (services/jobs); null for a job run in one piece. */
  plan: Json<Record<string, unknown>> | null;
}

/** The staged input of a partitioned job, in chunks, until the planner has partitioned it. */
export interface JobChunkTable {
  job_id: number;
  chunk_no: number;
  rows: Json<unknown[]>;
}

/** One independently resolvable part of a partitioned job. */
export interface JobPartitionTable {
  job_id: number;
  partition_no: number;
  status: ColumnType<'queued' | 'running' | 'done', 'queued' | 'running' | 'done' | undefined>;
  size: number;
  items: Json<unknown[]>;
  result: Json<Record<string, unknown>> | null;
  attempts: ColumnType<number, number | undefined>;
  worker: string | null;
  started_at: Timestamp | null;
  finished_at: Timestamp | null;
}

export interface MatcherSettingsTable {
  id: 'current';
  link_at: number;
  new_at: number;
  weights: JsonDefault<Record<string, unknown>>;
  version: Generated<number>;
  updated_by: string;
  updated_at: TimestampDefault;
}

export interface Database {
  own_entity: OwnEntityTable;
  counterparty: CounterpartyTable;
  counterparty_name: CounterpartyNameTable;
  counterparty_identifier: CounterpartyIdentifierTable;
  blocking_key: BlockingKeyTable;
  counterparty_relation: CounterpartyRelationTable;
  contract: ContractTable;
  defined_term: DefinedTermTable;
  mention: MentionTable;
  contract_party: ContractPartyTable;
  review_item: ReviewItemTable;
  explanation: ExplanationTable;
  cannot_link: CannotLinkTable;
  labelled_pair: LabelledPairTable;
  history_event: HistoryEventTable;
  api_key: ApiKeyTable;
  idempotency_record: IdempotencyRecordTable;
  ingest_run: IngestRunTable;
  job: JobTable;
  job_chunk: JobChunkTable;
  job_partition: JobPartitionTable;
  matcher_settings: MatcherSettingsTable;
}

export type Counterparty = Selectable<CounterpartyTable>;
export type NewCounterparty = Insertable<CounterpartyTable>;
export type CounterpartyUpdate = Updateable<CounterpartyTable>;
export type CounterpartyName = Selectable<CounterpartyNameTable>;
export type CounterpartyIdentifier = Selectable<CounterpartyIdentifierTable>;
export type CounterpartyRelation = Selectable<CounterpartyRelationTable>;
export type Mention = Selectable<MentionTable>;
export type Contract = Selectable<ContractTable>;
export type ContractParty = Selectable<ContractPartyTable>;
export type DefinedTerm = Selectable<DefinedTermTable>;
export type ReviewItem = Selectable<ReviewItemTable>;
export type CannotLink = Selectable<CannotLinkTable>;
export type HistoryEvent = Selectable<HistoryEventTable>;
export type OwnEntity = Selectable<OwnEntityTable>;
export type ApiKey = Selectable<ApiKeyTable>;
export type IdempotencyRecord = Selectable<IdempotencyRecordTable>;
export type IngestRun = Selectable<IngestRunTable>;
export type Job = Selectable<JobTable>;
export type MatcherSettings = Selectable<MatcherSettingsTable>;
