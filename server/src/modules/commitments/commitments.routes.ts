// /api/commitments: an apiary's commitments; the grower's answer to a price offer; withdrawal.
// commitmentOfferRoutes is mounted on /api/requests: an offer is made to a request.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { commitmentBody } from '../../../../shared/schemas/requests.js';
import { commitmentsPolicy } from './commitments.policy.js';
import { createCommitmentsService } from './commitments.service.js';
import { createCommitmentsController } from './commitments.controller.js';

export function commitmentsRoutes(ctx: AppContext): Router {
  const controller = createCommitmentsController(createCommitmentsService(ctx));
  const router = Router();
  router.get('/', allow(commitmentsPolicy, 'list'), controller.list);
  router.post('/:id/accept', allow(commitmentsPolicy, 'decide'), validate({ params: idParams }), controller.decide('accept'));
  router.post('/:id/decline', allow(commitmentsPolicy, 'decide'), validate({ params: idParams }), controller.decide('decline'));
  router.post('/:id/withdraw', allow(commitmentsPolicy, 'withdraw'), validate({ params: idParams }), controller.withdraw);
  return router;
}

/** POST /api/requests/:id/commitments. */
export function commitmentOfferRoutes(ctx: AppContext): Router {
  const controller = createCommitmentsController(createCommitmentsService(ctx));
  const router = Router();
  router.post('/:id/commitments', allow(commitmentsPolicy, 'offer'), validate({ params: idParams, body: commitmentBody }), controller.offer);
  return router;
}
