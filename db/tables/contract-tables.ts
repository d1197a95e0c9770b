/**
 * Kysely types of the tables of what comes in: contracts, their defined terms and parties, the mentions of parties and
 * the explanations of their outcomes.
 */
import type { ColumnType } from 'kysely';
import type { IdentifierScheme, ResolutionStatus } from '../../resolvers/vocabulary.ts';
import type { ParsedContract } from '../../resolvers/terms/index.ts';
import type { Int8, GeneratedInt8, Timestamp, JsonDefault } from './column-types.ts';

export interface ContractTable {
  id: GeneratedInt8;
  source: string;
  external_id: string;
  title: string | null;
  text: string;
  content_hash: string;
  /** The parties parsed from the text (resolvers/terms), as stored when the contract was last written. */
  parsed: JsonDefault<ParsedContract>;
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
