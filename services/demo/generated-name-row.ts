/**
 * One row of the scale generator's output (generate-names.ts): a name, its entity (the ground truth) and how it came
 * about, with the ways a sibling entity differs from the one it imitates.
 */
import { HARD_NEGATIVE_KINDS } from './hard-negatives.ts';

export interface GeneratedNameRow {
  /** Shared by every variant of one invented organisation (the ground truth). */
  entityId: string;
  name: string;
  /** ISO 3166-1 alpha-2, or ISO 3166-2 for US states ("US-DE"). */
  country: string;
  /** "original", one VariantKind, or two joined by "+" ("keyboard_typo+case"). */
  variantKind: string;
  /**
   * For an original that imitates another entity (a sibling: another legal form or jurisdiction, another
   * activity word, a series number, a place qualifier, a branch): that entity's id.
   */
  siblingOf?: string;
  /** How a sibling's original differs from the entity it imitates. Not written to the CSV. */
  siblingKind?: SiblingKind;
}

/** The ways a sibling differs from the entity it imitates (docs/generator.md). */
export const SIBLING_KINDS = ['legal_form', 'jurisdiction', ...HARD_NEGATIVE_KINDS] as const;
export type SiblingKind = (typeof SIBLING_KINDS)[number];
