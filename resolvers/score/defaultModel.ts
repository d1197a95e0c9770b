/**
 * The built-in match model, estimated on the ROR dev split (docs/matching.md → 'Model'): reproduce with
 *   node bin/cpreg.js evaluate ../shared/datasets/ror_org_names.csv --id entity_id --name name --country country \
 *     --filter split=dev --exclude status=withdrawn --strip-country-qualifier --acronym source_name_type=acronym \
 *     --entity-sample 0.35 --learn-from-labels --save-model model.json --out dev-sweep
 * then the jurisdiction blend described in provenance.note. linkAt 8: the lowest whole-bit threshold with dev pairwise
 * precision above 0.9 (0.936); newAt 0: at or below 0 bits the evidence favours a non-match.
 */
import type { MatchModel } from './matchModel.ts';

export const DEFAULT_MATCH_MODEL: MatchModel = {
  version: 1,
  features: {
    name: {
      levels: [
        'exact',
        'very_high',
        'high',
        'medium',
        'low',
        'none'
      ],
      m: [
        0.115493,
        0.0980559,
        0.168185,
        0.201368,
        0.19532,
        0.221579
      ],
      u: [
        0.0011524,
        0.0023076,
        0.00391761,
        0.0329858,
        0.288351,
        0.671286
      ]
    },
    legalForm: {
      levels: [
        'same_family',
        'compatible',
        'conflicting',
        'different_jurisdiction'
      ],
      m: [
        0.772903,
        0.0974194,
        0.0275953,
        0.102082
      ],
      u: [
        0.436263,
        0.149679,
        0.142238,
        0.271819
      ]
    },
    jurisdiction: {
      levels: [
        'same',
        'compatible',
        'conflicting'
      ],
      m: [
        0.9966,
        0.00169978,
        0.00169978
      ],
      u: [
        0.312125,
        0.00169978,
        0.686175
      ]
    },
    acronym: {
      levels: [
        'initials',
        'initials_with_stop_words',
        'none'
      ],
      m: [
        0.6029,
        0.0158058,
        0.381295
      ],
      u: [
        0.161011,
        0.00695213,
        0.832037
      ]
    },
    qualifier: {
      levels: [
        'same',
        'different'
      ],
      m: [
        0.766667,
        0.233333
      ],
      u: [
        0.111483,
        0.888517
      ]
    },
    sharedContact: {
      levels: [
        'shared',
        'none_shared'
      ],
      m: [
        0.5,
        0.5
      ],
      u: [
        0.01,
        0.99
      ]
    }
  },
  matchShare: 0.0195145,
  linkAt: 8,
  newAt: 0,
  provenance: {
    method: 'labelled',
    pairs: 1457635,
    note: 'ROR dev split (35% entity sample, 41,281 names): m and u from 1,457,635 labelled candidate pairs (28,445 matches); jurisdiction m blended with a prior worth 1,000 pairs; jurisdiction "compatible" (a country against one of its subdivisions, e.g. US vs US-DE) never occurs in ROR, whose countries are all alpha-2, so its u is set equal to its m (weight 0: no evidence either way) instead of the 3.5e-8 the labels gave, which weighed +15.6 bits and linked unrelated companies of one country; sharedContact never observed in ROR (prior values); linkAt/newAt chosen on the dev sweep (docs/matching.md)'
  }
};
