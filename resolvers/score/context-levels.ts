/**
 * Levels of the context features, from the comparators in resolvers/compare (legal-form compatibility,
 * jurisdiction agreement, acronym fit). "missing" becomes null: the feature is not observed and weighs 0.
 *
 * Speed: the comparators build an explanation and parse jurisdiction codes on every call (a legal form such as
 * "Ltd" lists dozens of jurisdictions), which made the legal-form level the costliest part of a comparison.
 * Only the level is needed here, and it depends on a few distinct values (legal forms, country codes), so the
 * levels are memoised by those values in bounded maps: same inputs, same level as the comparator gives.
 */
import type { LegalFormMatch } from '../analyse/index.ts';
import type { MatchRecord } from '../block/index.ts';
import { compareAcronym, compareJurisdictions, compareLegalForms } from '../compare/index.ts';
import type { FeatureLevel } from './features.ts';

/** Entries a memo keeps before it starts over (a bound on memory whatever the input). */
const MEMO_LIMIT = 100_000;

function remember<V>(memo: Map<string, V>, key: string, value: V): V {
  if (memo.size >= MEMO_LIMIT) memo.clear();
  memo.set(key, value);
  return value;
}

/**
 * What compareLegalForms reads of a legal form (family, ELF codes, jurisdictions) as a small integer, so that the
 * memo key of a pair is one number: ids below 2^20, a pair key below 2^40 (exact in a double).
 */
const LEGAL_FORM_IDS = 1 << 20;
const legalFormIdOf = new WeakMap<LegalFormMatch, number>();
const legalFormIds = new Map<string, number>();
function legalFormId(form: LegalFormMatch): number {
  let id = legalFormIdOf.get(form);
  if (id === undefined) {
    const key = `${form.family}\u0001${form.elfCodes.join(',')}\u0001${form.jurisdictions.join(',')}`;
    id = legalFormIds.get(key);
    if (id === undefined) {
      id = legalFormIds.size;
      if (id < LEGAL_FORM_IDS) legalFormIds.set(key, id);
    }
    legalFormIdOf.set(form, id);
  }
  return id;
}

const legalFormMemo = new Map<number, FeatureLevel<'legalForm'> | null>();

export function legalFormLevel(a: MatchRecord, b: MatchRecord): FeatureLevel<'legalForm'> | null {
  const x = a.analysis.legalForm;
  const y = b.analysis.legalForm;
  if (x === null || y === null) return null;
  if (x.family === y.family) return 'same_family';
  const idX = legalFormId(x);
  const idY = legalFormId(y);
  // Past the id limit (never seen in practice: a few hundred legal forms exist) compare without the memo.
  const key = idX < LEGAL_FORM_IDS && idY < LEGAL_FORM_IDS ? idX * LEGAL_FORM_IDS + idY : -1;
  const known = key < 0 ? undefined : legalFormMemo.get(key);
  if (known !== undefined) return known;
  const level = compareLegalForms(x, y).level;
  const result = level === 'missing' ? null : level;
  if (key >= 0) {
    if (legalFormMemo.size >= MEMO_LIMIT) legalFormMemo.clear();
    legalFormMemo.set(key, result);
  }
  return result;
}

const jurisdictionMemo = new Map<string, FeatureLevel<'jurisdiction'> | null>();

export function jurisdictionLevel(a: MatchRecord, b: MatchRecord): FeatureLevel<'jurisdiction'> | null {
  const key = `${a.country ?? ''}\u0002${b.country ?? ''}`;
  const known = jurisdictionMemo.get(key);
  if (known !== undefined) return known;
  let level: FeatureLevel<'jurisdiction'> | null;
  try {
    const compared = compareJurisdictions(a.country, b.country).level;
    level = compared === 'missing' ? null : compared;
  } catch {
    // A malformed country code is no evidence either way (the loader reports such rows).
    level = null;
  }
  return remember(jurisdictionMemo, key, level);
}

/** Observed only when one side could be an acronym (one short token, or single letters) and the other could not. */
export function acronymLevel(a: MatchRecord, b: MatchRecord): FeatureLevel<'acronym'> | null {
  const shortA = couldBeAcronym(a.analysis.tokens);
  const shortB = couldBeAcronym(b.analysis.tokens);
  if (shortA === shortB) return null;
  return compareAcronym(a.analysis.tokens, b.analysis.tokens).level;
}

function couldBeAcronym(tokens: readonly string[]): boolean {
  if (tokens.length === 1) {
    const length = (tokens[0] as string).length;
    return length >= 2 && length <= 10;
  }
  return tokens.length >= 2 && tokens.every((t) => t.length === 1);
}
