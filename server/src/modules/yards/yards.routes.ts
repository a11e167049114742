// /api/yards: an apiary's home locations.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { yardBody } from '../../../../shared/schemas/yards.js';
import { yardsPolicy } from './yards.policy.js';
import { createYardsService } from './yards.service.js';
import { createYardsController } from './yards.controller.js';

export function yardsRoutes(ctx: AppContext): Router {
  const controller = createYardsController(createYardsService(ctx));
  const router = Router();
  router.get('/', allow(yardsPolicy, 'list'), controller.list);
  router.post('/', allow(yardsPolicy, 'manage'), validate({ body: yardBody }), controller.create);
  router.put('/:id', allow(yardsPolicy, 'manage'), validate({ params: idParams, body: yardBody }), controller.update);
  router.delete('/:id', allow(yardsPolicy, 'manage'), validate({ params: idParams }), controller.remove);
  return router;
}
