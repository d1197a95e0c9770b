/**
 * The mix of the scale generator: how many variants per entity, of which kinds, and how often a new entity imitates
 * the one before it. The default is documented in docs/generator.md; keep the two in step.
 */
import type { VariantKind } from './corrupt.ts';
import type { HardNegativeKind } from './hard-negatives.ts';

export interface NameMix {
  /** Probability of 0, 1, 2… variants per entity (index = number of variants). Sums to 1. */
  variantsPerEntity: readonly number[];
  /** Probability of each corruption kind for a variant. Sums to 1. */
  kinds: Readonly<Record<VariantKind, number>>;
  /** Probability that a variant gets a second, different corruption on top of the first. */
  secondCorruption: number;
  /** Probability that a new entity is a sibling: same name words, other legal form or jurisdiction. */
  sibling: number;
  /**
   * Probability that a new entity is a hard negative of each kind, imitating the entity before it: another
   * activity word of the same coined word, a numbered series member, a place-qualified subsidiary, a branch.
   */
  hardNegatives: Readonly<Record<HardNegativeKind, number>>;
  /** Probability that a numbered series member is followed by the next number of the same series. */
  seriesContinues: number;
  /** Rows held back and emitted in random order, so that variants do not follow their original. */
  shuffleWindow: number;
}

/** The documented default mix (docs/generator.md). */
export const DEFAULT_MIX: NameMix = {
  variantsPerEntity: [0.3, 0.25, 0.2, 0.13, 0.07, 0.05],
  kinds: {
    legal_form: 0.2,
    punctuation: 0.08,
    case: 0.08,
    keyboard_typo: 0.18,
    ocr: 0.06,
    phonetic: 0.08,
    abbreviation: 0.1,
    token_drop: 0.1,
    token_swap: 0.05,
    whitespace: 0.05,
    diacritics: 0.02,
  },
  secondCorruption: 0.2,
  sibling: 0.03,
  hardNegatives: { activity: 0.035, series: 0.025, place: 0.03, branch: 0.03 },
  seriesContinues: 0.3,
  shuffleWindow: 4096,
};
