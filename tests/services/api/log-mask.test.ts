/**
 * maskSensitive on each shape of personal value a log line may quote, and on values that must stay readable.
 * The phone numbers are in ranges reserved for fiction (UK 020 7946 0xxx per Ofcom, US 555-01xx; both from
 * memory); the IBAN is the IBAN registry's GB example (from memory); the e-mail domain is reserved (RFC 2606).
 */
import { describe, expect, it } from 'vitest';
import { maskSensitive } from '../../../services/api/log-mask.ts';

describe('maskSensitive', () => {
  it.each([['+442079460958'], ['+44 20 7946 0958'], ['+44-20-7946-0958'], ['+1 (212) 555-0100'], ['(020) 7946 0958'], ['020 7946 0958'], ['020.7946.0958']])(
    'masks the phone number %s',
    (phone) => {
      const masked = maskSensitive(`call ${phone} today`);
      expect(masked).toContain('[phone redacted]');
      expect(masked).not.toContain('7946');
      expect(masked).not.toContain('555');
    },
  );

  it('masks an IBAN in either case and grouping, keeping the country and the last two characters', () => {
    for (const iban of ['GB82WEST12345698765432', 'gb82west12345698765432', 'GB82 WEST 1234 5698 7654 32']) {
      expect(maskSensitive(`pay ${iban} now`)).toBe('pay GB..[iban redacted]..32 now');
    }
  });

  it('masks an e-mail address whole', () => {
    expect(maskSensitive('sent to ap.team+invoices@ledger.example.org twice')).toBe('sent to [email redacted] twice');
  });

  it('leaves dates, times, versions, ids and short numbers alone', () => {
    for (const text of ['2026-12-04T21:33:51.512Z', 'took 0.25 ms', 'v0.1.0', 'mention 12345 of 67', 'id 0123', 'row 42, line 7']) {
      expect(maskSensitive(text)).toBe(text);
    }
  });
});
