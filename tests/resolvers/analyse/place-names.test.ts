/**
 * The place list against its published sources: ISO 3166-1 country names and ISO 3166-2 subdivision names via the
 * `iso-3166` npm package, and the English country names of the CLDR data in Node (Intl.DisplayNames).
 */
import { iso31661, iso31662 } from 'iso-3166';
import { describe, expect, it } from 'vitest';
import { normaliseTokens } from '../../../resolvers/analyse/normalise-name.ts';
import { MIN_PLACE_CHARS, placeNames, spellings } from '../../../resolvers/analyse/place-names.ts';

const key = (s: string): string => normaliseTokens(s).join(' ');
const longEnough = (s: string): boolean => key(s).replace(/ /gu, '').length >= MIN_PLACE_CHARS;

describe('placeNames', () => {
  it('holds every ISO 3166-2:GB, :US, :AU and :CA subdivision name (ISO 3166-2 via package iso-3166)', () => {
    const names = placeNames();
    for (const country of ['GB', 'US', 'AU', 'CA']) {
      const subdivisions = iso31662.filter((s) => s.parent === country || s.parent.startsWith(`${country}-`));
      expect(subdivisions.length, country).toBeGreaterThanOrEqual(8); // AU: 6 states, 2 territories
      for (const s of subdivisions) for (const w of spellings(s.name)) if (longEnough(w)) expect(names.has(key(w)), `${s.code} ${w}`).toBe(true);
    }
    // ISO 3166-2:GB lists "England and Wales" (GB-EAW), ISO 3166-2:AU "New South Wales" (AU-NSW).
    expect(iso31662.find((s) => s.code === 'GB-EAW')?.name).toBe('England and Wales');
    expect(names.has('england and wales')).toBe(true);
    expect(names.has('new south wales')).toBe(true);
  });

  it('holds every ISO 3166-1 country name, inverted names in both orders (ISO 3166-1 via package iso-3166)', () => {
    const names = placeNames();
    for (const c of iso31661) for (const w of spellings(c.name)) if (longEnough(w)) expect(names.has(key(w)), `${c.alpha2} ${w}`).toBe(true);
    // ISO writes "Netherlands, Kingdom of the" and "Korea, Republic of".
    for (const n of ['netherlands', 'kingdom of the netherlands', 'korea', 'republic of korea', 'united states of america']) {
      expect(names.has(n), n).toBe(true);
    }
  });

  it('holds the short English country names of CLDR (Intl.DisplayNames in Node)', () => {
    const display = new Intl.DisplayNames(['en'], { type: 'region' });
    const names = placeNames();
    for (const code of ['GB', 'NL', 'KR', 'US', 'DE', 'CZ']) expect(names.has(key(display.of(code) ?? '')), code).toBe(true);
  });

  it('leaves out names too short to tell from initials, and writes inverted names both ways', () => {
    expect(placeNames().has('bam')).toBe(false); // ISO 3166-2:BF lists "Bam"
    expect(spellings('Korea, Republic of')).toEqual(['Korea', 'Republic of Korea', 'Korea Republic of']);
    expect(spellings('Falkland Islands (Malvinas)')).toEqual(['Falkland Islands']);
    expect(spellings('Bolama / Bijagós')).toEqual(['Bolama', 'Bijagós']);
  });
});
