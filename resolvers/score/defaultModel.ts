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
        0.406378,
        0.0220022,
        0.133749,
        0.0168402,
        0.192051,
        0.0216786,
        0.0260188,
        0.0393799,
        0.0421288,
        0.0411608,
        0.0586132
      ],
      "u": [
        0.000946881,
        0.00173933,
        0.000996786,
        0.0000999933,
        0.00571067,
        0.00314185,
        0.00141995,
        0.0034508,
        0.0236736,
        0.23364,
        0.72518
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
        0.936455,
        0.0316224,
        0.0120278,
        0.0198946
      ],
      "u": [
        0.443595,
        0.110847,
        0.102876,
        0.342682
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
        0.000537261,
        0.000537261
      ],
      "u": [
        0.509846,
        0.000537261,
        0.489617
      ]
    },
    "acronym": {
      "levels": [
        "initials",
        "initials_with_stop_words",
        "none"
      ],
      "m": [
        0.281738,
        0.0344394,
        0.683823
      ],
      "u": [
        0.261924,
        0.000476155,
        0.7376
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
        0.202583,
        0.797417
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
        0.791513,
        0.201222,
        0.00726429
      ]
    }
  },
  "matchShare": 0.02601891399662683,
  "linkAt": 9.71574,
  "newAt": 6.21574,
  "provenance": {
    "method": "labelled",
    "pairs": 1343785,
    "note": "labelled candidate pairs, m and u counted per dataset (add-one smoothing) and averaged: LEI dev 420160 pairs (667 true); ROR dev companies 361634 pairs (13622 true); generated (20000 names, seed 7) 561991 pairs (21806 true); linkAt: lowest score with pair precision >= 0.995 in every dataset; newAt: linkAt - 3.5 bits; rebuild: node bin/run-ts.js scripts/build-model.ts; linkAt per dataset: LEI dev 9.716, ROR dev companies 9.361, generated (20000 names, seed 7) 8.283"
  }
};
