// Thin handlers for the conflict alerts of the signed-in user's organization.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { AlertListQuery } from '../../../../shared/schemas/alerts.js';
import type { AlertsService } from './alerts.service.js';

export function createAlertsController(service: AlertsService) {
  return {
    async list(req: Request, res: Response) {
      res.json(await service.list(currentUser(req), req.query as unknown as AlertListQuery));
    },
    async get(req: Request, res: Response) {
      res.json({ alert: await service.get(currentUser(req), String(req.params.id)) });
    },
    async seen(req: Request, res: Response) {
      res.json({ alert: await service.seen(currentUser(req), String(req.params.id)) });
    },
    async answer(req: Request, res: Response) {
      res.json({ alert: await service.answer(currentUser(req), String(req.params.id), req.body) });
    },
  };
}
