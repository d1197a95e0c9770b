/**
 * The built-in match model, made by scripts/build-model.ts from labelled company-name data (docs/matching.md →
 * 'Model'); rebuild with: node bin/run-ts.js scripts/build-model.ts
 */
import type { MatchModel } from './match-model.ts';

export const DEFAULT_MATCH_MODEL: MatchModel = {
  "version": 1,
  "features": {
    "name": {
      "levels": [
        "exact",
        "exact_weak",
        "near_exact",
        "typo",
        "abbreviation",
        "extra_words",
        "extra_activity",
        "extra_place",
        "very_high",
        "high",
        "medium",
        "low",
        "none"
      ],
      "m": [
        0.420708,
        0.0111088,
        0.0310347,
        0.112463,
        0.019417,
        0.15476,
        0.0323649,
        0.0200814,
        0.0229033,
        0.0335522,
        0.0386115,
        0.0428591,
        0.0601363
      ],
      "u": [
        0.00111073,
        0.00158319,
        0.0000549628,
        0.000258173,
        0.0000991653,
        0.00458973,
        0.00115314,
        0.00319619,
        0.00214858,
        0.00359205,
        0.0245575,
        0.233749,
        0.723908
      ]
    },
    "legalForm": {
      "levels": [
        "same_family",
        "compatible",
        "conflicting",
        "different_jurisdiction"
      ],
      "m": [
        0.934651,
        0.0310278,
        0.0114427,
        0.0228783
      ],
      "u": [
        0.439007,
        0.109842,
        0.101126,
        0.350025
      ]
    },
    "jurisdiction": {
      "levels": [
        "same",
        "compatible",
        "conflicting"
      ],
      "m": [
        0.998942,
        0.000529157,
        0.000529157
      ],
      "u": [
        0.50655,
        0.000529157,
        0.492921
      ]
    },
    "acronym": {
      "levels": [
        "initials",
        "initials_with_stop_words",
        "none"
      ],
      "m": [
        0.285179,
        0.0381379,
        0.676683
      ],
      "u": [
        0.262048,
        0.000466212,
        0.737486
      ]
    },
    "qualifier": {
      "levels": [
        "same",
        "different"
      ],
      "m": [
        0.953055,
        0.0469448
      ],
      "u": [
        0.202252,
        0.797748
      ]
    },
    "sharedContact": {
      "levels": [
        "shared",
        "none_shared"
      ],
      "m": [
        0.5,
        0.5
      ],
      "u": [
        0.01,
        0.99
      ]
    },
    "distinct": {
      "levels": [
        "number",
        "branch",
        "activity"
      ],
      "m": [
        0.660027,
        0.0748614,
        0.265112
      ],
      "u": [
        0.78783,
        0.203572,
        0.0085979
      ]
    }
  },
  "matchShare": 0.026057944242573544,
  "linkAt": 8.583,
  "newAt": 7.51981,
  "provenance": {
    "method": "labelled",
    "pairs": 1345564,
    "note": "labelled candidate pairs, m and u counted per dataset (add-one smoothing) and averaged: LEI dev 421876 pairs (678 true); ROR dev companies 361726 pairs (13660 true); generated (20000 names, seed 7) 561962 pairs (21806 true); linkAt: lowest threshold whose clusters have pairwise precision >= 0.99 in every dataset; newAt: lowest score with >= 0.5 true matches among review pairs in every dataset; rebuild: node bin/run-ts.js scripts/build-model.ts; linkAt per dataset: LEI dev 8.583, ROR dev companies 7.711, generated (20000 names, seed 7) 7.396; newAt per dataset: LEI dev 7.520, ROR dev companies -1.107, generated (20000 names, seed 7) 0.258; newAt at most linkAt - 1"
  }
};
