/**
 * What every register function receives: the database and pure helpers. Nothing here holds state between
 * requests that another instance would need (settings, keys and history are read from the database each time),
 * so several instances over one PostgreSQL give the same answers.
 */
import type { Kysely } from 'kysely';
import type { Database } from '../../db/types.ts';
import type { DerivedContext } from './state/derived.ts';
import { nameBlockingKeys } from './matching/keys.ts';
import { storedAnalysisOf } from './matching/analysis.ts';
import type { MatchStats } from './matching/match-stats.ts';

export interface RegisterContext {
  db: Kysely<Database>;
  derived: DerivedContext;
  /** The clock (tests may pin it). */
  now(): Date;
  /** Counts of candidate scoring, kept only when given (benchmarks, tests; no decision reads them). */
  stats?: MatchStats;
}

export interface ActorInput {
  /** Who: the API key's label, `cli:<os user>`, or `system:<job>`. */
  actor: string;
  reason?: string;
  requestId?: string;
}

export function createRegisterContext(db: Kysely<Database>, options: { now?: () => Date; stats?: MatchStats } = {}): RegisterContext {
  return {
    db,
    derived: { nameKeys: nameBlockingKeys, nameAnalysis: storedAnalysisOf },
    now: options.now ?? (() => new Date()),
    ...(options.stats ? { stats: options.stats } : {}),
  };
}
