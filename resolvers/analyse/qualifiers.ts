/**
 * Parenthesised qualifiers ("Goldline (Europe) Ltd", "Marlow Credit Union (Bristol)"): kept apart from the
 * core name. Returns the text with each balanced top-level group blanked out, and the groups' contents.
 * Unbalanced brackets are left in place (they become word breaks in normalisation).
 */
export function extractQualifiers(text: string): { rest: string; groups: string[] } {
  if (text.indexOf('(') < 0 && text.indexOf('[') < 0) return { rest: text, groups: [] };
  const groups: string[] = [];
  const lastClose = { '(': text.lastIndexOf(')'), '[': text.lastIndexOf(']') };
  let rest = '';
  let depth = 0;
  let groupStart = -1;
  let closer = '';
  for (let i = 0; i < text.length; i++) {
    const c = text[i] as string;
    if (depth === 0 && (c === '(' || c === '[')) {
      const close = c === '(' ? ')' : ']';
      if (lastClose[c] < i) {
        rest += ' ';
        continue;
      }
      depth = 1;
      groupStart = i + 1;
      closer = close;
      rest += ' ';
      continue;
    }
    if (depth > 0) {
      if (c === (closer === ')' ? '(' : '[')) depth++;
      else if (c === closer) {
        depth--;
        if (depth === 0) groups.push(text.slice(groupStart, i));
      }
      continue;
    }
    rest += c;
  }
  if (depth > 0) rest += text.slice(groupStart); // an unclosed group: its text stays in the name
  return { rest, groups };
}

/** The offset where a trailing parenthesised group starts ("… Union (Bristol)" → index of "("), or -1. */
export function trailingGroupStart(text: string, end: number): number {
  let e = end;
  while (e > 0 && isSpaceOrComma(text.charCodeAt(e - 1))) e--;
  if (e === 0 || text[e - 1] !== ')') return -1;
  let depth = 0;
  for (let i = e - 1; i >= 0; i--) {
    const c = text[i];
    if (c === ')') depth++;
    else if (c === '(') {
      depth--;
      if (depth === 0) return i;
    }
  }
  return -1;
}

function isSpaceOrComma(code: number): boolean {
  return code === 0x20 || code === 0x2c || code === 0x09 || code === 0xa0 || code === 0x2e;
}
