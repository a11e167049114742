// /api/bloom: stage thresholds and frost critical temperatures (sourced, editable
// reference data) and, for beekeepers, the bloom windows of blocks they follow.
import { Router, type Request, type Response } from 'express';
import type { AppContext } from '../../context.js';
import { allow, currentUser } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { frostCriticalPatch, stageThresholdBody, stageThresholdPatch, thresholdsQuery } from '../../../../shared/schemas/weather.js';
import { bloomPolicy as policy } from './bloom.policy.js';
import { createStageThresholdsService } from './stage-thresholds.service.js';
import { createBloomWindowsService } from './bloom-windows.service.js';

export function bloomRoutes(ctx: AppContext): Router {
  const thresholds = createStageThresholdsService(ctx);
  const windows = createBloomWindowsService(ctx);
  const crop = (req: Request) => (req.query as { crop?: string }).crop;
  const router = Router();
  router.get('/stage-thresholds', allow(policy, 'readReference'), validate({ query: thresholdsQuery }), async (req: Request, res: Response) => {
    res.json({ thresholds: await thresholds.list(currentUser(req), crop(req)) });
  });
  router.post('/stage-thresholds', allow(policy, 'editFarmThresholds'), validate({ body: stageThresholdBody }), async (req: Request, res: Response) => {
    res.status(201).json({ threshold: await thresholds.create(currentUser(req), req.body) });
  });
  router.patch('/stage-thresholds/:id', allow(policy, 'editFarmThresholds'), validate({ params: idParams, body: stageThresholdPatch }), async (req: Request, res: Response) => {
    res.json({ threshold: await thresholds.update(currentUser(req), String(req.params.id), req.body) });
  });
  router.get('/frost-critical', allow(policy, 'readReference'), validate({ query: thresholdsQuery }), async (req: Request, res: Response) => {
    res.json({ critical: await thresholds.frostCritical(crop(req)) });
  });
  router.patch('/frost-critical/:id', allow(policy, 'editPublishedReference'), validate({ params: idParams, body: frostCriticalPatch }), async (req: Request, res: Response) => {
    res.json({ critical: await thresholds.updateFrostCritical(currentUser(req), String(req.params.id), req.body) });
  });
  router.get('/held-windows', allow(policy, 'heldWindows'), async (req: Request, res: Response) => {
    res.json({ windows: await windows.heldWindows(currentUser(req).organizationId!) });
  });
  return router;
}
