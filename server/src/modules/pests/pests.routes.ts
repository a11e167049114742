// /api/pests: pest models (sourced data), a block's trap counts and its pest timing.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow, currentUser } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { pestBlockQuery, trapCountInputSchema } from '../../../../shared/schemas/pests.js';
import { pestsPolicy } from './pests.policy.js';
import { createPestsService } from './pests.service.js';

export function pestsRoutes(ctx: AppContext): Router {
  const service = createPestsService(ctx);
  const router = Router();
  router.get('/models', allow(pestsPolicy, 'list'), async (_req, res) => {
    res.json({ models: await service.models() });
  });
  router.get('/trap-counts', allow(pestsPolicy, 'list'), validate({ query: pestBlockQuery }), async (req, res) => {
    const query = req.query as unknown as { blockId: string; pestModelId: string };
    res.json({ trapCounts: await service.listCounts(currentUser(req), query.blockId, query.pestModelId) });
  });
  router.post('/trap-counts', allow(pestsPolicy, 'record'), validate({ body: trapCountInputSchema }), async (req, res) => {
    res.status(201).json({ trapCount: await service.record(currentUser(req), req.body) });
  });
  router.get('/timing', allow(pestsPolicy, 'list'), validate({ query: pestBlockQuery }), async (req, res) => {
    const query = req.query as unknown as { blockId: string; pestModelId: string };
    res.json({ timing: await service.timing(currentUser(req), query.blockId, query.pestModelId) });
  });
  return router;
}
