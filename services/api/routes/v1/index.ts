/** Every /v1 route plugin, in registration order (each runs in its own fastify scope). */
import type { RoutePlugin } from '../../types.ts';
import { counterpartyRoutes } from './counterparties.ts';
import { historyRoutes } from './history.ts';
import { keyRoutes } from './keys-me.ts';
import { upkeepRoutes } from './upkeep.ts';
import { mentionRoutes } from './mentions.ts';
import { contractReviewRoutes } from './contracts-review.ts';
import { exportJobRoutes } from './exports-jobs.ts';
import { contractsJobRoutes } from './contracts-job.ts';

export const V1_ROUTES: RoutePlugin[] = [
  keyRoutes,
  counterpartyRoutes,
  historyRoutes,
  upkeepRoutes,
  mentionRoutes,
  contractReviewRoutes,
  exportJobRoutes,
  contractsJobRoutes,
];
