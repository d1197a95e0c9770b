/**
 * The analysis of one name string: the contract between resolvers/analyse and every later stage.
 */
import type { AliasKind, EntityKind, PartyStatus, RelationType } from '../vocabulary.ts';
import type { NameAlternative } from './alternative-names.ts';
import type { PartyReason } from './party-filter.ts';

export interface LegalFormMatch {
  /** The designator as it stands in the input ("Pty. Ltd.", "GmbH"). */
  text: string;
  /** Equivalence family used for matching: "ltd" for Ltd ≡ Limited, "inc" for Inc ≡ Incorporated, … */
  family: string;
  /** Every ISO 20275 ELF code the designator can stand for (narrowed by a country hint). */
  elfCodes: string[];
  /** Their jurisdictions: ISO 3166-1 alpha-2 or ISO 3166-2 codes. */
  jurisdictions: string[];
}

export interface NameAnalysis {
  input: string;
  /** Folded for comparison: NFKC, case-folded, diacritics folded, punctuation unified, "&" → "and". */
  normalised: string;
  /** The normalised name without legal form and qualifiers: what comparators compare. */
  core: string;
  /** Tokens of `core`. */
  tokens: string[];
  legalForm: LegalFormMatch | null;
  /** Parenthesised place or country qualifiers: "Goldline (Europe) Ltd" → ["europe"]. */
  qualifiers: string[];
  aliases: { kind: AliasKind; name: string }[];
  /** Other spellings matching also tries: the aliases that name the same party, a Latin transliteration. */
  alternatives: NameAlternative[];
  related: { relation: RelationType; name: string }[];
  partyStatus: PartyStatus;
  /** Present when partyStatus is not `party`: why ("place", "document", "role_word", "pronoun", …). */
  partyReason?: PartyReason;
  kind: EntityKind;
}

export interface AnalyseHints {
  /** ISO 3166-1 alpha-2 or ISO 3166-2: narrows the legal-form codes ("SA" in FR vs CH). */
  country?: string;
  /** Internal: analyse an alias without looking for its own alternatives. */
  noAlternatives?: boolean;
}
