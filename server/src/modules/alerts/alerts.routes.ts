// /api/alerts: the conflict alerts of the signed-in user's organization.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { alertAnswerSchema, alertListQuery } from '../../../../shared/schemas/alerts.js';
import { alertsPolicy } from './alerts.policy.js';
import { createAlertsService } from './alerts.service.js';
import { createAlertsController } from './alerts.controller.js';

export function alertsRoutes(ctx: AppContext): Router {
  const c = createAlertsController(createAlertsService(ctx));
  const router = Router();
  router.get('/', allow(alertsPolicy, 'list'), validate({ query: alertListQuery }), c.list);
  router.get('/:id', allow(alertsPolicy, 'list'), validate({ params: idParams }), c.get);
  router.post('/:id/seen', allow(alertsPolicy, 'list'), validate({ params: idParams }), c.seen);
  router.post('/:id/answer', allow(alertsPolicy, 'answer'), validate({ params: idParams, body: alertAnswerSchema }), c.answer);
  return router;
}
