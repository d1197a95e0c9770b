/**
 * Text the database cannot store is refused at the door with 422 and the field's pointer: a lone UTF-16
 * surrogate (JSON allows "\ud800"; PostgreSQL's text and jsonb refuse it) and the NUL character (PostgreSQL
 * text cannot hold U+0000). Without this they reached the database and answered 500. Checked for body,
 * query string and path parameters, keys included, iteratively (a deeply nested body cannot overflow the stack).
 */
import type { FastifyRequest } from 'fastify';
import { ApiError, type FieldError } from '../errors.ts';
import type { AppPlugin } from '../types.ts';

function problemOf(text: string): string | undefined {
  if (text.includes('\u0000')) return 'contains the NUL character (U+0000), which cannot be stored';
  if (!(text as string & { isWellFormed(): boolean }).isWellFormed()) return 'is not well-formed Unicode (a lone UTF-16 surrogate)';
  return undefined;
}

function escapeToken(token: string): string {
  return token.replaceAll('~', '~0').replaceAll('/', '~1');
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
    } else if (v !== null && typeof v === 'object') {
      for (const [key, child] of Object.entries(v)) {
        const keyProblem = problemOf(key);
        if (keyProblem) return { pointer: `${pointer}/${escapeToken(key.replace(/[\0\ud800-\udfff]/g, '?'))}`, message: `the key ${keyProblem}` };
        stack.push({ value: child, pointer: `${pointer}/${escapeToken(key)}` });
      }
    }
  }
  return undefined;
}

function check(request: FastifyRequest): void {
  const parts: [FieldError['in'], unknown][] = [['body', request.body], ['query', request.query], ['path', request.params]];
  for (const [where, value] of parts) {
    const found = findUnstorableText(value);
    if (found) {
      throw new ApiError('VALIDATION_FAILED', `${where} field ${found.pointer || '(the whole body)'} ${found.message}`, {
        errors: [{ pointer: found.pointer, message: found.message, in: where }],
      });
    }
  }
}

export const wellFormedTextPlugin: AppPlugin = (app) => {
  app.addHook('preValidation', async (request) => check(request));
};
