// /api/sprays: a farm's spray plans, the dry-run conflict check and the plan's steps.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow, currentUser } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { sprayApplySchema, sprayInputSchema, sprayListQuery, sprayUpdateSchema, type SprayState } from '../../../../shared/schemas/sprays.js';
import { spraysPolicy } from './sprays.policy.js';
import { createSpraysService } from './sprays.service.js';

export function spraysRoutes(ctx: AppContext): Router {
  const service = createSpraysService(ctx);
  const router = Router();
  router.get('/', allow(spraysPolicy, 'list'), validate({ query: sprayListQuery }), async (req, res) => {
    res.json({ sprays: await service.list(currentUser(req), (req.query as { state?: SprayState }).state) });
  });
  router.post('/check', allow(spraysPolicy, 'plan'), validate({ body: sprayInputSchema }), async (req, res) => {
    res.json({ check: await service.check(currentUser(req), req.body) });
  });
  router.post('/', allow(spraysPolicy, 'plan'), validate({ body: sprayInputSchema }), async (req, res) => {
    res.status(201).json(await service.create(currentUser(req), req.body));
  });
  router.get('/:id', allow(spraysPolicy, 'list'), validate({ params: idParams }), async (req, res) => {
    res.json(await service.get(currentUser(req), String(req.params.id)));
  });
  router.patch('/:id', allow(spraysPolicy, 'plan'), validate({ params: idParams, body: sprayUpdateSchema }), async (req, res) => {
    res.json(await service.update(currentUser(req), String(req.params.id), req.body));
  });
  router.post('/:id/apply', allow(spraysPolicy, 'plan'), validate({ params: idParams, body: sprayApplySchema }), async (req, res) => {
    res.json(await service.apply(currentUser(req), String(req.params.id), req.body));
  });
  router.post('/:id/cancel', allow(spraysPolicy, 'plan'), validate({ params: idParams }), async (req, res) => {
    res.json(await service.cancel(currentUser(req), String(req.params.id)));
  });
  return router;
}
