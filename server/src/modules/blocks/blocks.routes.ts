// /api/blocks: a farm's blocks (outline, acreage, stocking), each block's degree-day
// forecast and its bloom window revisions.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { blockBody, blockPatch, bloomWindowBody, forecastQuery } from '../../../../shared/schemas/blocks.js';
import { blocksPolicy as policy } from './blocks.policy.js';
import { createBlocksService } from './blocks.service.js';
import { createBlocksController } from './blocks.controller.js';
import { createBloomWindowsService } from '../bloom/bloom-windows.service.js';
import { createForecastService } from '../bloom/forecast.service.js';
import { createStageThresholdsService } from '../bloom/stage-thresholds.service.js';
import { createStationsService } from '../weather/stations.service.js';

export function blocksRoutes(ctx: AppContext): Router {
  const blocks = createBlocksService(ctx);
  const forecasts = createForecastService(ctx, { blocks, stations: createStationsService(ctx), thresholds: createStageThresholdsService(ctx) });
  const c = createBlocksController(blocks, createBloomWindowsService(ctx), forecasts);
  const router = Router();
  router.get('/', allow(policy, 'list'), c.list);
  router.post('/', allow(policy, 'create'), validate({ body: blockBody }), c.create);
  router.get('/:id', allow(policy, 'read'), validate({ params: idParams }), c.get);
  router.patch('/:id', allow(policy, 'update'), validate({ params: idParams, body: blockPatch }), c.update);
  router.delete('/:id', allow(policy, 'delete'), validate({ params: idParams }), c.remove);
  router.get('/:id/forecast', allow(policy, 'forecast'), validate({ params: idParams, query: forecastQuery }), c.forecast);
  router.get('/:id/bloom-windows', allow(policy, 'read'), validate({ params: idParams }), c.bloomWindows);
  router.post('/:id/bloom-windows', allow(policy, 'publishBloom'), validate({ params: idParams, body: bloomWindowBody }), c.publishBloomWindow);
  return router;
}
