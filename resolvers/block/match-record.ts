/**
 * What blocking, scoring and clustering see of one name: its analysis plus the context that travels with it.
 * The register builds one per stored name; `evaluate` one per CSV row.
 */
import type { NameAnalysis } from '../analyse/index.ts';
import type { Identifier } from '../vocabulary.ts';

export interface MatchRecord {
  /** Unique within one batch / register: keys, pairs and clusters name records by it. */
  id: string;
  analysis: NameAnalysis;
  /** ISO 3166-1 alpha-2 or ISO 3166-2 of the entity, when known. */
  country?: string;
  identifiers?: readonly Identifier[];
}
