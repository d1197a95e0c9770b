/**
 * Kysely types of the tables of people's decisions: review items, cannot-link constraints and the labelled pairs
 * they leave, with the vocabulary of review answers.
 */
import type { ColumnType } from 'kysely';
import type { Int8, GeneratedInt8, Timestamp, JsonDefault } from './column-types.ts';

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
