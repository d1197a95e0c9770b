/**
 * Levels of the context features, from the comparators in resolvers/compare (legal-form compatibility,
 * jurisdiction agreement, acronym fit). "missing" becomes null: the feature is not observed and weighs 0.
 */
import type { MatchRecord } from '../block/matchRecord.ts';
import { compareAcronym, compareJurisdictions, compareLegalForms } from '../compare/index.ts';
import type { FeatureLevel } from './features.ts';

export function legalFormLevel(a: MatchRecord, b: MatchRecord): FeatureLevel<'legalForm'> | null {
  const level = compareLegalForms(a.analysis.legalForm, b.analysis.legalForm).level;
  return level === 'missing' ? null : level;
}

export function jurisdictionLevel(a: MatchRecord, b: MatchRecord): FeatureLevel<'jurisdiction'> | null {
  try {
    const level = compareJurisdictions(a.country, b.country).level;
    return level === 'missing' ? null : level;
  } catch {
    // A malformed country code is no evidence either way (the loader reports such rows).
    return null;
  }
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
