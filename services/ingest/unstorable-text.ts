/**
 * Text PostgreSQL cannot store: a lone UTF-16 surrogate (JSON allows "\ud800"; text and jsonb refuse it) and the NUL
 * character (text cannot hold U+0000). Found iteratively (a deeply nested value cannot overflow the stack), keys
 * included, in parsed JSON only. Used at the API's door (services/api/plugins/well-formed-text.ts), and by
 * `cpreg ingest` and the job staging, which refuse such a row by its line instead of failing the whole run.
 */
export function problemOf(text: string): string | undefined {
  if (text.includes('\u0000')) return 'contains the NUL character (U+0000), which cannot be stored';
  if (!(text as string & { isWellFormed(): boolean }).isWellFormed()) return 'is not well-formed Unicode (a lone UTF-16 surrogate)';
  return undefined;
}

function escapeToken(token: string): string {
  return token.replaceAll('~', '~0').replaceAll('/', '~1');
}

/**
 * Parsed JSON only: a streamed body (an NDJSON upload arrives as the request stream, whose objects refer to each
 * other in cycles) is checked line by line by its route, never walked here.
 */
function isPlainObject(v: unknown): v is Record<string, unknown> {
  if (v === null || typeof v !== 'object') return false;
  const proto = Object.getPrototypeOf(v) as unknown;
  return proto === Object.prototype || proto === null;
}

/** The first ill-formed string or key in `value`, as a JSON pointer and a message. */
export function findUnstorableText(value: unknown): { pointer: string; message: string } | undefined {
  const stack: { value: unknown; pointer: string }[] = [{ value, pointer: '' }];
  while (stack.length > 0) {
    const { value: v, pointer } = stack.pop()!;
    if (typeof v === 'string') {
      const message = problemOf(v);
      if (message) return { pointer, message };
    } else if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push({ value: v[i], pointer: `${pointer}/${i}` });
    } else if (isPlainObject(v)) {
      for (const [key, child] of Object.entries(v)) {
        const keyProblem = problemOf(key);
        if (keyProblem) return { pointer: `${pointer}/${escapeToken(key.replace(/[\0\ud800-\udfff]/g, '?'))}`, message: `the key ${keyProblem}` };
        stack.push({ value: child, pointer: `${pointer}/${escapeToken(key)}` });
      }
    }
  }
  return undefined;
}

/** Why a mapped row cannot be stored, naming the field (`field /text contains the NUL character …`); undefined when it can. */
export function unstorableRowReason(value: unknown): string | undefined {
  const found = findUnstorableText(value);
  return found ? `field ${found.pointer} ${found.message}` : undefined;
}
