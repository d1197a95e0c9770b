import { describe, expect, it } from 'vitest';
import { IDENTIFIER_SCHEMES, STRONG_SCHEMES } from '../../../resolvers/vocabulary.ts';
import { compareIdentifiers, FREE_MAIL_DOMAINS, isFreeMailDomain, normaliseAddress, normaliseIdentifier } from '../../../resolvers/identifiers/index.ts';

const norm = (scheme: string, value: string, defaultCountry?: string): string => {
  const r = normaliseIdentifier({ scheme, value }, { defaultCountry });
  if (!r.ok) throw new Error(r.reason);
  return r.identifier.value;
};
const reason = (scheme: string, value: string, defaultCountry?: string): string => {
  const r = normaliseIdentifier({ scheme, value }, { defaultCountry });
  if (r.ok) throw new Error(`expected ${scheme} "${value}" to be rejected, got ${r.identifier.value}`);
  return r.reason;
};

describe('phone numbers to E.164 (libphonenumber-js)', () => {
  // Numbers from ranges set aside for fiction (from memory): Ofcom's drama range 020 7946 0xxx (UK), ACMA's
  // 0491 570 006 (AU), NANPA's 555-01xx (US).
  it('uses the default country for national numbers', () => {
    expect(norm('phone', '020 7946 0123', 'GB')).toBe('+442079460123');
    expect(norm('phone', '0491 570 006', 'AU')).toBe('+61491570006');
    expect(norm('phone', '(201) 555-0123', 'US-NJ')).toBe('+12015550123');
  });
  it('reads international numbers without a default', () => {
    expect(norm('phone', '+44 (0)20 7946 0123')).toBe('+442079460123');
    expect(norm('phone', '+1 202 555 0143')).toBe('+12025550143');
  });
  it('says what is wrong', () => {
    expect(reason('phone', '020 7946 0123')).toMatch(/^phone number .*default country/);
    expect(reason('phone', '+44 20 7946')).toMatch(/^phone number .*not a valid number/);
    expect(reason('phone', '12345', 'XX')).toMatch(/defaultCountry|not a phone number/);
  });
});

describe('e-mail and web domains', () => {
  it('lower-cases, strips www., ports, paths; IDN to punycode', () => {
    expect(norm('email_domain', 'Jane.Doe@Kittering-Bay.EXAMPLE')).toBe('kittering-bay.example');
    expect(norm('email_domain', 'mailto:a@b.example')).toBe('b.example');
    expect(norm('web_domain', 'https://www.Kittering-Bay.example:8443/contact?x=1#top')).toBe('kittering-bay.example');
    expect(norm('web_domain', 'www.northfield-rail.example/')).toBe('northfield-rail.example');
    expect(norm('web_domain', 'http://bücher.example')).toBe('xn--bcher-kva.example');
  });
  it('rejects what is not a domain', () => {
    expect(reason('web_domain', 'localhost')).toMatch(/^web domain .*no dot/);
    expect(reason('web_domain', 'http://192.168.0.1/')).toMatch(/IP address/);
    expect(reason('web_domain', 'jane@example.com')).toMatch(/email_domain/);
  });
  it('knows common free-mail providers (list marked common practice)', () => {
    expect(isFreeMailDomain('GMAIL.com')).toBe(true);
    expect(isFreeMailDomain('kittering-bay.example')).toBe(false);
    expect(FREE_MAIL_DOMAINS.size).toBeGreaterThan(50);
  });
});

