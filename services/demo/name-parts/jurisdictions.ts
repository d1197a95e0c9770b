/**
 * Where generated counterparties are registered, with the weight of each, and the country part of a jurisdiction
 * that keys the legal forms.
 */

/** Jurisdictions used by the generators (ISO 3166-1 alpha-2, US states as ISO 3166-2), with weights. */
export const JURISDICTIONS: ReadonlyArray<{ code: string; weight: number }> = [
  { code: 'US-DE', weight: 14 },
  { code: 'US-CA', weight: 6 },
  { code: 'US-NY', weight: 5 },
  { code: 'US-TX', weight: 4 },
  { code: 'GB', weight: 14 },
  { code: 'DE', weight: 12 },
  { code: 'FR', weight: 9 },
  { code: 'NL', weight: 7 },
  { code: 'JP', weight: 6 },
  { code: 'AU', weight: 6 },
  { code: 'SE', weight: 3 },
  { code: 'IT', weight: 4 },
  { code: 'ES', weight: 4 },
];

/** The legal-form table's key for a jurisdiction ("US-DE" → "US"). */
export function countryOf(jurisdiction: string): string {
  return jurisdiction.slice(0, 2);
}
