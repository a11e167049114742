// Thin handlers for /api/requests: parse nothing (validate() did), call the service, answer.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { OpenRequestsQuery } from '../../../../shared/schemas/requests.js';
import type { RequestsService } from './requests.service.js';

const id = (req: Request) => String(req.params.id);

export function createRequestsController(service: RequestsService) {
  return {
    async list(req: Request, res: Response) {
      res.json({ requests: await service.list(currentUser(req), req.query as OpenRequestsQuery) });
    },
    async create(req: Request, res: Response) {
      res.status(201).json({ request: await service.create(currentUser(req), req.body) });
    },
    async get(req: Request, res: Response) {
      res.json({ request: await service.get(currentUser(req), id(req)) });
    },
    async update(req: Request, res: Response) {
      res.json({ request: await service.update(currentUser(req), id(req), req.body) });
    },
    /** publish, withdraw or close. */
    step(action: 'publish' | 'withdraw' | 'close') {
      return async (req: Request, res: Response) => {
        res.json({ request: await service[action](currentUser(req), id(req)) });
      };
    },
  };
}