describe('normaliseIdentifier: bad input names the scheme and the problem', () => {
  it('unknown scheme, empty value, missing label for other', () => {
    const unknown = normaliseIdentifier({ scheme: 'duns', value: '1' });
    expect(!unknown.ok && unknown.reason).toMatch(/scheme "duns" is unknown; use one of lei, vat/);
    const empty = normaliseIdentifier({ scheme: 'lei', value: '  ' });
    expect(!empty.ok && empty.reason).toBe('LEI: value is empty');
    const other = normaliseIdentifier({ scheme: 'other', value: 'X-1' });
    expect(!other.ok && other.reason).toMatch(/label/);
    expect(normaliseIdentifier({ scheme: 'other', value: ' X-1 ', label: 'Supplier Code' })).toEqual({
      ok: true,
      identifier: { scheme: 'other', value: 'X-1', label: 'supplier code' },
    });
  });
  it('rejects a malformed default country', () => {
    const r = normaliseIdentifier({ scheme: 'phone', value: '020 7946 0123' }, { defaultCountry: 'GBR' });
    expect(!r.ok && r.reason).toMatch(/defaultCountry "GBR"/);
  });
  it('covers every scheme of the vocabulary, and is idempotent on each canonical value', () => {
    const samples: Record<string, [string, string?]> = {
      lei: ['506700GE1G29325QX363'],
      vat: ['GR123456789'],
      us_ein: ['123456789'],
      gb_company: ['sc12345'],
      de_register: ['Amtsgericht München HRB 12345'],
      fr_siren: ['RCS Lyon B 732 829 320'],
      nl_kvk: ['12345678'],
      se_org: ['556677-8899'],
      au_acn: ['004 085 616'],
      au_abn: ['51 824 753 556'],
      phone: ['020 7946 0123', 'GB'],
      email_domain: ['a@Kittering-Bay.example'],
      web_domain: ['https://www.kittering-bay.example/'],
      iban: ['GB82 WEST 1234 5698 7654 32'],
      other: ['X-1'],
    };
    expect(Object.keys(samples).sort()).toEqual([...IDENTIFIER_SCHEMES].sort());
    for (const [scheme, [value, country]] of Object.entries(samples)) {
      const first = normaliseIdentifier({ scheme, value, label: 'code' }, { defaultCountry: country });
      expect(first.ok, `${scheme} ${value}`).toBe(true);
      if (!first.ok) continue;
      const again = normaliseIdentifier(first.identifier, { defaultCountry: country });
      expect(again, scheme).toEqual(first);
    }
  });
});

