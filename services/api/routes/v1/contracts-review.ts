/**
 * Contracts (post: write; read: read), review items (list: read; decide: admin) and the score statistics, registered
 * in this order (the order of the API description).
 */
import type { RoutePlugin } from '../../types.ts';
import { contractRoutes } from './contract-routes.ts';
import { reviewItemRoutes } from './review-item-routes.ts';
import { scoreStatsRoute } from './score-stats-route.ts';
import { v1Scope } from './v1-scope.ts';

export const contractReviewRoutes: RoutePlugin = (app, deps) => {
  const ctx = v1Scope(app, deps);
  contractRoutes(app, deps, ctx);
  reviewItemRoutes(app, deps, ctx);
  scoreStatsRoute(app, deps);
};
