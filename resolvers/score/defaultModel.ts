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
        0.406505,
        0.0225482,
        0.0310789,
        0.0892489,
        0.0155066,
        0.157133,
        0.0351197,
        0.0209899,
        0.0412393,
        0.0406378,
        0.0404527,
        0.0409515,
        0.0585881
      ],
      "u": [
        0.000947103,
        0.00174487,
        0.0000533879,
        0.000208749,
        0.0000899082,
        0.00465908,
        0.0011508,
        0.00313808,
        0.00219417,
        0.00351636,
        0.0237996,
        0.232799,
        0.725699
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
        0.682077,
        0.0705797,
        0.247343
      ],
      "u": [
        0.788382,
        0.202934,
        0.00868369
      ]
    }
  },
  "matchShare": 0.026026251452907694,
  "linkAt": 9.7033,
  "newAt": 7.81325,
  "provenance": {
    "method": "labelled",
    "pairs": 1344282,
    "note": "labelled candidate pairs, m and u counted per dataset (add-one smoothing) and averaged: LEI dev 420960 pairs (667 true); ROR dev companies 361360 pairs (13620 true); generated (20000 names, seed 7) 561962 pairs (21806 true); linkAt: lowest threshold whose clusters have pairwise precision >= 0.99 in every dataset; newAt: lowest score with >= 0.5 true matches among review pairs in every dataset; rebuild: node bin/run-ts.js scripts/build-model.ts; linkAt per dataset: LEI dev 9.703, ROR dev companies 7.428, generated (20000 names, seed 7) 7.428; newAt per dataset: LEI dev 7.813, ROR dev companies -0.660, generated (20000 names, seed 7) -8.754"
  }
};
