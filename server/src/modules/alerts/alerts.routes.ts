// /api/alerts: the conflict alerts of the signed-in user's organization.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow, currentUser } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { alertAnswerSchema, alertListQuery, type AlertListQuery } from '../../../../shared/schemas/alerts.js';
import { alertsPolicy } from './alerts.policy.js';
import { createAlertsService } from './alerts.service.js';

export function alertsRoutes(ctx: AppContext): Router {
  const service = createAlertsService(ctx);
  const router = Router();
  router.get('/', allow(alertsPolicy, 'list'), validate({ query: alertListQuery }), async (req, res) => {
    res.json(await service.list(currentUser(req), req.query as unknown as AlertListQuery));
  });
  router.get('/:id', allow(alertsPolicy, 'list'), validate({ params: idParams }), async (req, res) => {
    res.json({ alert: await service.get(currentUser(req), String(req.params.id)) });
  });
  router.post('/:id/seen', allow(alertsPolicy, 'list'), validate({ params: idParams }), async (req, res) => {
    res.json({ alert: await service.seen(currentUser(req), String(req.params.id)) });
  });
  router.post('/:id/answer', allow(alertsPolicy, 'answer'), validate({ params: idParams, body: alertAnswerSchema }), async (req, res) => {
    res.json({ alert: await service.answer(currentUser(req), String(req.params.id), req.body) });
  });
  return router;
}
