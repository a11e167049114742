// /api/health: whether the app and its database answer (for load balancers and scripts).
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { createHealthService } from './health.service.js';
import { createHealthController } from './health.controller.js';

export function healthRoutes(ctx: AppContext): Router {
  const c = createHealthController(createHealthService(ctx));
  const router = Router();
  router.get('/', c.health);
  return router;
}
