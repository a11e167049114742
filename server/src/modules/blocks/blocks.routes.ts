// /api/blocks: a farm's blocks (outline, acreage, stocking). A block's forecast and bloom
// windows are served by the bloom module under the same path (bloom.routes.ts).
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { blockBody, blockPatch } from '../../../../shared/schemas/blocks.js';
import { blocksPolicy as policy } from './blocks.policy.js';
import { createBlocksService } from './blocks.service.js';
import { createBlocksController } from './blocks.controller.js';

export function blocksRoutes(ctx: AppContext): Router {
  const c = createBlocksController(createBlocksService(ctx));
  const router = Router();
  router.get('/', allow(policy, 'list'), c.list);
  router.post('/', allow(policy, 'create'), validate({ body: blockBody }), c.create);
  router.get('/:id', allow(policy, 'read'), validate({ params: idParams }), c.get);
  router.patch('/:id', allow(policy, 'update'), validate({ params: idParams, body: blockPatch }), c.update);
  router.delete('/:id', allow(policy, 'delete'), validate({ params: idParams }), c.remove);
  return router;
}
