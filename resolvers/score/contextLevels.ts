/**
 * Levels of the context features, from engineer D's comparators (legal-form compatibility, jurisdiction
 * agreement, acronym fit). PENDING: wired when resolvers/compare exports them; until then these return null
 * (the feature is not observed and weighs 0).
 */
import type { MatchRecord } from '../block/matchRecord.ts';
import type { FeatureLevel } from './features.ts';

export function legalFormLevel(_a: MatchRecord, _b: MatchRecord): FeatureLevel<'legalForm'> | null {
  return null;
}

export function jurisdictionLevel(_a: MatchRecord, _b: MatchRecord): FeatureLevel<'jurisdiction'> | null {
  return null;
}

export function acronymLevel(_a: MatchRecord, _b: MatchRecord): FeatureLevel<'acronym'> | null {
  return null;
}
