/** GET /v1/me (any key) and the key administration routes (admin): list, create (secret shown once), revoke. */
import { API_SCOPES, type ApiScope } from '../../../../resolvers/vocabulary.ts';
import { createApiKey, getApiKey, listApiKeys, revokeApiKey, MAX_LABEL_LENGTH } from '../../auth/keys.ts';
import { ApiError, problemResponses } from '../../errors.ts';
import type { RoutePlugin } from '../../types.ts';
import { v1Scope } from './v1-scope.ts';

const KEY_OUT = {
  type: 'object',
  required: ['id', 'label', 'scope', 'createdAt'],
  properties: {
    id: { type: 'string' },
    label: { type: 'string' },
    scope: { type: 'string', enum: [...API_SCOPES] },
    createdAt: { type: 'string' },
    revokedAt: { type: 'string', nullable: true },
    lastUsedAt: { type: 'string', nullable: true },
  },
  example: { id: 'k3f9a1c2b7d40', label: 'contract system', scope: 'write', createdAt: '2026-12-01T09:00:00.000Z', revokedAt: null, lastUsedAt: null },
} as const;

/** Said by a replay of POST /v1/keys (an Idempotency-Key retry), whose answer holds no secret. */
export const SECRET_WITHHELD_DETAIL =
  'this key was created by the first request with this Idempotency-Key; its secret was shown once, in that answer, and is stored only hashed: if it was lost, revoke this key and create another';

/** What a replay of POST /v1/keys answers: the created key's id and metadata, never its secret. */
export function createdKeyReplay(body: unknown): unknown {
  if (typeof body !== 'object' || body === null) return body;
  const { secret: _secret, ...metadata } = body as Record<string, unknown>;
  return { ...metadata, secretWithheld: true, detail: SECRET_WITHHELD_DETAIL };
}

const ALLOWS: Record<ApiScope, string[]> = {
  read: ['read'],
  write: ['read', 'ingest', 'resolve', 'post_contracts'],
  admin: [
    'read',
    'ingest',
    'resolve',
    'post_contracts',
    'merge',
    'split',
    'undo',
    'decide_reviews',
    'edit_counterparties',
    'manage_own_entities',
    'manage_keys',
  ],
};

export const keyRoutes: RoutePlugin = (app, deps) => {
  v1Scope(app, deps);
  app.get(
    '/v1/me',
    {
      config: { scope: 'read' },
      schema: {
        summary: "The calling key's id, label and scope, and what the scope allows",
        tags: ['keys'],
        response: {
          200: {
            type: 'object',
            properties: {
              keyId: { type: 'string' },
              label: { type: 'string' },
              scope: { type: 'string', enum: [...API_SCOPES] },
              allows: { type: 'array', items: { type: 'string' } },
            },
            example: { keyId: 'k3f9a1c2b7d40', label: 'legal operations (admin key)', scope: 'admin', allows: ALLOWS.admin },
          },
        },
      },
    },
    async (request) => {
      const key = request.apiKey!;
      return { keyId: key.id, label: key.label, scope: key.scope, allows: ALLOWS[key.scope] };
    },
  );

  app.get<{ Querystring: { includeRevoked: boolean } }>(
    '/v1/keys',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'API keys (never their secrets)',
        tags: ['keys'],
        querystring: { type: 'object', additionalProperties: false, properties: { includeRevoked: { type: 'boolean', default: false } } },
        response: { 200: { type: 'object', properties: { items: { type: 'array', items: KEY_OUT } } } },
      },
    },
    async (request) => ({ items: await listApiKeys(deps.db, { includeRevoked: request.query.includeRevoked }) }),
  );

  app.post<{ Body: { scope: ApiScope; label: string } }>(
    '/v1/keys',
    {
      // The secret is shown once: an Idempotency-Key replay answers the key's metadata without it.
      config: { scope: 'admin', idempotentReplay: createdKeyReplay },
      schema: {
        summary: 'Create an API key: the answer holds the secret, shown this once (only its digest is stored)',
        description:
          'A retry with the same Idempotency-Key answers the same status and metadata without `secret`, with `secretWithheld: true` and a `detail`: the secret is never stored, so it cannot be shown again.',
        tags: ['keys'],
        body: {
          type: 'object',
          required: ['scope', 'label'],
          additionalProperties: false,
          properties: {
            scope: { type: 'string', enum: [...API_SCOPES] },
            label: { type: 'string', minLength: 1, maxLength: MAX_LABEL_LENGTH, description: 'the person or system the key is for' },
          },
          example: { scope: 'write', label: 'contract system' },
        },
        response: {
          201: {
            ...KEY_OUT,
            properties: {
              ...KEY_OUT.properties,
              secret: { type: 'string', description: 'the whole key, in the first answer only' },
              secretWithheld: { type: 'boolean', description: 'true in an Idempotency-Key replay, which holds no secret' },
              detail: { type: 'string', description: 'in a replay: why the secret is not in it' },
            },
            example: undefined,
          },
        },
      },
    },
    async (request, reply) => {
      const created = await createApiKey(deps.db, request.body);
      reply.code(201).header('location', `/v1/keys/${created.id}`).header('cache-control', 'no-store');
      return created;
    },
  );

  app.delete<{ Params: { keyId: string } }>(
    '/v1/keys/:keyId',
    {
      config: { scope: 'admin' },
      schema: {
        summary: 'Revoke an API key (at once, on every instance)',
        tags: ['keys'],
        params: { type: 'object', required: ['keyId'], properties: { keyId: { type: 'string', maxLength: 40 } } },
        response: { 200: KEY_OUT, ...problemResponses(404) },
      },
    },
    async (request) => {
      if (!(await getApiKey(deps.db, request.params.keyId))) throw new ApiError('NOT_FOUND', `API key ${request.params.keyId} does not exist`);
      return (await revokeApiKey(deps.db, request.params.keyId))!;
    },
  );
};
