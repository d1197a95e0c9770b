/**
 * The built-in match model. PROVISIONAL: hand-set starting values until the EM run on the ROR dev split replaces
 * them (docs/matching.md records the command and the figures).
 */
import type { MatchModel } from './matchModel.ts';

export const DEFAULT_MATCH_MODEL: MatchModel = {
  version: 1,
  features: {
    name: { levels: ['exact', 'very_high', 'high', 'medium', 'low', 'none'], m: [0.3, 0.3, 0.2, 0.1, 0.06, 0.04], u: [0.001, 0.004, 0.02, 0.075, 0.2, 0.7] },
    legalForm: { levels: ['same_family', 'compatible', 'conflicting', 'different_jurisdiction'], m: [0.8, 0.1, 0.05, 0.05], u: [0.4, 0.1, 0.3, 0.2] },
    jurisdiction: { levels: ['same', 'compatible', 'conflicting'], m: [0.9, 0.05, 0.05], u: [0.3, 0.05, 0.65] },
    acronym: { levels: ['initials', 'initials_with_stop_words', 'none'], m: [0.5, 0.2, 0.3], u: [0.01, 0.01, 0.98] },
    qualifier: { levels: ['same', 'different'], m: [0.9, 0.1], u: [0.3, 0.7] },
    sharedContact: { levels: ['shared', 'none_shared'], m: [0.5, 0.5], u: [0.01, 0.99] },
  },
  matchShare: 0.05,
  linkAt: 8,
  newAt: 0,
  provenance: { method: 'prior', pairs: 0, note: 'hand-set starting values (provisional)' },
};
