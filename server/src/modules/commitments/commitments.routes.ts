// /api/commitments: an apiary's commitments; the grower's answer to a price offer; withdrawal.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow, currentUser } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { commitmentsPolicy } from './commitments.policy.js';
import { createCommitmentsService } from './commitments.service.js';

export function commitmentsRoutes(ctx: AppContext): Router {
  const service = createCommitmentsService(ctx);
  const router = Router();
  router.get('/', allow(commitmentsPolicy, 'list'), async (req, res) => {
    res.json({ commitments: await service.list(currentUser(req)) });
  });
  router.post('/:id/accept', allow(commitmentsPolicy, 'decide'), validate({ params: idParams }), async (req, res) => {
    res.json(await service.decide(currentUser(req), String(req.params.id), 'accept'));
  });
  router.post('/:id/decline', allow(commitmentsPolicy, 'decide'), validate({ params: idParams }), async (req, res) => {
    res.json(await service.decide(currentUser(req), String(req.params.id), 'decline'));
  });
  router.post('/:id/withdraw', allow(commitmentsPolicy, 'withdraw'), validate({ params: idParams }), async (req, res) => {
    res.json(await service.withdraw(currentUser(req), String(req.params.id)));
  });
  return router;
}
