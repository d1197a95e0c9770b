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
        0.0196582,
        0.155316,
        0.032438,
        0.0205637,
        0.0226348,
        0.0334485,
        0.0376314,
        0.0428591,
        0.0601363
      ],
      "u": [
        0.00111073,
        0.00158319,
        0.0000549628,
        0.000258173,
        0.000108369,
        0.00475067,
        0.00116634,
        0.00322168,
        0.00214779,
        0.00358021,
        0.0244982,
        0.233714,
        0.723806
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
        0.666732,
        0.0731373,
        0.260131
      ],
      "u": [
        0.787026,
        0.203903,
        0.00907168
      ]
    }
  },
  "matchShare": 0.026057944242573544,
  "linkAt": 8.4727,
  "newAt": 6.4727,
  "provenance": {
    "method": "labelled",
    "pairs": 1345564,
    "note": "labelled candidate pairs, m and u counted per dataset (add-one smoothing) and averaged: LEI dev 421876 pairs (678 true); ROR dev companies 361726 pairs (13660 true); generated (20000 names, seed 7) 561962 pairs (21806 true); linkAt: lowest threshold whose clusters have pairwise precision >= 0.99 in every dataset; newAt: lowest score with >= 0.5 true matches among review pairs in every dataset; rebuild: node bin/run-ts.js scripts/build-model.ts; linkAt per dataset: LEI dev 8.473, ROR dev companies 7.107, generated (20000 names, seed 7) 7.396; newAt per dataset: LEI dev 7.107, ROR dev companies -1.107, generated (20000 names, seed 7) 0.258; newAt at most linkAt - 2"
  }
};
