/**
 * Bounded adjustment of the weights from reviewers' decisions (resolvers/score/adjust-from-decisions.ts): Platt's
 * calibration of a score by logistic regression (Platt 1999) with a Gaussian prior on each level's shift (Gelman
 * et al. 2008). The decisions are invented; the model is the built-in one. The "19 different decisions on equal
 * names" case is the one measured on the demo (docs/matching.md, known limits).
 */
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_MATCH_MODEL,
  adjustFromDecisions,
  estimateFromLabels,
  featureWeights,
  parseMatchModel,
  type DecidedVector,
  type MatchModel,
} from '../../../resolvers/score/index.ts';

const model = DEFAULT_MATCH_MODEL;
const names = Object.keys(model.features);

/** A comparison vector from level names; features not given are missing (null). */
function vector(levels: Record<string, string>): (number | null)[] {
  return names.map((n) => (n in levels ? model.features[n]!.levels.indexOf(levels[n]!) : null));
}
function decided(n: number, levels: Record<string, string>, isMatch: boolean): DecidedVector[] {
  return Array.from({ length: n }, () => ({ vector: vector(levels), isMatch }));
}
function weight(m: MatchModel, feature: string, level: string): number {
  const f = m.features[feature]!;
  return featureWeights(f)[f.levels.indexOf(level)]!;
}
function score(m: MatchModel, levels: Record<string, string>): number {
  return Object.entries(levels).reduce((s, [f, l]) => s + weight(m, f, l), 0);
}

describe('adjustFromDecisions', () => {
  it('moves a level reviewers keep confirming up only as far as the decisions show a precision above the target', () => {
    // An abbreviated word and nothing else known: 7.61 bits with the built-in model, under its linkAt (8.58): review.
    const like = { name: 'abbreviation' };
    expect(score(model, like)).toBeLessThan(model.linkAt);
    const few = adjustFromDecisions(model, decided(12, like, true)).model;
    // 12 of 12 confirmed is a precision estimate of 13/14 (Laplace): not enough to link like pairs unasked.
    expect(score(few, like)).toBeGreaterThan(score(model, like));
    expect(score(few, like)).toBeLessThan(model.linkAt);
    const many = adjustFromDecisions(model, decided(400, like, true));
    const abbreviation = many.shifts.find((s) => s.feature === 'name' && s.level === 'abbreviation')!;
    expect(abbreviation).toMatchObject({ decisions: 400, same: 400 });
    expect(abbreviation.shift).toBeLessThanOrEqual(2);
    expect(score(many.model, like)).toBeGreaterThanOrEqual(model.linkAt);
    const adjusted = many.model;
    // Levels no decision touched keep their weight exactly.
    expect(weight(adjusted, 'name', 'exact')).toBe(weight(model, 'name', 'exact'));
    expect(weight(adjusted, 'jurisdiction', 'conflicting')).toBe(weight(model, 'jurisdiction', 'conflicting'));
  });

  it('moves a level down quickly on "different" decisions, but never overturns it: 19 of them on equal names move it at most 2 bits (counting moved it 8.5)', () => {
    const exact = decided(19, { name: 'exact' }, false);
    const bounded = adjustFromDecisions(model, exact).model;
    expect(weight(bounded, 'name', 'exact')).toBeLessThan(weight(model, 'name', 'exact') - 1);
    expect(weight(bounded, 'name', 'exact')).toBeGreaterThanOrEqual(weight(model, 'name', 'exact') - 2 - 1e-9);
    // The unbounded counting this replaces, on the same decisions (prior worth 20 pairs).
    const counted = estimateFromLabels(
      model,
      exact.map((d) => ({ vector: d.vector, isMatch: d.isMatch })),
      20,
    );
    expect(weight(model, 'name', 'exact') - weight(counted, 'name', 'exact')).toBeGreaterThan(5);
  });

  it('does not move a level with fewer decisions than minDecisions; split decisions move a level toward the share observed', () => {
    const few = adjustFromDecisions(model, decided(4, { name: 'typo' }, true));
    expect(few.shifts).toEqual([]);
    expect(few.model.features.name!.shift).toBeUndefined();
    const split = (level: string) =>
      adjustFromDecisions(model, [...decided(10, { name: level }, true), ...decided(10, { name: level }, false)]).shifts[0]?.shift ?? 0;
    // extra_words alone scores 5.08 bits, which the calibration at linkAt reads as a likely match: 1 in 2 observed
    // moves it down by the whole bound (2 bits).
    expect(split('extra_words')).toBeLessThan(-0.5);
    // exact_weak alone scores 2.81 bits, read as nearer 1 in 2: it moves less than a third of the bound.
    expect(Math.abs(split('exact_weak'))).toBeLessThan(2 / 3);
    expect(Math.abs(split('exact_weak'))).toBeLessThan(Math.abs(split('extra_words')) / 2);
  });

  it('recomputes from all decisions rather than accumulating: adjusting twice gives the same model', () => {
    const decisions = [...decided(8, { name: 'abbreviation' }, true), ...decided(6, { name: 'exact_weak' }, false)];
    const once = adjustFromDecisions(model, decisions).model;
    const twice = adjustFromDecisions(once, decisions).model;
    expect(twice.features).toEqual(once.features);
  });

  it('is stored and read back, and a stored shift out of bounds is refused naming the feature', () => {
    const { model: adjusted } = adjustFromDecisions(model, decided(10, { name: 'abbreviation' }, true));
    expect(parseMatchModel(JSON.parse(JSON.stringify(adjusted)))).toEqual(adjusted);
    const bad = { ...adjusted, features: { ...adjusted.features, name: { ...adjusted.features.name!, shift: adjusted.features.name!.levels.map(() => 50) } } };
    expect(() => parseMatchModel(bad)).toThrow(/feature "name": shift/);
  });
});
