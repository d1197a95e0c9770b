/** What every /v1 route plugin calls first. */
import type { FastifyError, FastifyInstance } from 'fastify';
import { type RegisterContext } from '../../../register/context.ts';
import { RegisterError } from '../../../register/errors.ts';
import type { AppDeps } from '../../types.ts';
import { registerContextOf } from './register-context-of.ts';
import { toApiError } from './to-api-error.ts';

/**
 * Call at the top of a /v1 route plugin: register errors become problems (the error handler of the root
 * answers them). Throwing from a child error handler hands the error to the parent's.
 */
export function v1Scope(app: FastifyInstance, deps: AppDeps): RegisterContext {
  app.setErrorHandler((error: FastifyError | RegisterError, _request, _reply) => {
    if (error instanceof RegisterError) throw toApiError(error);
    throw error;
  });
  return registerContextOf(deps);
}
