// /api/requests: hive requests. (Offering colonies to one, POST /api/requests/:id/commitments,
// is the commitments module's route, mounted on the same path.)
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { openRequestsQuery, requestBody } from '../../../../shared/schemas/requests.js';
import { requestsPolicy } from './requests.policy.js';
import { createRequestsService } from './requests.service.js';
import { createRequestsController } from './requests.controller.js';

export function requestsRoutes(ctx: AppContext): Router {
  const controller = createRequestsController(createRequestsService(ctx));
  const router = Router();
  router.get('/', allow(requestsPolicy, 'list'), validate({ query: openRequestsQuery }), controller.list);
  router.post('/', allow(requestsPolicy, 'manage'), validate({ body: requestBody }), controller.create);
  router.get('/:id', allow(requestsPolicy, 'read'), validate({ params: idParams }), controller.get);
  router.put('/:id', allow(requestsPolicy, 'manage'), validate({ params: idParams, body: requestBody }), controller.update);
  for (const action of ['publish', 'withdraw', 'close'] as const) {
    router.post(`/:id/${action}`, allow(requestsPolicy, 'manage'), validate({ params: idParams }), controller.step(action));
  }
  return router;
}
