// HTTP handlers for weather stations; the rules live in the services.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import { parseOrThrow } from '../../middleware/validate.js';
import { badRequest } from '../../errors/http-errors.js';
import { temperatureUploadFields } from '../../../../shared/schemas/weather.js';
import type { StationsService } from './stations.service.js';
import type { createChillService } from './chill.service.js';

const farmOf = (req: Request) => currentUser(req).organizationId!;
const idOf = (req: Request) => String(req.params.id);

export function createWeatherController(stations: StationsService, chill: ReturnType<typeof createChillService>) {
  return {
    async list(req: Request, res: Response) {
      res.json({ stations: await stations.list(farmOf(req)) });
    },
    async create(req: Request, res: Response) {
      res.status(201).json({ station: await stations.create(farmOf(req), req.body) });
    },
    async get(req: Request, res: Response) {
      res.json({ station: await stations.get(farmOf(req), idOf(req)) });
    },
    async update(req: Request, res: Response) {
      res.json({ station: await stations.update(farmOf(req), idOf(req), req.body) });
    },
    async temperatures(req: Request, res: Response) {
      const query = req.query as { from?: string; to?: string };
      res.json({ temperatures: await stations.temperatures(farmOf(req), idOf(req), query) });
    },
    async enterDay(req: Request, res: Response) {
      res.json({ temperature: await stations.enterDay(farmOf(req), currentUser(req).id, idOf(req), String(req.params.day), req.body) });
    },
    async upload(req: Request, res: Response) {
      await stations.get(farmOf(req), idOf(req)); // another farm's station is not found, file or not
      if (!req.file) throw badRequest('Choose a CSV file to upload.', { file: 'is required' });
      const fields = parseOrThrow(temperatureUploadFields, req.body ?? {});
      res.json({ result: await stations.upload(farmOf(req), currentUser(req).id, idOf(req), req.file.buffer, fields) });
    },
    async uploadForecastLows(req: Request, res: Response) {
      await stations.get(farmOf(req), idOf(req));
      if (!req.file) throw badRequest('Choose a CSV file to upload.', { file: 'is required' });
      const fields = parseOrThrow(temperatureUploadFields, req.body ?? {});
      res.json({ result: await stations.uploadForecastLows(farmOf(req), currentUser(req).id, idOf(req), req.file.buffer, fields) });
    },
    async forecastLows(req: Request, res: Response) {
      res.json({ forecastLows: await stations.forecastLows(farmOf(req), idOf(req)) });
    },
    async enterForecastLow(req: Request, res: Response) {
      res.json({ forecastLow: await stations.enterForecastLow(farmOf(req), currentUser(req).id, idOf(req), String(req.params.day), req.body) });
    },
    async chill(req: Request, res: Response) {
      res.json({ chill: await chill.chill(farmOf(req), idOf(req), (req.query as { from?: string }).from) });
    },
  };
}
