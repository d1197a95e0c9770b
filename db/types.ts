/**
 * Kysely types for every table of the schema (migrations/). Column names are snake_case as in SQL; services map
 * them to the camelCase JSON of the public interface. The table types are written by table group in db/tables/
 * (column types such as Int8 in db/tables/column-types.ts); this module gathers them in the `Database` interface
 * and re-exports them, so that importers name one module.
 */
import type { Insertable, Selectable, Updateable } from 'kysely';
import type {
  OwnEntityTable,
  CounterpartyTable,
  CounterpartyNameTable,
  CounterpartyIdentifierTable,
  BlockingKeyTable,
  CounterpartyNameAnalysisTable,
  CounterpartyRelationTable,
} from './tables/register-tables.ts';
import type { ContractTable, DefinedTermTable, MentionTable, ExplanationTable, ContractPartyTable } from './tables/contract-tables.ts';
import type { ReviewItemTable, CannotLinkTable, LabelledPairTable } from './tables/review-tables.ts';
import type { HistoryEventTable, ApiKeyTable, IdempotencyRecordTable } from './tables/access-tables.ts';
import type { IngestRunTable, JobTable, JobChunkTable, JobPartitionTable } from './tables/job-tables.ts';
import type { MatcherSettingsTable } from './tables/matcher-settings-table.ts';

export type * from './tables/column-types.ts';
export type * from './tables/register-tables.ts';
export type * from './tables/contract-tables.ts';
export type * from './tables/review-tables.ts';
export type * from './tables/access-tables.ts';
export type * from './tables/job-tables.ts';
export type * from './tables/matcher-settings-table.ts';

export interface Database {
  own_entity: OwnEntityTable;
  counterparty: CounterpartyTable;
  counterparty_name: CounterpartyNameTable;
  counterparty_identifier: CounterpartyIdentifierTable;
  blocking_key: BlockingKeyTable;
  counterparty_name_analysis: CounterpartyNameAnalysisTable;
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
