/**
 * Body nesting is limited on every route: a body nested deeper than MAX_BODY_DEPTH arrays and objects is refused
 * with 422 BODY_TOO_DEEP (member `maxDepth`) before validation, idempotency or any handler sees it. No cpreg body
 * needs more than a handful of levels; without a limit a 20,000-deep body that passed a route without a body
 * schema overflowed the stack in recursive code after it (the idempotency hash answered 500). The depth is
 * measured iteratively, on the parsed body, so it holds for every parser (JSON, the NDJSON batch's array).
 */
import { ApiError } from '../errors.ts';
import type { AppPlugin } from '../types.ts';

export const MAX_BODY_DEPTH = 32;

/** True when `value` nests arrays and objects deeper than `limit` levels (the outermost counts as 1). */
export function nestsDeeperThan(value: unknown, limit: number): boolean {
  const stack: { value: unknown; depth: number }[] = [{ value, depth: 1 }];
  while (stack.length > 0) {
    const { value: v, depth } = stack.pop()!;
    if (v === null || typeof v !== 'object') continue;
    if (depth > limit) return true;
    // Parsed JSON only: a streamed body (a Readable) is not walked (its fields refer to each other in cycles).
    const proto = Object.getPrototypeOf(v) as unknown;
    if (!Array.isArray(v) && proto !== Object.prototype && proto !== null) continue;
    for (const child of Object.values(v)) if (child !== null && typeof child === 'object') stack.push({ value: child, depth: depth + 1 });
  }
  return false;
}

export const bodyDepthPlugin: AppPlugin = (app) => {
  app.addHook('preValidation', async (request) => {
    if (nestsDeeperThan(request.body, MAX_BODY_DEPTH)) {
      throw new ApiError('BODY_TOO_DEEP', `the body nests arrays and objects deeper than ${MAX_BODY_DEPTH} levels`, {
        extensions: { maxDepth: MAX_BODY_DEPTH },
      });
    }
  });
};
