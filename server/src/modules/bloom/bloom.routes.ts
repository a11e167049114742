// /api/bloom: stage thresholds and frost critical temperatures (sourced, editable
// reference data) and, for beekeepers, the bloom windows of blocks they follow; and under
// /api/blocks/:id, a block's degree-day forecast and its bloom window revisions.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { bloomWindowBody, forecastQuery } from '../../../../shared/schemas/blocks.js';
import { frostCriticalPatch, stageThresholdBody, stageThresholdPatch, thresholdsQuery } from '../../../../shared/schemas/weather.js';
import { bloomPolicy as policy } from './bloom.policy.js';
import { blocksPolicy } from '../blocks/blocks.policy.js';
import { createBlocksService } from '../blocks/blocks.service.js';
import { createStationsService } from '../weather/stations.service.js';
import { createStageThresholdsService } from './stage-thresholds.service.js';
import { createBloomWindowsService } from './bloom-windows.service.js';
import { createForecastService } from './forecast.service.js';
import { createBloomController } from './bloom.controller.js';

function bloomController(ctx: AppContext) {
  const thresholds = createStageThresholdsService(ctx);
  const forecasts = createForecastService(ctx, { blocks: createBlocksService(ctx), stations: createStationsService(ctx), thresholds });
  return createBloomController(thresholds, createBloomWindowsService(ctx), forecasts);
}

export function bloomRoutes(ctx: AppContext): Router {
  const c = bloomController(ctx);
  const router = Router();
  router.get('/stage-thresholds', allow(policy, 'readReference'), validate({ query: thresholdsQuery }), c.listThresholds);
  router.post('/stage-thresholds', allow(policy, 'editFarmThresholds'), validate({ body: stageThresholdBody }), c.createThreshold);
  router.patch('/stage-thresholds/:id', allow(policy, 'editFarmThresholds'), validate({ params: idParams, body: stageThresholdPatch }), c.updateThreshold);
  router.get('/frost-critical', allow(policy, 'readReference'), validate({ query: thresholdsQuery }), c.listFrostCritical);
  router.patch('/frost-critical/:id', allow(policy, 'editPublishedReference'), validate({ params: idParams, body: frostCriticalPatch }), c.updateFrostCritical);
  router.get('/held-windows', allow(policy, 'heldWindows'), c.heldWindows);
  return router;
}

/** Mounted at /api/blocks beside the blocks router; the block's own policy table decides. */
export function blockBloomRoutes(ctx: AppContext): Router {
  const c = bloomController(ctx);
  const router = Router();
  router.get('/:id/forecast', allow(blocksPolicy, 'forecast'), validate({ params: idParams, query: forecastQuery }), c.forecast);
  router.get('/:id/bloom-windows', allow(blocksPolicy, 'read'), validate({ params: idParams }), c.bloomWindows);
  router.post('/:id/bloom-windows', allow(blocksPolicy, 'publishBloom'), validate({ params: idParams, body: bloomWindowBody }), c.publishBloomWindow);
  return router;
}
