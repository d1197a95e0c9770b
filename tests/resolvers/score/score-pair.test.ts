import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import type { MatchRecord } from '../../../resolvers/block/index.ts';
import { buildIdfTable } from '../../../resolvers/compare/index.ts';
import {
  DEFAULT_MATCH_MODEL,
  estimateFromLabels,
  levelIndices,
  compareRecords,
  parseMatchModel,
  scorePair,
  FEATURE_NAMES,
  type MatchModel,
} from '../../../resolvers/score/index.ts';

// Invented names and identifiers; the LEIs are GLEIF's sample LEIs (worked-examples.json → lei_iso17442), used
// only as valid check-digit strings.
const LEI_A = '506700GE1G29325QX363';
const LEI_B = '506700LOLO7M6V0E4247';
const rec = (id: string, name: string, extra: Partial<MatchRecord> = {}): MatchRecord => ({
  id,
  analysis: analyseName(name, extra.country ? { country: extra.country } : undefined),
  ...extra,
});
const idf = buildIdfTable(
  ['Kittering Bay Outfitters', 'Ardmore Street Bank', 'Quillon Vale Dairy', 'Bay Street Holdings', 'Vale Holdings'].map((n) => analyseName(n).tokens),
);
const model = DEFAULT_MATCH_MODEL;

describe('scorePair', () => {
  it('two companies of one country whose names disagree never link, whatever the context adds (precision first)', () => {
    // Invented names. One side has a state (US-DE), the other only the country: the jurisdiction level is
    // "compatible", which must weigh nothing, and a low name level must keep the pair out of automatic links.
    const a = rec('a', 'Havcasworth Marine Inc.', { country: 'US-DE' });
    const b = rec('b', 'Brocalley Marine, Inc.', { country: 'US' });
    const s = scorePair(a, b, model, idf);
    expect(s.explanation.find((e) => e.feature === 'jurisdiction')).toMatchObject({ level: 'compatible', weight: 0 });
    expect(s.decision).not.toBe('link');
  });

  it('a name that disagrees is never linked nor sent to a person, even when the summed weights pass linkAt', () => {
    // A model whose context features alone pass linkAt: the rule, not the arithmetic, keeps the pair out; country
    // and legal form alone give a person nothing to judge, so the pair is new.
    const heavy: MatchModel = { ...model, linkAt: -100, newAt: -200 };
    const s = scorePair(rec('a', 'Quillon Vale Dairy Ltd'), rec('b', 'Ardmore Street Bank Ltd'), heavy, idf);
    expect(['low', 'none']).toContain(s.explanation.find((e) => e.feature === 'name')?.level);
    expect(s.heldBackBy).toMatch(/names disagree/);
    expect(s.score).toBeLessThan(heavy.linkAt);
    expect(s.decision).toBe('new');
  });

  it('"Kittering Bay Outfitters, L.L.C." and "KITTERING BAY OUTFITTERS LLC" score at or above linkAt (issue 5 example)', () => {
    const s = scorePair(
      rec('a', 'Kittering Bay Outfitters, L.L.C.', { country: 'US' }),
      rec('b', 'KITTERING BAY OUTFITTERS LLC', { country: 'US' }),
      model,
      idf,
    );
    expect(s.decision).toBe('link');
    expect(s.explanation.find((e) => e.feature === 'name')?.level).toBe('exact');
    expect(s.explanation.find((e) => e.feature === 'legalForm')?.level).toBe('same_family');
  });

  it('"Ardmore Street Bank plc" and "Ardmore Street Bank GmbH" do not link: the legal forms conflict (issue 5 example)', () => {
    const s = scorePair(rec('a', 'Ardmore Street Bank plc'), rec('b', 'Ardmore Street Bank GmbH'), model, idf);
    expect(s.decision).not.toBe('link');
    const legal = s.explanation.find((e) => e.feature === 'legalForm');
    expect(legal?.level).toMatch(/conflicting|different_jurisdiction/);
    expect(legal?.weight).toBeLessThan(0);
  });

  it('the score is exactly the sum of the explained weights, and every feature is listed', () => {
    const s = scorePair(rec('a', 'Quillon Vale Dairy Ltd', { country: 'GB' }), rec('b', 'Quillon Vale Dairies Limited', { country: 'IE' }), model, idf);
    expect(s.explanation.map((e) => e.feature)).toEqual(FEATURE_NAMES);
    expect(s.score).toBeCloseTo(
      s.explanation.reduce((sum, e) => sum + e.weight, 0),
      12,
    );
    for (const e of s.explanation) if (e.level === null) expect(e.weight).toBe(0);
  });

  it('an equal valid LEI is decisive (+Infinity, link) even when the names differ', () => {
    const s = scorePair(
      rec('a', 'Quillon Vale Dairy', { identifiers: [{ scheme: 'lei', value: LEI_A }] }),
      rec('b', 'QV Milk Products', { identifiers: [{ scheme: 'lei', value: LEI_A }] }),
      model,
      idf,
    );
    expect(s.override).toBe('decisive_identifier');
    expect(s.score).toBe(Infinity);
    expect(s.decision).toBe('link');
  });

  it('different valid LEIs forbid the link (−Infinity) even for identical names; so does a reviewer cannot-link', () => {
    const a = rec('a', 'Quillon Vale Dairy', { identifiers: [{ scheme: 'lei', value: LEI_A }] });
    const b = rec('b', 'Quillon Vale Dairy', { identifiers: [{ scheme: 'lei', value: LEI_B }] });
    const s = scorePair(a, b, model, idf);
    expect(s.override).toBe('cannot_link');
    expect(s.decision).toBe('new');
    const reviewer = scorePair(rec('c', 'Quillon Vale Dairy'), rec('d', 'Quillon Vale Dairy'), model, idf, { cannotLink: true });
    expect(reviewer.score).toBe(-Infinity);
    expect(reviewer.identifierNotes.join(' ')).toMatch(/reviewer/);
  });
});

describe('MatchModel', () => {
  it('survives a JSON round trip and is checked when read back', () => {
    const copy = parseMatchModel(JSON.parse(JSON.stringify(model)));
    expect(copy).toEqual(model);
    const broken = JSON.parse(JSON.stringify(model));
    broken.features.name.m[0] = 0;
    expect(() => parseMatchModel(broken)).toThrow(/feature "name": m/);
    expect(() => parseMatchModel({ ...model, newAt: 20, linkAt: 5 })).toThrow(/newAt/);
  });

  it("labelled re-estimation moves m towards the reviewers' matches and u towards their non-matches", () => {
    const a = rec('a', 'Quillon Vale Dairy');
    const b = rec('b', 'Quillon Vale Dairies');
    const vector = levelIndices(compareRecords(a, b, idf).levels);
    const nameLevel = vector[0]!;
    const asMatch = estimateFromLabels(
      model,
      Array.from({ length: 30 }, () => ({ vector, isMatch: true })),
    );
    const asNon = estimateFromLabels(
      model,
      Array.from({ length: 30 }, () => ({ vector, isMatch: false })),
    );
    const weight = (m: MatchModel): number => Math.log2(m.features.name!.m[nameLevel]! / m.features.name!.u[nameLevel]!);
    expect(weight(asMatch)).toBeGreaterThan(weight(model));
    expect(weight(asNon)).toBeLessThan(weight(model));
    expect(asMatch.provenance.note).toMatch(/30 labelled pairs/);
    // still distributions
    for (const f of Object.values(asMatch.features)) expect(f.m.reduce((s, v) => s + v, 0)).toBeCloseTo(1, 12);
  });
});
