// HTTP handlers for pest models, trap counts and pest timing; the rules live in the service.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { PestsService } from './pests.service.js';

const blockQuery = (req: Request) => req.query as unknown as { blockId: string; pestModelId: string };

export function createPestsController(service: PestsService) {
  return {
    async models(_req: Request, res: Response) {
      res.json({ models: await service.models() });
    },
    async trapCounts(req: Request, res: Response) {
      const { blockId, pestModelId } = blockQuery(req);
      res.json({ trapCounts: await service.listCounts(currentUser(req), blockId, pestModelId) });
    },
    async recordTrapCount(req: Request, res: Response) {
      res.status(201).json({ trapCount: await service.record(currentUser(req), req.body) });
    },
    async timing(req: Request, res: Response) {
      const { blockId, pestModelId, season } = req.query as unknown as { blockId: string; pestModelId: string; season?: number };
      res.json({ timing: await service.timing(currentUser(req), blockId, pestModelId, season) });
    },
  };
}
