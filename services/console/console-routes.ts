/**
 * The review console: static files (plain ES modules, HTML, CSS; no build step) served at /console/ from
 * services/console/static/. An open route (open-routes.ts): the page itself holds no data; every call it makes
 * goes to the public /v1 API with the key the person signs in with.
 */
import { fileURLToPath } from 'node:url';
import fastifyStatic from '@fastify/static';
import type { FastifyInstance } from 'fastify';

export const CONSOLE_PREFIX = '/console/';
export const CONSOLE_ROOT = fileURLToPath(new URL('./static/', import.meta.url));

// The console loads only its own files and talks only to this origin.
const CONTENT_SECURITY_POLICY =
  "default-src 'none'; script-src 'self'; style-src 'self'; connect-src 'self'; img-src 'self' data: blob:; font-src 'self'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

export async function consoleRoutes(app: FastifyInstance): Promise<void> {
  await app.register(fastifyStatic, {
    root: CONSOLE_ROOT,
    prefix: CONSOLE_PREFIX,
    index: 'index.html',
    // Plain modules change with the code: revalidate each time rather than cache for a day.
    cacheControl: true,
    maxAge: 0,
    setHeaders: (response) => {
      response.setHeader('content-security-policy', CONTENT_SECURITY_POLICY);
      response.setHeader('x-content-type-options', 'nosniff');
      response.setHeader('referrer-policy', 'no-referrer');
    },
  });
  app.get('/console', { schema: { hide: true } }, async (_request, reply) => reply.redirect(CONSOLE_PREFIX, 308));
}
