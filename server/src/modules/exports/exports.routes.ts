// /api/exports/*.csv: downloads of requests, agreements and placements.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { exportsPolicy } from './exports.policy.js';
import { createExportsService } from './exports.service.js';
import { createExportsController } from './exports.controller.js';

export function exportsRoutes(ctx: AppContext): Router {
  const controller = createExportsController(createExportsService(ctx));
  const router = Router();
  for (const kind of ['requests', 'agreements', 'placements'] as const) {
    router.get(`/${kind}.csv`, allow(exportsPolicy, 'export'), controller.download(kind));
  }
  return router;
}
