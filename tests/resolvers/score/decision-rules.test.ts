import { describe, expect, it } from 'vitest';
import {
  clusterRulesOf,
  decidePair,
  decidePairAt,
  FEATURE_LEVELS,
  FEATURE_NAMES,
  indexedRules,
  linkHeldBackBy,
  ruledScore,
  worthReview,
  type ComparisonLevels,
  type FeatureName,
} from '../../../resolvers/score/index.ts';

const levelIndexOf = (feature: FeatureName, level: string | null): number =>
  level === null ? -1 : (FEATURE_LEVELS[feature] as readonly string[]).indexOf(level);

const levels = (over: Partial<ComparisonLevels>): ComparisonLevels => ({
  name: 'exact',
  legalForm: null,
  jurisdiction: null,
  acronym: null,
  qualifier: null,
  sharedContact: null,
  distinct: null,
  ...over,
});
const model = { linkAt: 9, newAt: 6 };

describe('decisionRules (the one decision logic of the register and the evaluation)', () => {
  it('links at linkAt when nothing holds the pair back', () => {
    expect(decidePair(ruledScore(10, null, levels({}), model), levels({}), model)).toBe('link');
  });
  it('a differing series number, branch or activity word is a strong negative: below newAt and a conflict, new', () => {
    for (const distinct of ['number', 'branch', 'activity'] as const) {
      const l = levels({ distinct });
      expect(linkHeldBackBy(l)).toMatch(distinct);
      const s = ruledScore(20, null, l, model);
      expect(s).toBeLessThan(model.newAt);
      expect(s).toBeLessThan(clusterRulesOf(model).conflictBelow);
      expect(decidePair(s, l, model)).toBe('new');
    }
  });
  it('a differing activity word still holds the stricter cap when the rest of the names disagree too (a conflict, not a review)', () => {
    // "Alder Bank (Asia) Ltd" / "Alder Securities (Asia) Ltd": name level low and distinct activity (invented names).
    const l = levels({ name: 'low', distinct: 'activity', sharedContact: 'shared' });
    expect(linkHeldBackBy(l)).toBe('a distinguishing word differs (activity)');
    const s = ruledScore(20, null, l, model);
    expect(s).toBeLessThan(clusterRulesOf(model).conflictBelow);
    expect(decidePair(s, l, model)).toBe('new');
    const rules = indexedRules();
    const row = new Int8Array(FEATURE_NAMES.length).fill(-1);
    row[FEATURE_NAMES.indexOf('name')] = levelIndexOf('name', 'low');
    row[FEATURE_NAMES.indexOf('distinct')] = levelIndexOf('distinct', 'activity');
    row[FEATURE_NAMES.indexOf('sharedContact')] = levelIndexOf('sharedContact', 'shared');
    expect(decidePairAt(s, row, 0, rules, model)).toBe('new');
  });
  it('names that disagree are capped just below linkAt, never linked', () => {
    const l = levels({ name: 'low', sharedContact: 'shared' });
    const s = ruledScore(20, null, l, model);
    expect(s).toBeLessThan(model.linkAt);
    expect(s).toBeGreaterThan(model.newAt);
    expect(decidePair(s, l, model)).toBe('review');
  });
  it('names with nothing in common are new whatever their country and legal form', () => {
    const l = levels({ name: 'none', jurisdiction: 'same', legalForm: 'same_family' });
    expect(worthReview(l)).toBe(false);
    expect(decidePair(ruledScore(7, null, l, model), l, model)).toBe('new');
    // ... unless they share a contact a person can check
    const shared = { ...l, sharedContact: 'shared' as const };
    expect(decidePair(ruledScore(7, null, shared, model), shared, model)).toBe('review');
  });
  it('names that agree closely go to a person down to 0 bits; other names only above newAt', () => {
    // "Kestrel Tooling GmbH" / "Kestrel Tooling AG" in one country: equal names, conflicting forms.
    const close = levels({ name: 'exact', legalForm: 'conflicting', jurisdiction: 'same' });
    expect(decidePair(3, close, model)).toBe('review');
    expect(decidePair(-0.5, close, model)).toBe('new');
    const partial = levels({ name: 'extra_words' });
    expect(decidePair(3, partial, model)).toBe('new');
    expect(decidePair(7, partial, model)).toBe('review');
  });
  it('close names whose qualifiers differ on both sides are reviewed only above newAt, in both forms of the rules', () => {
    // "Ardent Bank (Lao) Ltd" / "Ardent Bank (Samoa) Ltd": equal cores, two places (invented names).
    const siblings = levels({ name: 'exact', qualifier: 'different', legalForm: 'same_family', jurisdiction: 'same' });
    expect(decidePair(3, siblings, model)).toBe('new');
    expect(decidePair(7, siblings, model)).toBe('review');
    const sameQualifier = { ...siblings, qualifier: 'same' as const };
    expect(decidePair(3, sameQualifier, model)).toBe('review');
    // The indexed form the batches use decides the same.
    const rules = indexedRules();
    for (const [score, l] of [
      [3, siblings],
      [7, siblings],
      [3, sameQualifier],
    ] as const) {
      const row = Int8Array.from(FEATURE_NAMES.map((f) => levelIndexOf(f, l[f])));
      expect(decidePairAt(score, row, 0, rules, model)).toBe(decidePair(score, l, model));
    }
  });
  it('identifiers decide', () => {
    expect(ruledScore(-50, 'decisive_identifier', levels({ name: 'none' }), model)).toBe(Infinity);
    expect(decidePair(ruledScore(50, 'cannot_link', levels({}), model), levels({}), model)).toBe('new');
  });
});
