/**
 * Kysely type of the matcher's settings: one row, the current thresholds and weights.
 */
import type { Generated } from 'kysely';
import type { TimestampDefault, JsonDefault } from './column-types.ts';

export interface MatcherSettingsTable {
  id: 'current';
  link_at: number;
  new_at: number;
  weights: JsonDefault<Record<string, unknown>>;
  version: Generated<number>;
  updated_by: string;
  updated_at: TimestampDefault;
}
