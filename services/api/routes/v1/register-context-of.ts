/** The register context the /v1 routes act through. */
import { createRegisterContext, type RegisterContext } from '../../../register/context.ts';
import type { AppDeps } from '../../types.ts';

const contexts = new WeakMap<object, RegisterContext>();
/** One register context per database handle (it holds no request state). */
export function registerContextOf(deps: AppDeps): RegisterContext {
  let ctx = contexts.get(deps.db);
  if (!ctx) {
    ctx = createRegisterContext(deps.db);
    contexts.set(deps.db, ctx);
  }
  return ctx;
}
