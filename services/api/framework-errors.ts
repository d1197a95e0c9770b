/**
 * Errors fastify raises before any route, hook or error handler runs (fastify's `frameworkErrors` option): a path
 * whose percent-encoding is not UTF-8 and a path parameter longer than the router takes. Without this option
 * fastify answers them with its own `{"error":…}` JSON instead of a problem document. The caller's path is not
 * repeated (fastify's own message quotes it).
 */
import type { FastifyError, FastifyReply, FastifyRequest } from 'fastify';
import { problem } from './errors.ts';
import { sendProblem } from './error-handler.ts';

/** The router refuses a path parameter longer than this (fastify's maxParamLength): 414 URI_TOO_LONG. */
export const MAX_PATH_PARAMETER_LENGTH = 100;

export function frameworkErrors(error: FastifyError, request: FastifyRequest, reply: FastifyReply): void {
  request.log.info({ code: error.code }, 'request refused by the router');
  if (error.code === 'FST_ERR_MAX_PARAM_LENGTH') {
    sendProblem(
      reply,
      problem('URI_TOO_LONG', `a path parameter is longer than ${MAX_PATH_PARAMETER_LENGTH} characters`, undefined, {
        limitCharacters: MAX_PATH_PARAMETER_LENGTH,
      }),
    );
    return;
  }
  if (error.code === 'FST_ERR_BAD_URL') {
    sendProblem(reply, problem('BAD_REQUEST', 'the path is not percent-encoded UTF-8 (a broken byte sequence or a lone surrogate)'));
    return;
  }
  sendProblem(reply, problem('BAD_REQUEST', 'the request cannot be routed'));
}
