// HTTP handlers for blocks; the rules live in the service.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { BlocksService } from './blocks.service.js';

const farmOf = (req: Request) => currentUser(req).organizationId!;
const idOf = (req: Request) => String(req.params.id);

export function createBlocksController(blocks: BlocksService) {
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
  };
}
