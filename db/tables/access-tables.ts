/**
 * Kysely types of the tables of who did what through the API: the history of events, API keys and idempotency
 * records.
 */
import type { ColumnType } from 'kysely';
import type { HistoryEventType, ApiScope } from '../../resolvers/vocabulary.ts';
import type { Int8, GeneratedInt8, Timestamp, TimestampDefault, Json } from './column-types.ts';

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
