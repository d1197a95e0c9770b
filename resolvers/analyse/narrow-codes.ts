/**
 * A country hint narrows the ELF codes a designator can stand for ("SA" in FR is QVPB, in CH MVII).
 * Hints are ISO 3166-1 alpha-2 ("CH") or ISO 3166-2 ("US-DE"); a subdivision hint keeps country-wide codes too.
 * When nothing matches the hint, every code is kept: the hint narrows, it never erases the designator.
 */
import type { LegalFormEntry } from './legal-form-index.ts';

const COUNTRY = /^[A-Z]{2}(?:-[A-Z0-9]{1,3})?$/;

/** The hint upper-cased, or undefined for no hint (undefined, null, ""); throws RangeError naming the field. */
export function validateCountry(country: string | null | undefined): string | undefined {
  if (country === undefined || country === null || country === '') return undefined;
  const upper = String(country).trim().toUpperCase();
  if (!COUNTRY.test(upper)) {
    throw new RangeError(`hints.country must be an ISO 3166-1 alpha-2 or ISO 3166-2 code such as "FR" or "US-DE" (got "${String(country).slice(0, 20)}")`);
  }
  return upper;
}

export function narrowCodes(entry: LegalFormEntry, country: string | undefined): { codes: string[]; jurisdictions: string[] } {
  if (country !== undefined) {
    const dash = country.indexOf('-');
    const whole = dash < 0 ? country : country.slice(0, dash);
    const codes: string[] = [];
    const jurisdictions: string[] = [];
    for (let i = 0; i < entry.codes.length; i++) {
      const j = entry.jurisdictions[i] as string;
      const keep = dash < 0 ? j === whole || (j.length > whole.length && j.startsWith(whole) && j[whole.length] === '-') : j === country || j === whole;
      if (!keep) continue;
      codes.push(entry.codes[i] as string);
      if (!jurisdictions.includes(j)) jurisdictions.push(j);
    }
    if (codes.length > 0) return { codes, jurisdictions };
    // "Inc." with US-DE: no Delaware row lists "Inc.", so fall back to the country's codes before all codes.
    if (dash >= 0) return narrowCodes(entry, whole);
  }
  // Copies: callers own their analysis and may change it.
  return { codes: entry.codes.slice(), jurisdictions: entry.distinctJurisdictions.slice() };
}
