/**
 * Authentication, scopes and the per-key rate limit, app-wide (registered through plugins/index.ts).
 *
 * Every route under /v1 needs `Authorization: Bearer <key>`, and every route declares the scope it needs in
 * `config.scope` (read ⊆ write ⊆ admin); a /v1 route that forgets to declare one needs admin (fail closed).
 * Open routes (open-routes.ts) need nothing. The key itself never reaches a log line: the logger redacts the
 * Authorization header and only the key id is attached to the request log.
 */
import type { FastifyReply, FastifyRequest, RouteOptions } from 'fastify';
import type { ApiScope } from '../../../resolvers/vocabulary.ts';
import { ApiError } from '../errors.ts';
import { isOpenRoute } from '../open-routes.ts';
import type { AppPlugin } from '../types.ts';
import { scopeAllows, touchApiKey, verifyApiKey, type ApiKeyInfo } from './keys.ts';
import { DEFAULT_FAILED_AUTH_PER_MINUTE, DEFAULT_RATE_LIMIT_PER_MINUTE, RateLimiter } from './rate-limit.ts';

declare module 'fastify' {
  interface FastifyContextConfig {
    /** The scope a route needs (read, write or admin). */
    scope?: ApiScope;
  }
  interface FastifyRequest {
    /** The calling key, once authenticated. */
    apiKey: ApiKeyInfo | null;
  }
}

declare module '../types.ts' {
  interface AppDeps {
    /** Requests per minute per API key, per instance (default 1,200); false switches the limit off (benchmarks). */
    rateLimitPerMinute?: number | false;
    /** Failed authentications per client address per minute before 429 (default 30; off when rateLimitPerMinute is false). */
    failedAuthPerMinute?: number;
  }
}

/** The scope a route needs, or undefined for routes outside the keyed API. */
export function requiredScope(url: string | undefined, config: { scope?: ApiScope } | undefined): ApiScope | undefined {
  if (url === undefined || isOpenRoute(url)) return undefined;
  if (config?.scope) return config.scope;
  return url.startsWith('/v1/') || url === '/v1' ? 'admin' : undefined;
}

const SCOPE_WORDS: Record<ApiScope, string> = {
  read: 'read (any key)',
  write: 'write (write or admin keys)',
  admin: 'admin (admin keys only)',
};

function documentScope(route: RouteOptions): void {
  const scope = requiredScope(route.url, route.config as { scope?: ApiScope } | undefined);
  const schema = route.schema as (Record<string, unknown> & { description?: string; hide?: boolean }) | undefined;
  if (!scope || !schema || schema.hide) return;
  schema.description = `${schema.description ? `${schema.description}\n\n` : ''}Scope: ${SCOPE_WORDS[scope]}.`;
  (schema as Record<string, unknown>)['x-scope'] = scope;
  schema.security = [{ apiKey: [] }];
  const response = (schema.response ?? {}) as Record<string, unknown>;
  const problem = (codes: string) => ({ description: `Problem: ${codes}`, content: { 'application/problem+json': { schema: { $ref: 'Problem#' } } } });
  schema.response = { 401: problem('UNAUTHENTICATED'), 403: problem('FORBIDDEN'), 429: problem('RATE_LIMITED'), ...response };
}

function bearer(request: FastifyRequest): string | undefined {
  const header = request.headers.authorization;
  if (typeof header !== 'string') return undefined;
  const match = /^Bearer[ \t]+(\S+)[ \t]*$/i.exec(header);
  return match?.[1];
}

/** CPREG_RATE_LIMIT_PER_MINUTE: a whole number, or `off` (benchmarks); unset: the default. */
export function rateLimitFromEnv(value = process.env.CPREG_RATE_LIMIT_PER_MINUTE): number | false | undefined {
  if (value === undefined || value === '') return undefined;
  if (value === 'off') return false;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1) throw new Error(`CPREG_RATE_LIMIT_PER_MINUTE=${value}: expected a whole number of requests per minute, or off`);
  return n;
}

export const authPlugin: AppPlugin = (app, deps) => {
  const limit = deps.rateLimitPerMinute ?? rateLimitFromEnv() ?? DEFAULT_RATE_LIMIT_PER_MINUTE;
  const limiter = limit === false ? undefined : new RateLimiter({ perMinute: limit });
  // Failed authentications per client address (off with the rate limit).
  const failedAuth = limit === false ? undefined : new RateLimiter({ perMinute: deps.failedAuthPerMinute ?? DEFAULT_FAILED_AUTH_PER_MINUTE });
  const refuseGuessing = (decision: { retryAfterSeconds: number; limit: number }): ApiError =>
    new ApiError('RATE_LIMITED', `too many failed authentications from this address (${decision.limit} a minute); retry in ${decision.retryAfterSeconds} s`, {
      headers: { 'retry-after': String(decision.retryAfterSeconds) },
      extensions: { limit: decision.limit, limitPer: 'minute', retryAfterSeconds: decision.retryAfterSeconds },
    });
  app.decorateRequest('apiKey', null);
  app.addHook('onRoute', documentScope);
  app.addHook('onRequest', async (request: FastifyRequest, reply: FastifyReply) => {
    const scope = requiredScope(request.routeOptions.url, request.routeOptions.config as { scope?: ApiScope });
    if (!scope) return;
    const presented = bearer(request);
    if (!presented) {
      throw new ApiError('UNAUTHENTICATED', 'this route needs an API key: send Authorization: Bearer <key> (cpreg keys create)', {
        headers: { 'www-authenticate': 'Bearer realm="cpreg"' },
      });
    }
    const blocked = failedAuth?.refusal(request.ip);
    if (blocked) throw refuseGuessing(blocked);
    const key = await verifyApiKey(deps.db, presented);
    if (!key) {
      failedAuth?.take(request.ip);
      throw new ApiError('UNAUTHENTICATED', 'the API key is unknown or revoked', {
        headers: { 'www-authenticate': 'Bearer realm="cpreg", error="invalid_token"' },
      });
    }
    request.apiKey = key;
    request.log = request.log.child({ keyId: key.id });
    if (limiter) {
      const decision = limiter.take(key.id);
      reply.header('ratelimit-limit', String(decision.limit));
      reply.header('ratelimit-remaining', String(decision.remaining));
      if (!decision.allowed) {
        throw new ApiError(
          'RATE_LIMITED',
          `key ${key.id} exceeded its rate limit of ${decision.limit} requests per minute (per service instance); retry in ${decision.retryAfterSeconds} s`,
          {
            headers: { 'retry-after': String(decision.retryAfterSeconds) },
            extensions: { limit: decision.limit, limitPer: 'minute', retryAfterSeconds: decision.retryAfterSeconds },
          },
        );
      }
    }
    if (!scopeAllows(key.scope, scope)) {
      throw new ApiError('FORBIDDEN', `this route needs the ${scope} scope; key ${key.id} (${key.label}) has ${key.scope}`, {
        extensions: { requiredScope: scope, keyScope: key.scope },
      });
    }
    void touchApiKey(deps.db, key.id, new Date()).catch((error: unknown) => request.log.warn({ err: error }, 'could not record key use'));
  });
};
