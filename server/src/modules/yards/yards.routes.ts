// /api/yards: an apiary's home locations.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow, currentUser } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { yardBody } from '../../../../shared/schemas/yards.js';
import { yardsPolicy } from './yards.policy.js';
import { createYardsService } from './yards.service.js';

export function yardsRoutes(ctx: AppContext): Router {
  const service = createYardsService(ctx);
  const router = Router();
  router.get('/', allow(yardsPolicy, 'list'), async (req, res) => {
    res.json({ yards: await service.list(currentUser(req)) });
  });
  router.post('/', allow(yardsPolicy, 'manage'), validate({ body: yardBody }), async (req, res) => {
    res.status(201).json({ yard: await service.create(currentUser(req), req.body) });
  });
  router.put('/:id', allow(yardsPolicy, 'manage'), validate({ params: idParams, body: yardBody }), async (req, res) => {
    res.json({ yard: await service.update(currentUser(req), String(req.params.id), req.body) });
  });
  router.delete('/:id', allow(yardsPolicy, 'manage'), validate({ params: idParams }), async (req, res) => {
    await service.remove(currentUser(req), String(req.params.id));
    res.status(204).end();
  });
  return router;
}
