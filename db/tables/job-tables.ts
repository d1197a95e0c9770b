/**
 * Kysely types of the tables of long work: ingest runs, jobs and the chunks and partitions of a partitioned job.
 */
import type { ColumnType } from 'kysely';
import type { GeneratedInt8, Timestamp, TimestampDefault, Json, JsonDefault } from './column-types.ts';

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
