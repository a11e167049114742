// /api/dashboard: each side's season overview, the season timeline and map, and the
// business's colony total the beekeeper's overview compares against.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { beekeeperDashboardQuery, coloniesOwnedBody, seasonQuery } from '../../../../shared/schemas/dashboard.js';
import { dashboardPolicy } from './dashboard.policy.js';
import { createDashboardService } from './dashboard.service.js';
import { createDashboardController } from './dashboard.controller.js';

export function dashboardRoutes(ctx: AppContext): Router {
  const controller = createDashboardController(createDashboardService(ctx));
  const router = Router();
  router.get('/grower', allow(dashboardPolicy, 'viewGrower'), validate({ query: seasonQuery }), controller.grower);
  router.get('/beekeeper', allow(dashboardPolicy, 'viewBeekeeper'), validate({ query: beekeeperDashboardQuery.extend(seasonQuery.shape) }), controller.beekeeper);
  router.put('/colonies-owned', allow(dashboardPolicy, 'setColoniesOwned'), validate({ body: coloniesOwnedBody }), controller.setColoniesOwned);
  router.get('/timeline', allow(dashboardPolicy, 'viewSeason'), validate({ query: seasonQuery }), controller.timeline);
  router.get('/map', allow(dashboardPolicy, 'viewSeason'), validate({ query: seasonQuery }), controller.map);
  return router;
}
