/**
 * App-wide plugins: they run on the root fastify instance, in this order, before any route is
 * registered, so their hooks apply to every route (authentication, rate limits, idempotency…).
 * To add one: create plugins/<name>.ts exporting an AppPlugin and add ONE line below.
 * Open routes (open-routes.ts) must stay reachable without a key.
 */
import type { AppPlugin } from '../types.ts';
import { authPlugin } from '../auth/plugin.ts';
import { idempotencyPlugin } from '../auth/idempotency.ts';
import { wellFormedTextPlugin } from './well-formed-text.ts';
import { bodyDepthPlugin } from './body-depth.ts';

export const APP_PLUGINS: AppPlugin[] = [authPlugin, idempotencyPlugin, bodyDepthPlugin, wellFormedTextPlugin];
