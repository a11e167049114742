// /api/sprays: a farm's spray plans, the dry-run conflict check and the plan's steps.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { sprayApplySchema, sprayInputSchema, sprayListQuery, sprayUpdateSchema } from '../../../../shared/schemas/sprays.js';
import { spraysPolicy } from './sprays.policy.js';
import { createSpraysService } from './sprays.service.js';
import { createSpraysController } from './sprays.controller.js';

export function spraysRoutes(ctx: AppContext): Router {
  const c = createSpraysController(createSpraysService(ctx));
  const router = Router();
  router.get('/', allow(spraysPolicy, 'list'), validate({ query: sprayListQuery }), c.list);
  router.post('/check', allow(spraysPolicy, 'plan'), validate({ body: sprayInputSchema }), c.check);
  router.post('/', allow(spraysPolicy, 'plan'), validate({ body: sprayInputSchema }), c.create);
  router.get('/:id', allow(spraysPolicy, 'list'), validate({ params: idParams }), c.get);
  router.patch('/:id', allow(spraysPolicy, 'plan'), validate({ params: idParams, body: sprayUpdateSchema }), c.update);
  router.post('/:id/apply', allow(spraysPolicy, 'plan'), validate({ params: idParams, body: sprayApplySchema }), c.apply);
  router.post('/:id/cancel', allow(spraysPolicy, 'plan'), validate({ params: idParams }), c.cancel);
  return router;
}
