/**
 * Jurisdiction agreement on ISO 3166-1 alpha-2 ("US") and ISO 3166-2 ("US-DE") codes.
 *
 * - same: equal codes.
 * - compatible: a country and one of its subdivisions ("US" and "US-DE"): the coarser record does not say
 *   which state, so it cannot disagree.
 * - conflicting: different countries, or different subdivisions of one country ("US-DE" vs "US-NY").
 * - missing: one side (or both) has none.
 */

export type JurisdictionLevel = 'same' | 'compatible' | 'conflicting' | 'missing';

export interface JurisdictionComparison {
  level: JurisdictionLevel;
  explanation: string;
}

/** Upper-cased, checked code; throws a RangeError naming the value when it is neither form. */
export function parseJurisdiction(code: string): { country: string; subdivision: string | null; code: string } {
  const upper = code.trim().toUpperCase();
  if (/^[A-Z]{2}$/.test(upper)) return { country: upper, subdivision: null, code: upper };
  if (/^[A-Z]{2}-[A-Z0-9]{1,3}$/.test(upper)) return { country: upper.slice(0, 2), subdivision: upper.slice(3), code: upper };
  throw new RangeError(`jurisdiction "${code}" is neither ISO 3166-1 alpha-2 ("US") nor ISO 3166-2 ("US-DE")`);
}

/** Equal, or a country and one of its subdivisions. */
export function jurisdictionsCompatible(a: string, b: string): boolean {
  const x = parseJurisdiction(a);
  const y = parseJurisdiction(b);
  if (x.country !== y.country) return false;
  return x.subdivision === null || y.subdivision === null || x.subdivision === y.subdivision;
}

export function compareJurisdictions(a: string | null | undefined, b: string | null | undefined): JurisdictionComparison {
  const hasA = typeof a === 'string' && a.trim().length > 0;
  const hasB = typeof b === 'string' && b.trim().length > 0;
  if (!hasA || !hasB)
    return { level: 'missing', explanation: `${!hasA && !hasB ? 'no jurisdiction on either side' : `jurisdiction only on one side (${hasA ? a : b})`}` };
  const x = parseJurisdiction(a);
  const y = parseJurisdiction(b);
  if (x.code === y.code) return { level: 'same', explanation: `both ${x.code}` };
  if (x.country === y.country && (x.subdivision === null || y.subdivision === null)) {
    return { level: 'compatible', explanation: `${x.code} and ${y.code}: a country and one of its subdivisions` };
  }
  return { level: 'conflicting', explanation: `${x.code} and ${y.code} are different jurisdictions` };
}
