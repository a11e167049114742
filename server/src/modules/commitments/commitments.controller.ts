// Thin handlers for commitments: an apiary's list, an offer to a request, the grower's
// answer to a price offer, and withdrawal.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { CommitmentsService } from './commitments.service.js';

const id = (req: Request) => String(req.params.id);

export function createCommitmentsController(service: CommitmentsService) {
  return {
    async list(req: Request, res: Response) {
      res.json({ commitments: await service.list(currentUser(req)) });
    },
    /** POST /api/requests/:id/commitments: :id is the request. */
    async offer(req: Request, res: Response) {
      res.status(201).json(await service.offer(currentUser(req), id(req), req.body));
    },
    decide(decision: 'accept' | 'decline') {
      return async (req: Request, res: Response) => {
        res.json(await service.decide(currentUser(req), id(req), decision));
      };
    },
    async withdraw(req: Request, res: Response) {
      res.json(await service.withdraw(currentUser(req), id(req)));
    },
  };
}
