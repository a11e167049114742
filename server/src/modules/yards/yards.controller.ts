// Thin handlers for /api/yards.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { YardsService } from './yards.service.js';

export function createYardsController(service: YardsService) {
  return {
    async list(req: Request, res: Response) {
      res.json({ yards: await service.list(currentUser(req)) });
    },
    async create(req: Request, res: Response) {
      res.status(201).json({ yard: await service.create(currentUser(req), req.body) });
    },
    async update(req: Request, res: Response) {
      res.json({ yard: await service.update(currentUser(req), String(req.params.id), req.body) });
    },
    async remove(req: Request, res: Response) {
      await service.remove(currentUser(req), String(req.params.id));
      res.status(204).end();
    },
  };
}
