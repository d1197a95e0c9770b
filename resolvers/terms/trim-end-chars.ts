/** `s` without any of `chars` at its end ("Tarrant." → "Tarrant"): a loop, where a regex would backtrack. */
export function trimEndChars(s: string, chars: string): string {
  let e = s.length;
  while (e > 0 && chars.includes(s[e - 1] as string)) e--;
  return s.slice(0, e);
}
