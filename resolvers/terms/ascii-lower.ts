/** Lower case for ASCII letters only: the result has the same length, so indices found in it hold in the original. */
export function asciiLower(s: string): string {
  // ASCII-only text (the usual case) lower-cases natively at the same length; other text letter by letter.
  // eslint-disable-next-line no-control-regex -- the whole ASCII range is meant
  if (!/[^\x00-\x7f]/u.test(s)) return s.toLowerCase();
  return s.replace(/[A-Z]/g, (c) => c.toLowerCase());
}
