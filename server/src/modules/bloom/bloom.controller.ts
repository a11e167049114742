// HTTP handlers for stage thresholds, frost critical temperatures, bloom windows and a
// block's bloom forecast; the rules live in the services.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { ForecastQuery } from '../../../../shared/schemas/blocks.js';
import type { StageThresholdsService } from './stage-thresholds.service.js';
import type { BloomWindowsService } from './bloom-windows.service.js';
import type { ForecastService } from './forecast.service.js';

const farmOf = (req: Request) => currentUser(req).organizationId!;
const idOf = (req: Request) => String(req.params.id);
const cropOf = (req: Request) => (req.query as { crop?: string }).crop;

export function createBloomController(thresholds: StageThresholdsService, windows: BloomWindowsService, forecasts: ForecastService) {
  return {
    async listThresholds(req: Request, res: Response) {
      res.json({ thresholds: await thresholds.list(currentUser(req), cropOf(req)) });
    },
    async createThreshold(req: Request, res: Response) {
      res.status(201).json({ threshold: await thresholds.create(currentUser(req), req.body) });
    },
    async updateThreshold(req: Request, res: Response) {
      res.json({ threshold: await thresholds.update(currentUser(req), idOf(req), req.body) });
    },
    async listFrostCritical(req: Request, res: Response) {
      res.json({ critical: await thresholds.frostCritical(cropOf(req)) });
    },
    async updateFrostCritical(req: Request, res: Response) {
      res.json({ critical: await thresholds.updateFrostCritical(currentUser(req), idOf(req), req.body) });
    },
    async heldWindows(req: Request, res: Response) {
      res.json({ windows: await windows.heldWindows(currentUser(req).organizationId!) });
    },
    async forecast(req: Request, res: Response) {
      res.json({ forecast: await forecasts.forBlock(farmOf(req), idOf(req), req.query as ForecastQuery) });
    },
    async bloomWindows(req: Request, res: Response) {
      res.json({ revisions: await windows.revisions(farmOf(req), idOf(req)) });
    },
    async publishBloomWindow(req: Request, res: Response) {
      res.status(201).json({ bloomWindow: await windows.publish(currentUser(req), idOf(req), req.body) });
    },
  };
}
