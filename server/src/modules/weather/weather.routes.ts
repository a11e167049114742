// /api/weather: a farm's weather stations, their daily temperatures (hand entry and CSV
// upload), forecast lows and chill units.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { singleFileUpload } from '../../middleware/upload.js';
import { idParams } from '../../../../shared/schemas/common.js';
import {
  chillQuery, dailyTemperatureBody, forecastLowBody, stationBody, stationDayParams, stationPatch, temperaturesQuery,
} from '../../../../shared/schemas/weather.js';
import { weatherPolicy as policy } from './weather.policy.js';
import { createStationsService, type StationsService } from './stations.service.js';
import { createChillService } from './chill.service.js';
import { createWeatherController } from './weather.controller.js';

const csvUpload = singleFileUpload('file', { maxBytes: 2 * 1024 * 1024 });

export function weatherRoutes(ctx: AppContext, stations: StationsService = createStationsService(ctx)): Router {
  const c = createWeatherController(stations, createChillService(ctx, stations));
  const router = Router();
  router.get('/stations', allow(policy, 'list'), c.list);
  router.post('/stations', allow(policy, 'create'), validate({ body: stationBody }), c.create);
  router.get('/stations/:id', allow(policy, 'read'), validate({ params: idParams }), c.get);
  router.patch('/stations/:id', allow(policy, 'update'), validate({ params: idParams, body: stationPatch }), c.update);
  router.get('/stations/:id/temperatures', allow(policy, 'read'), validate({ params: idParams, query: temperaturesQuery }), c.temperatures);
  router.put('/stations/:id/temperatures/:day', allow(policy, 'enterTemperatures'), validate({ params: stationDayParams, body: dailyTemperatureBody }), c.enterDay);
  router.post('/stations/:id/temperatures/upload', allow(policy, 'uploadTemperatures'), validate({ params: idParams }), csvUpload, c.upload);
  router.get('/stations/:id/forecast-lows', allow(policy, 'read'), validate({ params: idParams }), c.forecastLows);
  router.post('/stations/:id/forecast-lows/upload', allow(policy, 'enterForecastLows'), validate({ params: idParams }), csvUpload, c.uploadForecastLows);
  router.put('/stations/:id/forecast-lows/:day', allow(policy, 'enterForecastLows'), validate({ params: stationDayParams, body: forecastLowBody }), c.enterForecastLow);
  router.get('/stations/:id/chill', allow(policy, 'read'), validate({ params: idParams, query: chillQuery }), c.chill);
  return router;
}
