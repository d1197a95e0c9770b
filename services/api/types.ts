/** What buildApp needs, and the shape of a route plugin. */
import type { FastifyInstance } from 'fastify';
import type { Jobs } from '../jobs/start-jobs.ts';
import type { Kysely } from 'kysely';
import type { Logger, LoggerOptions } from 'pino';
import type { Backend } from '../../db/open-database.ts';
import type { Database } from '../../db/types.ts';

/**
 * The service's dependencies. Later issues add their own fields here (one optional field each, with
 * a comment), or augment the interface from their module:
 *   declare module '../api/types.ts' { interface AppDeps { register?: Register } }
 */
export interface AppDeps {
  db: Kysely<Database>;
  backend: Backend;
  /** How long a request waits for the database before answering 503 (the service's --db-timeout). Default 5000. */
  dbTimeoutMs?: number;
  /** false (silent, the default for tests), LoggerOptions, or a pino logger to write to. */
  logger?: false | LoggerOptions | Logger;
  /** Default body limit in bytes for routes that set none (default 64 KiB). */
  bodyLimit?: number;
  /** Extra route plugins, registered after the built-in list (tests, experiments). */
  routes?: RoutePlugin[];
  /** Version shown in /openapi.json and /healthz (default: package.json's). */
  version?: string;
  /**
   * The job queue connection (services/jobs/start-jobs.ts) that POST /v1/jobs/ingest and /v1/jobs/sweep submit
   * to. Default: an in-process queue started with the app and stopped when it closes.
   */
  jobs?: Jobs;
}

/**
 * A route plugin: registers routes (with JSON schemas) on `app`. Each runs in its own encapsulated
 * fastify scope: hooks it adds apply to its own routes only. App-wide hooks (authentication, rate
 * limits) go in services/api/plugins/index.ts instead.
 */
export type RoutePlugin = (app: FastifyInstance, deps: AppDeps) => Promise<void> | void;

/** An app-wide plugin: the same shape as a route plugin, run on the root instance before any route is registered. */
export type AppPlugin = RoutePlugin;

export const DEFAULT_DB_TIMEOUT_MS = 5000;
export const DEFAULT_BODY_LIMIT = 64 * 1024;
