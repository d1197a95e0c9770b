/** Shared set-up for the /v1 suites: an app over the test database and one key per scope. */
import type { FastifyInstance, InjectOptions, LightMyRequestResponse } from 'fastify';
import type { Kysely } from 'kysely';
import { buildApp } from '../../../services/api/app.ts';
import { createApiKey } from '../../../services/api/auth/keys.ts';
import type { Database } from '../../../db/types.ts';
import type { ApiScope } from '../../../resolvers/vocabulary.ts';

export interface KeyedApp {
  app: FastifyInstance;
  keys: Record<ApiScope, string>;
  call(scope: ApiScope | null, options: InjectOptions): Promise<LightMyRequestResponse>;
}

export async function keyedApp(db: Kysely<Database>, backend: 'pglite' | 'postgres', extra: { rateLimitPerMinute?: number | false } = {}): Promise<KeyedApp> {
  const app = await buildApp({ db, backend, rateLimitPerMinute: extra.rateLimitPerMinute ?? false });
  const keys = {} as Record<ApiScope, string>;
  for (const scope of ['read', 'write', 'admin'] as const) {
    keys[scope] = (await createApiKey(db, { scope, label: `test ${scope} ${Math.random().toString(36).slice(2, 8)}` })).secret;
  }
  return {
    app,
    keys,
    call: (scope, options) => app.inject({ ...options, headers: { ...(options.headers ?? {}), ...(scope ? { authorization: `Bearer ${keys[scope]}` } : {}) } }),
  };
}
