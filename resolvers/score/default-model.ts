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
        0.0912128,
        0.0152986,
        0.15429,
        0.0325297,
        0.0204906,
        0.0395954,
        0.040033,
        0.0400319,
        0.0435154,
        0.0601516
      ],
      "u": [
        0.00111073,
        0.00158319,
        0.0000549628,
        0.000209786,
        0.0000731623,
        0.00466394,
        0.00114498,
        0.00316371,
        0.00219879,
        0.00361537,
        0.0245431,
        0.233758,
        0.723881
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
        0.957832,
        0.0421685
      ],
      "u": [
        0.20379,
        0.79621
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
        0.681111,
        0.0707407,
        0.248148
      ],
      "u": [
        0.787119,
        0.203931,
        0.00894964
      ]
    }
  },
  "matchShare": 0.026057944242573544,
  "linkAt": 9.5349,
  "newAt": 7.5349,
  "provenance": {
    "method": "labelled",
    "pairs": 1345564,
    "note": "labelled candidate pairs, m and u counted per dataset (add-one smoothing) and averaged: LEI dev 421876 pairs (678 true); ROR dev companies 361726 pairs (13660 true); generated (20000 names, seed 7) 561962 pairs (21806 true); linkAt: lowest threshold whose clusters have pairwise precision >= 0.99 in every dataset; newAt: lowest score with >= 0.5 true matches among review pairs in every dataset; rebuild: node bin/run-ts.js scripts/build-model.ts; linkAt per dataset: LEI dev 9.535, ROR dev companies 7.373, generated (20000 names, seed 7) 7.373; newAt per dataset: LEI dev 9.535, ROR dev companies -1.109, generated (20000 names, seed 7) -6.649; newAt at most linkAt - 2"
  }
};
