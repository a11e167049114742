// HTTP handlers for blocks, their forecast and bloom windows; the rules live in the services.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { ForecastQuery } from '../../../../shared/schemas/blocks.js';
import type { BlocksService } from './blocks.service.js';
import type { BloomWindowsService } from '../bloom/bloom-windows.service.js';
import type { createForecastService } from '../bloom/forecast.service.js';

const farmOf = (req: Request) => currentUser(req).organizationId!;
const idOf = (req: Request) => String(req.params.id);

export function createBlocksController(blocks: BlocksService, windows: BloomWindowsService, forecasts: ReturnType<typeof createForecastService>) {
  return {
    async list(req: Request, res: Response) {
      res.json({ blocks: await blocks.list(farmOf(req)) });
    },
    async create(req: Request, res: Response) {
      res.status(201).json({ block: await blocks.create(farmOf(req), req.body) });
    },
    async get(req: Request, res: Response) {
      res.json({ block: await blocks.get(farmOf(req), idOf(req)) });
    },
    async update(req: Request, res: Response) {
      res.json({ block: await blocks.update(farmOf(req), idOf(req), req.body) });
    },
    async remove(req: Request, res: Response) {
      await blocks.remove(farmOf(req), idOf(req));
      res.status(204).end();
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