describe('compareIdentifiers', () => {
  const gleif = { scheme: 'lei' as const, value: '506700GE1G29325QX363' };
  const lou = { scheme: 'lei' as const, value: '506700LOLO7M6V0E4247' };
  // The two near-identical BlackRock names of GLEIF's sample (worked-examples.json, SOURCES.md §5) have different LEIs.
  const trustUs = { scheme: 'lei' as const, value: '549300RK1FB0VMTPD087' };
  const trustGbBranch = { scheme: 'lei' as const, value: '549300J43MRRHUL8JX64' };

  it('equal valid LEI is decisive (case and spaces forgiven)', () => {
    const r = compareIdentifiers([gleif], [{ scheme: 'lei', value: '506700 ge1g29325qx363' }]);
    expect(r.decisive).toBe(true);
    expect(r.cannotLink).toBe(false);
    expect(r.explanation[0]).toMatch(/same lei 506700GE1G29325QX363/);
  });
  it('different valid LEIs are a cannot-link', () => {
    const r = compareIdentifiers([trustUs], [trustGbBranch]);
    expect(r).toMatchObject({ decisive: false, cannotLink: true, differingStrong: [{ scheme: 'lei', a: [trustUs.value], b: [trustGbBranch.value] }] });
  });
  it('an invalid LEI is ignored, and says so', () => {
    const r = compareIdentifiers([gleif], [{ scheme: 'lei', value: '506700GE1G29325QX364' }]);
    expect(r.cannotLink).toBe(false);
    expect(r.ignored).toHaveLength(1);
    expect(r.explanation.join('\n')).toMatch(/ignored on side b: LEI .*check digits/);
  });
  it('different values in one registration scheme are a cannot-link; in different schemes nothing', () => {
    expect(compareIdentifiers([{ scheme: 'gb_company', value: '123456' }], [{ scheme: 'gb_company', value: '00123457' }]).cannotLink).toBe(true);
    expect(compareIdentifiers([{ scheme: 'gb_company', value: '123456' }], [{ scheme: 'gb_company', value: '00123456' }]).decisive).toBe(true);
    const cross = compareIdentifiers([{ scheme: 'gb_company', value: '123456' }], [{ scheme: 'nl_kvk', value: '12345678' }]);
    expect([cross.decisive, cross.cannotLink]).toEqual([false, false]);
  });
  it('VAT numbers clash only within one country; German entries only within one court and type', () => {
    expect(compareIdentifiers([{ scheme: 'vat', value: 'DE123456789' }], [{ scheme: 'vat', value: 'ATU12345678' }]).cannotLink).toBe(false);
    expect(compareIdentifiers([{ scheme: 'vat', value: 'DE123456789' }], [{ scheme: 'vat', value: 'DE987654321' }]).cannotLink).toBe(true);
    const courts = compareIdentifiers([{ scheme: 'de_register', value: 'AG München HRB 12345' }], [{ scheme: 'de_register', value: 'AG Köln HRB 12345' }]);
    expect([courts.decisive, courts.cannotLink]).toEqual([false, false]);
    expect(
      compareIdentifiers([{ scheme: 'de_register', value: 'AG München HRB 12345' }], [{ scheme: 'de_register', value: 'HRB 54321 München' }]).cannotLink,
    ).toBe(true);
  });
  it('the SIREN inside a French VAT number counts as a SIREN', () => {
    const r = compareIdentifiers([{ scheme: 'vat', value: 'FR44732829320' }], [{ scheme: 'fr_siren', value: 'RCS Lyon B 732 829 320' }]);
    expect(r.decisive).toBe(true);
    expect(r.equalStrong[0]).toMatchObject({ scheme: 'fr_siren', value: '732829320', derivedFrom: { scheme: 'vat' } });
  });
  it('an ACN inside an ABN agrees', () => {
    // ABN built around ASIC's example ACN 004 085 616 (computed here): body weights 3..19 give 402; check digits
    // p ≡ 10 − 402 (mod 89) = 53; ATO sum (5−1)·10 + 3 + 402 = 445 = 5 · 89.
    expect(normaliseIdentifier({ scheme: 'au_abn', value: '53 004 085 616' }).ok).toBe(true);
    const r = compareIdentifiers([{ scheme: 'au_abn', value: '53 004 085 616' }], [{ scheme: 'au_acn', value: '004 085 616' }]);
    expect(r.decisive).toBe(true);
    expect(r.explanation[0]).toMatch(/ACN 004085616 is the last nine digits of ABN 53004085616/);
    // The ATO example ABN 51 824 753 556 does not contain that ACN: no evidence either way.
    const other = compareIdentifiers([{ scheme: 'au_abn', value: '51 824 753 556' }], [{ scheme: 'au_acn', value: '004 085 616' }]);
    expect([other.decisive, other.cannotLink]).toEqual([false, false]);
  });
  it('equal and different strong identifiers at once: conflicting, not decisive', () => {
    const r = compareIdentifiers([gleif, { scheme: 'vat', value: 'DE123456789' }], [lou, { scheme: 'vat', value: 'DE123456789' }]);
    expect([r.decisive, r.cannotLink, r.conflicting]).toEqual([false, true, true]);
  });
  it('shared phone, domain, IBAN are weak "same or affiliated" evidence; free-mail never counts', () => {
    const r = compareIdentifiers(
      [
        { scheme: 'phone', value: '+44 20 7946 0123' },
        { scheme: 'email_domain', value: 'ap@kittering-bay.example' },
        { scheme: 'iban', value: 'GB82WEST12345698765432' },
        { scheme: 'email_domain', value: 'someone@gmail.com' },
      ],
      [
        { scheme: 'phone', value: '020 7946 0123' },
        { scheme: 'web_domain', value: 'https://www.kittering-bay.example' },
        { scheme: 'iban', value: 'GB82 WEST 1234 5698 7654 32' },
        { scheme: 'email_domain', value: 'other@gmail.com' },
      ],
      { defaultCountry: 'GB' },
    );
    expect(r.decisive).toBe(false);
    expect(r.cannotLink).toBe(false);
    expect(r.sharedWeak.map((e) => `${e.scheme}:${e.value}`).sort()).toEqual([
      'email_domain:kittering-bay.example',
      'iban:GB82WEST12345698765432',
      'phone:+442079460123',
    ]);
    expect(r.explanation.filter((line) => line.includes('review only'))).toHaveLength(3);
    expect(r.explanation.join('\n')).toMatch(/gmail\.com is a free-mail provider/);
  });
  it('a shared postal address (folded) is weak evidence too', () => {
    // Invented addresses.
    expect(normaliseAddress('12 Harbour Street, Suite 4')).toBe('12 harbour st ste 4');
    expect(normaliseAddress('Hauptstraße 5')).toBe(normaliseAddress('Hauptstr. 5'));
    const r = compareIdentifiers([], [], { addresses: { a: '12 Harbour Street, Suite 4', b: '12 harbour st. ste 4' } });
    expect(r.sharedWeak).toEqual([{ scheme: 'address', value: '12 harbour st ste 4' }]);
    expect(r.decisive).toBe(false);
    expect(r.explanation).toEqual(['shared address 12 harbour st ste 4: same or affiliated, review only']);
    expect(compareIdentifiers([], [], { addresses: { a: '12 Harbour Street', b: '14 Harbour Street' } }).sharedWeak).toEqual([]);
  });
  it('strong schemes are those of the vocabulary', () => {
    expect([...STRONG_SCHEMES]).toContain('lei');
    expect(STRONG_SCHEMES.has('phone')).toBe(false);
  });
});
