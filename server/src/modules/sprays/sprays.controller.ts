// Thin handlers for a farm's spray plans: parsed input in, the service's answer out.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import { readIdempotencyKey, requestHash } from '../../middleware/idempotency-key.js';
import type { SprayState } from '../../../../shared/schemas/sprays.js';
import type { SpraysService } from './sprays.service.js';

export function createSpraysController(service: SpraysService) {
  return {
    async list(req: Request, res: Response) {
      res.json({ sprays: await service.list(currentUser(req), (req.query as { state?: SprayState }).state) });
    },
    async check(req: Request, res: Response) {
      res.json({ check: await service.check(currentUser(req), req.body) });
    },
    async create(req: Request, res: Response) {
      const key = readIdempotencyKey(req);
      const once = key ? { key, requestHash: requestHash('POST', '/api/sprays', req.body) } : undefined;
      const { replayed, ...saved } = await service.create(currentUser(req), req.body, once);
      if (replayed) res.set('Idempotent-Replayed', 'true');
      res.status(201).json(saved);
    },
    async get(req: Request, res: Response) {
      res.json(await service.get(currentUser(req), String(req.params.id)));
    },
    async update(req: Request, res: Response) {
      res.json(await service.update(currentUser(req), String(req.params.id), req.body));
    },
    async apply(req: Request, res: Response) {
      res.json(await service.apply(currentUser(req), String(req.params.id), req.body));
    },
    async cancel(req: Request, res: Response) {
      res.json(await service.cancel(currentUser(req), String(req.params.id)));
    },
  };
}
