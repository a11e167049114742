// /api/pests: pest models (sourced data), a block's trap counts and its pest timing.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { pestBlockQuery, pestTimingQuery, trapCountInputSchema } from '../../../../shared/schemas/pests.js';
import { pestsPolicy as policy } from './pests.policy.js';
import { createPestsService } from './pests.service.js';
import { createPestsController } from './pests.controller.js';

export function pestsRoutes(ctx: AppContext): Router {
  const c = createPestsController(createPestsService(ctx));
  const router = Router();
  router.get('/models', allow(policy, 'list'), c.models);
  router.get('/trap-counts', allow(policy, 'list'), validate({ query: pestBlockQuery }), c.trapCounts);
  router.post('/trap-counts', allow(policy, 'record'), validate({ body: trapCountInputSchema }), c.recordTrapCount);
  router.get('/timing', allow(policy, 'list'), validate({ query: pestTimingQuery }), c.timing);
  return router;
}
