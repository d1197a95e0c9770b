/**
 * buildApp(deps): the cpreg HTTP API as a fastify instance, without listening (tests use inject;
 * `cpreg serve` calls listen). Order matters:
 *   1. error handling, the shared Problem schema, request ids;
 *   2. @fastify/swagger (it must see every route that follows);
 *   3. app-wide plugins (plugins/index.ts: authentication, limits…);
 *   4. route plugins (routes/index.ts, then deps.routes).
 */
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import Fastify, { LogController, type FastifyInstance, type FastifyServerOptions, type RouteOptions } from 'fastify';
import swagger from '@fastify/swagger';
import { operationIdOf } from './operation-ids.ts';
import { PROBLEM_SCHEMA, problemResponses } from './errors.ts';
import { registerErrorHandling } from './error-handler.ts';
import { MAX_PATH_PARAMETER_LENGTH, frameworkErrors } from './framework-errors.ts';
import { clientErrorHandler } from './client-error-handler.ts';
import { useStrictJsonParser } from './body/strict-json.ts';
import { buildValidatorFactory } from './validation.ts';
import { loggerOptions } from './logger.ts';
import { APP_PLUGINS } from './plugins/index.ts';
import { ROUTES } from './routes/index.ts';
import { OPEN_ROUTES } from './open-routes.ts';
import { consoleRoutes } from '../console/console-routes.ts';
import { DEFAULT_BODY_LIMIT, type AppDeps } from './types.ts';

export type { AppDeps, RoutePlugin, AppPlugin } from './types.ts';

const REQUEST_ID = /^[\w.:-]{1,128}$/;

export function packageVersion(): string {
  const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version?: string };
  return pkg.version ?? '0.0.0';
}

export async function buildApp(inputDeps: AppDeps): Promise<FastifyInstance> {
  const deps: AppDeps = { ...inputDeps, version: inputDeps.version ?? packageVersion() };
  const app = Fastify({
    ...loggingOptions(deps.logger),
    bodyLimit: deps.bodyLimit ?? DEFAULT_BODY_LIMIT,
    // A caller's X-Request-Id is kept when it is short and plain, so logs can be joined across systems.
    requestIdHeader: false,
    genReqId: (request) => {
      const given = request.headers['x-request-id'];
      return typeof given === 'string' && REQUEST_ID.test(given) ? given : randomUUID();
    },
    logController: new LogController({ requestIdLogLabel: 'requestId' }),
    schemaController: { compilersFactory: { buildValidator: buildValidatorFactory() as never } },
    routerOptions: { maxParamLength: MAX_PATH_PARAMETER_LENGTH },
    // Errors raised before a route runs (bad path encoding, HTTP framing, oversized headers) are problem+json too.
    frameworkErrors: frameworkErrors as never,
    clientErrorHandler,
  });

  registerErrorHandling(app);
  // fastify parses text/plain bodies into a string by default, which the schema then refused as
  // "(root) must be object" (422); no route takes plain text, so such a body is now 415 UNSUPPORTED_MEDIA_TYPE.
  app.removeContentTypeParser('text/plain');
  // JSON bodies must be UTF-8 to the last byte (body/strict-json.ts): fastify's own parser decoded ill-formed
  // bytes to U+FFFD, which was then stored.
  useStrictJsonParser(app);
  app.addSchema(PROBLEM_SCHEMA);
  app.addHook('onRequest', async (request, reply) => {
    reply.header('x-request-id', request.id);
  });
  app.addHook('onRoute', documentCommonProblems);

  await app.register(swagger, {
    openapi: {
      openapi: '3.0.3',
      info: {
        title: 'cpreg',
        version: deps.version!,
        description:
          'Counterparty register: links the party names found in contracts to one canonical record per company or person. ' +
          'Errors are RFC 9457 problem details (application/problem+json) with a stable `code`, each explained in the error catalogue served at /docs/errors. ' +
          `Open routes (no API key): ${OPEN_ROUTES.join(', ')}.`,
      },
      components: {
        securitySchemes: { apiKey: { type: 'http', scheme: 'bearer', description: 'An API key: Authorization: Bearer <key>' } },
      },
      security: [{ apiKey: [] }],
    },
    // Shared schemas appear under their own $id (e.g. components.schemas.Problem), not as def-0.
    refResolver: {
      buildLocalReference: (json, _baseUri, _fragment, i) => (typeof json.$id === 'string' ? json.$id : `def-${i}`),
    },
  });

  for (const plugin of APP_PLUGINS) await plugin(app, deps);
  for (const plugin of [...ROUTES, ...(deps.routes ?? [])]) {
    await app.register(async (scope) => {
      await plugin(scope, deps);
    });
  }
  // The review console's static files at /console/ (an open route; the page calls /v1 with the user's key).
  await app.register(consoleRoutes);
  return app;
}

function loggingOptions(logger: AppDeps['logger']): Pick<FastifyServerOptions, 'logger' | 'loggerInstance'> {
  if (logger === undefined || logger === false) return { logger: false };
  if (typeof (logger as { child?: unknown }).child === 'function') {
    return { loggerInstance: logger as FastifyServerOptions['loggerInstance'] };
  }
  return { logger: { ...loggerOptions(), ...(logger as object) } };
}

/**
 * Adds the problems every documented route can answer to its response schema, so that /openapi.json
 * lists them without each route repeating them, and the route's operationId (services/api/operation-ids.ts).
 */
function documentCommonProblems(route: RouteOptions): void {
  const schema = route.schema as (Record<string, unknown> & { hide?: boolean; response?: Record<string, unknown> }) | undefined;
  if (!schema || schema.hide) return;
  const hasInput = Boolean(schema.body || schema.querystring || schema.params || schema.headers);
  const statuses = [500, 503];
  if (hasInput) statuses.push(422);
  if (schema.body) statuses.push(400, 413, 415);
  const common = problemResponses(...statuses);
  schema.response = { ...common, ...(schema.response ?? {}) };
  // HEAD routes fastify adds share the GET's schema and have no entry: the GET's id stays.
  const operationId = operationIdOf(Array.isArray(route.method) ? route.method[0]! : route.method, route.url);
  if (operationId && schema.operationId === undefined) schema.operationId = operationId;
}
