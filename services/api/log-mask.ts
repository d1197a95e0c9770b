/**
 * Masking of sensitive values in log lines: API keys, IBANs and phone numbers never appear in full, and the
 * values of a URL's query string (search terms are names, identifiers, cursors) are not logged at all.
 * Used by logger.ts for every message, the request line and serialised errors.
 */

// Linear patterns (no nested quantifiers over overlapping classes).
const API_KEY = /\bcpreg_(k[0-9a-f]+)_[\w-]+/g;
/** ISO 13616 shape: country, two check digits, 11 to 30 letters or digits, optionally in groups with spaces. */
const IBAN = /\b([A-Z]{2})\d{2}(?: ?[A-Z0-9]){11,30}\b/g;
/** E.164 shape: a plus and 7 or more digits (longer runs are masked too: an invalid number is still personal). */
const PHONE = /\+\d{7,}/g;

export function maskSensitive(text: string): string {
  return text
    .replace(API_KEY, 'cpreg_$1_[redacted]')
    .replace(IBAN, (whole, country: string) => `${country}..[iban redacted]..${whole.replace(/ /g, '').slice(-2)}`)
    .replace(PHONE, (whole) => `+..[phone redacted]..${whole.slice(-2)}`);
}

/** A request URL for the log: the path masked, each query value replaced. */
export function maskUrl(url: string): string {
  const at = url.indexOf('?');
  const path = maskSensitive(at < 0 ? url : url.slice(0, at));
  if (at < 0) return path;
  const names = url
    .slice(at + 1)
    .split('&')
    .filter((pair) => pair !== '')
    .map((pair) => `${maskSensitive(pair.split('=')[0] ?? '')}=[redacted]`);
  return `${path}?${names.join('&')}`;
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
