/** Lower case for ASCII letters only: the result has the same length, so indices found in it hold in the original. */
export function asciiLower(s: string): string {
  return s.replace(/[A-Z]/g, (c) => c.toLowerCase());
}
