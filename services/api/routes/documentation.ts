/**
 * GET /openapi.json (generated from the route schemas by @fastify/swagger), GET /docs (a page that browses it) and
 * GET /docs/errors (the error catalogue, docs/errors.md, as a page).
 */
import { DOCS_PAGE } from '../docs-page.ts';
import { errorsPage } from '../errors-page.ts';
import type { RoutePlugin } from '../types.ts';

export const documentationRoutes: RoutePlugin = (app) => {
  app.get('/openapi.json', { schema: { hide: true } }, async () => app.swagger());
  app.get('/docs', { schema: { hide: true } }, async (_request, reply) =>
    reply
      .type('text/html; charset=utf-8')
      // The page's only script is inline and it fetches /openapi.json from this origin; nothing else loads.
      .header('content-security-policy', "default-src 'none'; script-src 'unsafe-inline'; style-src 'unsafe-inline'; connect-src 'self'; img-src 'self' data:")
      .send(DOCS_PAGE),
  );
  const errors = errorsPage();
  app.get('/docs/errors', { schema: { hide: true } }, async (_request, reply) =>
    reply.type('text/html; charset=utf-8').header('content-security-policy', "default-src 'none'; style-src 'unsafe-inline'; img-src data:").send(errors),
  );
};
