/**
 * Every route plugin of the API, registered by buildApp in this order, each in its own scope.
 * To add routes: create routes/<name>.ts exporting a RoutePlugin (routes with JSON schemas, so that
 * /openapi.json documents them) and add ONE import and ONE array entry below.
 */
import type { RoutePlugin } from '../types.ts';
import { healthRoutes } from './health.ts';
import { documentationRoutes } from './documentation.ts';
import { V1_ROUTES } from './v1/index.ts';
import { forgetRoutes } from './forget.ts';

export const ROUTES: RoutePlugin[] = [healthRoutes, documentationRoutes, ...V1_ROUTES, forgetRoutes];
