/**
 * The query parser keeps a percent-sequence that is not UTF-8 (`%ED%A0%80`, the CESU-8 bytes of a lone
 * surrogate; `%FF`) as its raw text, so the route would see and store "%ED%A0%80" as if the caller had meant it.
 * The raw query string is decoded strictly here: the first parameter that does not decode is named.
 */
function decodes(text: string): boolean {
  try {
    decodeURIComponent(text.replaceAll('+', ' '));
    return true;
  } catch {
    return false;
  }
}

function pointerToken(name: string): string {
  return name.replaceAll('~', '~0').replaceAll('/', '~1');
}

/** The first query parameter of `url` whose name or value is not percent-encoded UTF-8, or undefined. */
export function queryEncodingProblem(url: string): { pointer: string; message: string } | undefined {
  const at = url.indexOf('?');
  if (at < 0) return undefined;
  for (const pair of url.slice(at + 1).split('&')) {
    const eq = pair.indexOf('=');
    const name = eq < 0 ? pair : pair.slice(0, eq);
    const value = eq < 0 ? '' : pair.slice(eq + 1);
    if (!decodes(name)) return { pointer: '', message: 'has a parameter name that is not percent-encoded UTF-8' };
    if (!decodes(value)) {
      return {
        pointer: `/${pointerToken(decodeURIComponent(name.replaceAll('+', ' ')))}`,
        message: 'is not percent-encoded UTF-8 (a lone surrogate or a broken byte sequence)',
      };
    }
  }
  return undefined;
}
