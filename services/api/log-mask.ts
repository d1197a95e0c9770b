/**
 * Masking of sensitive values in log lines: API keys, e-mail addresses, IBANs (in either letter case) and phone
 * numbers (international or national, with spaces, dots, dashes or brackets) never appear in full, and the
 * values of a URL's query string (search terms are names, identifiers, cursors) are not logged at all.
 * Used by logger.ts for every message, the request line and serialised errors.
 */

// Linear patterns (no nested quantifiers over overlapping classes).
const API_KEY = /\bcpreg_(k[0-9a-f]+)_[\w-]+/g;
/** An e-mail address (RFC 5322's common shape): the whole address is personal. */
const EMAIL = /[\w.+-]{1,64}@[\w-]{1,63}(?:\.[\w-]{1,63}){1,8}/g;
/** ISO 13616 shape, in any case: country, two check digits, 11 to 30 letters or digits, written whole or in groups of four. */
const IBAN = /\b([A-Z]{2})\d{2}(?:[A-Z0-9]{11,30}|(?: [A-Z0-9]{4}){2,7}(?: [A-Z0-9]{1,3})?)\b/gi;
/**
 * A phone number: international (a plus, then digit groups separated by one space, dot or dash, or bracketed, as
 * E.164 numbers are printed) or national (a leading 0 or a bracketed area code). Masked when it holds 7 or more
 * digits (international) or 9 or more (national), so that dates and ids are left alone.
 */
const PHONE_INTERNATIONAL = /\+\d{1,4}(?:[ .-]?\(?\d{1,5}\)?){1,8}/g;
const PHONE_NATIONAL = /(?<![\w+])(?:\(0\d{1,5}\)|0\d{1,5})(?:[ .-]?\d{2,5}){1,5}\b/g;

const digits = (text: string): number => text.replace(/\D/g, '').length;

export function maskSensitive(text: string): string {
  return text
    .replace(API_KEY, 'cpreg_$1_[redacted]')
    .replace(EMAIL, '[email redacted]')
    .replace(IBAN, (whole, country: string) => `${country.toUpperCase()}..[iban redacted]..${whole.replace(/ /g, '').slice(-2)}`)
    .replace(PHONE_INTERNATIONAL, (whole) => (digits(whole) >= 7 ? `+..[phone redacted]..${whole.replace(/\D/g, '').slice(-2)}` : whole))
    .replace(PHONE_NATIONAL, (whole) => (digits(whole) >= 9 ? `0..[phone redacted]..${whole.replace(/\D/g, '').slice(-2)}` : whole));
}

/** A request URL for the log: the path masked, each query value replaced. */
export function maskUrl(url: string): string {
  const at = url.indexOf('?');
  const path = maskSensitive(decodedForMasking(at < 0 ? url : url.slice(0, at)));
  if (at < 0) return path;
  const names = url
    .slice(at + 1)
    .split('&')
    .filter((pair) => pair !== '')
    .map((pair) => `${maskSensitive(pair.split('=')[0] ?? '')}=[redacted]`);
  return `${path}?${names.join('&')}`;
}

/** A path percent-decoded so that an encoded value (an e-mail's %40) is seen; left as it is when malformed. */
function decodedForMasking(path: string): string {
  try {
    return decodeURIComponent(path);
  } catch {
    return path;
  }
}

interface RequestLike {
  method?: string;
  url?: string;
  host?: string;
  hostname?: string;
  ip?: string;
  socket?: { remoteAddress?: string; remotePort?: number };
}

/** The request line fastify logs, with the URL masked. */
export function maskedRequest(req: RequestLike): Record<string, unknown> {
  return {
    method: req.method,
    url: req.url === undefined ? undefined : maskUrl(req.url),
    host: req.host ?? req.hostname,
    remoteAddress: req.ip ?? req.socket?.remoteAddress,
  };
}

/** An error for the log: its type, code, masked message and stack; no driver parameters (they hold the row). */
export function maskedError(err: unknown): Record<string, unknown> {
  if (!(err instanceof Error)) return { message: maskSensitive(String(err)) };
  const e = err as Error & { code?: unknown; statusCode?: unknown };
  return {
    type: e.name,
    message: maskSensitive(e.message),
    stack: e.stack === undefined ? undefined : maskSensitive(e.stack),
    ...(e.code !== undefined ? { code: e.code } : {}),
    ...(e.statusCode !== undefined ? { statusCode: e.statusCode } : {}),
  };
}
