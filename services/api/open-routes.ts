/**
 * Routes anyone may call without an API key. Everything else needs a key (the authentication hook
 * of the public interface consults isOpenRoute). Keep this list short and explicit.
 */
export const OPEN_ROUTES: readonly string[] = ['/healthz', '/openapi.json', '/docs', '/docs/errors', '/console', '/console/*'];

/** `url` is a route pattern (request.routeOptions.url) or a path; query strings are ignored. */
export function isOpenRoute(url: string): boolean {
  const path = url.split('?')[0] ?? '';
  return OPEN_ROUTES.some((open) => (open.endsWith('/*') ? path.startsWith(open.slice(0, -1)) : path === open));
}
