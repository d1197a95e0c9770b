import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { levelWeight, matchWeight, nonMatchWeight } from '../../../resolvers/score/weights.ts';

// ../shared/reference/worked-examples.json → fellegi_sunter
const fs = JSON.parse(readFileSync(new URL('../../../../shared/reference/worked-examples.json', import.meta.url), 'utf8')).fellegi_sunter;

describe('Fellegi–Sunter weights', () => {
  it('street name m = 0.9, u = 0.01 weighs 6.49 bits (Esri KB FAQ "How does ArcView geocoding compute weight for each field")', () => {
    expect(matchWeight(0.9, 0.01)).toBeCloseTo(6.49, 2);
    expect(matchWeight(fs.esri_example.m, fs.esri_example.u)).toBeCloseTo(fs.esri_example.computed, 5);
  });

  it('First name m = 0.839, u = 0.006 → 7.1276 (ABS 3302.0.55.004 Appendix C Table C.1, weight computed with the formula)', () => {
    expect(matchWeight(0.839, 0.006)).toBeCloseTo(7.1276, 4);
  });

  it('reproduces every agreement, disagreement and missing weight of ABS Table C.1 (worked-examples.json)', () => {
    const rows = fs.abs_2011_death_registrations_to_census_pass1.rows;
    expect(rows.length).toBe(11);
    for (const row of rows) {
      expect(matchWeight(row.m_agree, row.u_agree)).toBeCloseTo(row.computed_weight_agree_log2, 3);
      // disagreement through the formula log2((1−m)/(1−u)) on the three-category form: 1 − m − m_missing
      const viaFormula = Math.log2((1 - row.m_agree - row.m_missing) / (1 - row.u_agree - row.u_missing));
      expect(viaFormula).toBeCloseTo(row.computed_weight_disagree_log2_via_formula, 3);
      // the printed disagree columns (Surname's columns sum to 1.001, hence the two figures differ there)
      expect(levelWeight(row.m_disagree, row.u_disagree)).toBeCloseTo(row.computed_weight_disagree_log2_from_published_columns, 3);
      expect(levelWeight(row.m_missing, row.u_missing)).toBeCloseTo(row.computed_weight_missing_log2, 3);
    }
  });

  it('two-level weight when the field disagrees: First name without a missing category, log2(0.161/0.994) (formula, ABS page)', () => {
    expect(nonMatchWeight(0.839, 0.006)).toBeCloseTo(Math.log2(0.161 / 0.994), 12);
    expect(nonMatchWeight(0.839, 0.006)).toBeLessThan(0);
  });
});
