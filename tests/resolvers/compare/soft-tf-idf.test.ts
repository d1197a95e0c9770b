import { describe, expect, it } from 'vitest';
import {
  buildIdfTable,
  idfTableFromFrequencies,
  jaroWinkler,
  softTfIdf,
  softTfIdfExplained,
  softTfIdfWeighted,
  weighTokens,
} from '../../../resolvers/compare/index.ts';

// Invented names only.
const documents = [
  ['kittering', 'bay', 'outfitters'],
  ['bay', 'holdings'],
  ['ardmore', 'street', 'bank'],
  ['northfield', 'rail', 'components', 'holdings'],
];

describe('buildIdfTable', () => {
  const table = buildIdfTable(documents);
  it('uses the smoothed IDF ln((1 + N) / (1 + df)) + 1, tokens counted once per document', () => {
    // Hand computation: N = 4; "bay" and "holdings" in 2 documents, "kittering" in 1.
    expect(table.documentCount).toBe(4);
    expect(table.idf('bay')).toBeCloseTo(Math.log(5 / 3) + 1, 12);
    expect(table.idf('kittering')).toBeCloseTo(Math.log(5 / 2) + 1, 12);
    expect(buildIdfTable([['bay', 'bay']]).idf('bay')).toBeCloseTo(Math.log(2 / 2) + 1, 12);
  });
  it('gives unseen tokens the largest weight (df = 0)', () => {
    expect(table.idf('never-seen')).toBeCloseTo(Math.log(5) + 1, 12);
    expect(table.idf('never-seen')).toBeGreaterThan(table.idf('kittering'));
  });
  it('rejects bad frequencies with the token named', () => {
    expect(() => idfTableFromFrequencies(new Map([['bay', 5]]), 3)).toThrow(/token "bay".*0\.\.3/);
  });
});

describe('softTfIdf (Cohen, Ravikumar & Fienberg 2003)', () => {
  const flat = idfTableFromFrequencies(
    new Map([
      ['qorv', 1],
      ['widgets', 1],
      ['widget', 1],
      ['gadgets', 1],
    ]),
    3,
  );

  it('hand-computed: one equal token of two equal-weight tokens gives 0.5 when the other pair is below θ', () => {
    // weights 1/√2 each; JW(widgets, gadgets) = (5/7 + 5/7 + 1)/3 = 0.8095 < 0.9, so only "qorv" counts: 1/2.
    expect(jaroWinkler('widgets', 'gadgets')).toBeCloseTo((5 / 7 + 5 / 7 + 1) / 3, 12);
    expect(softTfIdf(['qorv', 'widgets'], ['qorv', 'gadgets'], flat)).toBeCloseTo(0.5, 12);
  });

  it('hand-computed: a near token counts with its Jaro–Winkler similarity', () => {
    // JW(widgets, widget) = (6/7 + 1 + 1)/3 + 4·0.1·(1 − that) = 0.971428…; score = 1/2 + 1/2 · 0.971428…
    const j = (6 / 7 + 1 + 1) / 3;
    const near = j + 0.4 * (1 - j);
    expect(jaroWinkler('widgets', 'widget')).toBeCloseTo(near, 12);
    expect(softTfIdf(['qorv', 'widgets'], ['qorv', 'widget'], flat)).toBeCloseTo(0.5 + 0.5 * near, 12);
  });

  it('is 1 for the same tokens, 0 for unrelated or empty ones, and symmetric', () => {
    const table = buildIdfTable(documents);
    expect(softTfIdf(['kittering', 'bay', 'outfitters'], ['outfitters', 'kittering', 'bay'], table)).toBeCloseTo(1, 12);
    expect(softTfIdf(['ardmore', 'street'], ['kittering', 'bay'], table)).toBe(0);
    expect(softTfIdf([], ['bay'], table)).toBe(0);
    expect(softTfIdf([], [], table)).toBe(0);
    const a = ['kittering', 'bay', 'outfiters'];
    const b = ['kittering', 'bay', 'outfitters', 'holdings'];
    expect(softTfIdf(a, b, table)).toBeCloseTo(softTfIdf(b, a, table), 12);
  });

  it('weighs rare tokens above common ones', () => {
    const table = buildIdfTable(documents);
    // Sharing the rare "northfield" beats sharing the common "holdings".
    const rare = softTfIdf(['northfield', 'holdings'], ['northfield', 'logistics'], table);
    const common = softTfIdf(['northfield', 'holdings'], ['southgate', 'holdings'], table);
    expect(rare).toBeGreaterThan(common);
  });

  it('caps each direction at 1 when several tokens fall on one', () => {
    const table = buildIdfTable(documents);
    const score = softTfIdf(['widget', 'widgets'], ['widgets'], table);
    expect(score).toBeLessThanOrEqual(1);
  });

  it('explains its matches', () => {
    const result = softTfIdfExplained(['qorv', 'widgets'], ['qorv', 'widget'], flat);
    expect(result.forward.map((m) => [m.token, m.matchedWith])).toEqual([
      ['qorv', 'qorv'],
      ['widgets', 'widget'],
    ]);
    expect(result.score).toBeCloseTo(softTfIdf(['qorv', 'widgets'], ['qorv', 'widget'], flat), 12);
  });

  it('gives the same score from weights computed beforehand', () => {
    const table = buildIdfTable(documents);
    const a = ['kittering', 'bay', 'outfiters'];
    const b = ['kittering', 'bay', 'outfitters', 'holdings'];
    expect(softTfIdfWeighted(weighTokens(a, table), weighTokens(b, table))).toBe(softTfIdf(a, b, table));
    expect(softTfIdfWeighted(weighTokens([], table), weighTokens(b, table))).toBe(0);
  });

  it('rejects a threshold outside [0, 1]', () => {
    expect(() => softTfIdf(['a'], ['a'], flat, { threshold: 1.5 })).toThrow(/options\.threshold/);
  });
});
