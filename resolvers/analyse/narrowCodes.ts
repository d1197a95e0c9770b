/**
 * A country hint narrows the ELF codes a designator can stand for ("SA" in FR is QVPB, in CH MVII).
 * Hints are ISO 3166-1 alpha-2 ("CH") or ISO 3166-2 ("US-DE"); a subdivision hint keeps country-wide codes too.
 * When nothing matches the hint, every code is kept: the hint narrows, it never erases the designator.
 */
const COUNTRY = /^[A-Z]{2}(?:-[A-Z0-9]{1,3})?$/;

export function validateCountry(country: string | undefined): string | undefined {
  if (country === undefined || country === '') return undefined;
  const upper = String(country).trim().toUpperCase();
  if (!COUNTRY.test(upper)) {
    throw new RangeError(`hints.country must be an ISO 3166-1 alpha-2 or ISO 3166-2 code such as "FR" or "US-DE" (got "${String(country).slice(0, 20)}")`);
  }
  return upper;
}

export function narrowCodes(
  codes: readonly string[],
  jurisdictions: readonly string[],
  country: string | undefined,
): { codes: string[]; jurisdictions: string[] } {
  const pick = (keep: (j: string) => boolean): { codes: string[]; jurisdictions: string[] } => {
    const out = { codes: [] as string[], jurisdictions: [] as string[] };
    for (let i = 0; i < codes.length; i++) {
      const j = jurisdictions[i] ?? '';
      if (!keep(j)) continue;
      out.codes.push(codes[i] as string);
      if (!out.jurisdictions.includes(j)) out.jurisdictions.push(j);
    }
    return out;
  };
  if (country !== undefined) {
    const dash = country.indexOf('-');
    const whole = dash < 0 ? country : country.slice(0, dash);
    const narrowed =
      dash < 0 ? pick((j) => j === whole || j.startsWith(whole + '-')) : pick((j) => j === country || j === whole);
    if (narrowed.codes.length > 0) return narrowed;
  }
  return pick(() => true);
}
