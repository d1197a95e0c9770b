/**
 * /v1/counterparties: search, read (ETag; 308 for a merged id), create, PATCH with If-Match, merge, split,
 * relations, history, mentions and the relationship network. Every change goes through services/register.
 * The routes are registered in this order (the order of the API description), one group per module.
 */
import type { RoutePlugin } from '../../types.ts';
import { v1Scope } from './v1-scope.ts';
import { counterpartyEditRoutes } from './counterparty-edit-routes.ts';
import { counterpartyLookupRoutes } from './counterparty-lookup-routes.ts';
import { counterpartyReadRoutes } from './counterparty-read-routes.ts';
import { counterpartyStructureRoutes } from './counterparty-structure-routes.ts';

export { MAX_SEARCH_RESULTS } from './search-counterparties.ts';

export const counterpartyRoutes: RoutePlugin = (app, deps) => {
  const ctx = v1Scope(app, deps);
  counterpartyLookupRoutes(app, deps, ctx);
  counterpartyEditRoutes(app, ctx);
  counterpartyStructureRoutes(app, deps, ctx);
  counterpartyReadRoutes(app, deps, ctx);
};
