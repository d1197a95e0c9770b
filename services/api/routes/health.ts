/** GET /healthz: is the service up and does its database answer (within the database timeout)? */
import { withDatabaseTimeout } from '../../../db/database-errors.ts';
import { schemaState } from '../../../db/migrate.ts';
import { ping } from '../../../db/queries/ping.ts';
import { ApiError, problemResponses } from '../errors.ts';
import { DEFAULT_DB_TIMEOUT_MS, type RoutePlugin } from '../types.ts';

export const healthRoutes: RoutePlugin = (app, deps) => {
  const timeoutMs = deps.dbTimeoutMs ?? DEFAULT_DB_TIMEOUT_MS;
  app.get(
    '/healthz',
    {
      schema: {
        summary: 'Health of the service and its database',
        tags: ['service'],
        security: [],
        response: {
          200: {
            type: 'object',
            required: ['status', 'database'],
            properties: {
              status: { type: 'string', enum: ['ok'] },
              version: { type: 'string' },
              database: {
                type: 'object',
                required: ['backend', 'latencyMs'],
                properties: {
                  backend: { type: 'string', enum: ['pglite', 'postgres'] },
                  latencyMs: { type: 'number' },
                },
              },
            },
            example: { status: 'ok', version: '0.1.0', database: { backend: 'pglite', latencyMs: 1.2 } },
          },
          ...problemResponses(503),
        },
      },
    },
    async () => {
      const started = performance.now();
      try {
        await withDatabaseTimeout(ping(deps.db), timeoutMs);
      } catch (error) {
        throw new ApiError('DATABASE_UNAVAILABLE', `the ${deps.backend} database did not answer within ${timeoutMs} ms`, {
          headers: { 'retry-after': '5' },
          cause: error,
        });
      }
      const latencyMs = Math.round((performance.now() - started) * 10) / 10;
      // Answering is not enough: a database created again empty answers too, and every call would then fail.
      const schema = await withDatabaseTimeout(schemaState(deps.db), timeoutMs).catch(() => null);
      if (!schema?.upToDate) {
        const what = schema
          ? `${schema.missing.length} migration(s) not applied, ${schema.unknown.length} unknown to this service`
          : 'its migrations could not be read';
        throw new ApiError('SCHEMA_NOT_READY', `the ${deps.backend} database answers but its schema is not ready: ${what}; run \`cpreg migrate\``, {
          headers: { 'retry-after': '5' },
        });
      }
      return { status: 'ok', version: deps.version, database: { backend: deps.backend, latencyMs } };
    },
  );
};
