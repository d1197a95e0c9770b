/**
 * The built-in match model, made by scripts/build-model.ts from labelled company-name data (docs/matching.md →
 * 'Model'); rebuild with: node bin/run-ts.js scripts/build-model.ts
 */
import type { MatchModel } from './matchModel.ts';

export const DEFAULT_MATCH_MODEL: MatchModel = {
  "version": 1,
  "features": {
    "name": {
      "levels": [
        "exact",
        "exact_weak",
        "near_exact",
        "abbreviation",
        "extra_words",
        "extra_place",
        "very_high",
        "high",
        "medium",
        "low",
        "none"
      ],
      "m": [
        0.407087,
        0.0225683,
        0.133258,
        0.0172835,
        0.193024,
        0.0211885,
        0.026019,
        0.0397533,
        0.0402007,
        0.041011,
        0.0586074
      ],
      "u": [
        0.000947108,
        0.00174154,
        0.000997065,
        0.000105497,
        0.00584988,
        0.00318013,
        0.00142007,
        0.0035125,
        0.0237627,
        0.23279,
        0.725694
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
        0.934563,
        0.0310498,
        0.0114692,
        0.022918
      ],
      "u": [
        0.439884,
        0.109677,
        0.1012,
        0.349239
      ]
    },
    "jurisdiction": {
      "levels": [
        "same",
        "compatible",
        "conflicting"
      ],
      "m": [
        0.998925,
        0.000537265,
        0.000537265
      ],
      "u": [
        0.508769,
        0.000537265,
        0.490694
      ]
    },
    "acronym": {
      "levels": [
        "initials",
        "initials_with_stop_words",
        "none"
      ],
      "m": [
        0.285368,
        0.0381405,
        0.676492
      ],
      "u": [
        0.262063,
        0.000467828,
        0.73747
      ]
    },
    "qualifier": {
      "levels": [
        "same",
        "different"
      ],
      "m": [
        0.957832,
        0.0421685
      ],
      "u": [
        0.203881,
        0.796119
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
        0.748191,
        0.0674584,
        0.184351
      ],
      "u": [
        0.792379,
        0.200142,
        0.00747892
      ]
    }
  },
  "matchShare": 0.026026251452907694,
  "linkAt": 9.71096,
  "newAt": 6.21096,
  "provenance": {
    "method": "labelled",
    "pairs": 1344282,
    "note": "labelled candidate pairs, m and u counted per dataset (add-one smoothing) and averaged: LEI dev 420960 pairs (667 true); ROR dev companies 361360 pairs (13620 true); generated (20000 names, seed 7) 561962 pairs (21806 true); linkAt: lowest score with pair precision >= 0.995 in every dataset; newAt: linkAt - 3.5 bits; rebuild: node bin/run-ts.js scripts/build-model.ts; linkAt per dataset: LEI dev 9.721, ROR dev companies 9.337, generated (20000 names, seed 7) 8.250"
  }
};
