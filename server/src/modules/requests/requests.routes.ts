// /api/requests: hive requests, and the commitments made to one.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow, currentUser } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { commitmentBody, openRequestsQuery, requestBody } from '../../../../shared/schemas/requests.js';
import { requestsPolicy } from './requests.policy.js';
import { createRequestsService } from './requests.service.js';
import { commitmentsPolicy } from '../commitments/commitments.policy.js';
import { createCommitmentsService } from '../commitments/commitments.service.js';

export function requestsRoutes(ctx: AppContext): Router {
  const service = createRequestsService(ctx);
  const commitments = createCommitmentsService(ctx);
  const router = Router();
  const id = (req: { params: Record<string, unknown> }) => String(req.params.id);

  router.get('/', allow(requestsPolicy, 'list'), validate({ query: openRequestsQuery }), async (req, res) => {
    res.json({ requests: await service.list(currentUser(req), req.query as never) });
  });
  router.post('/', allow(requestsPolicy, 'manage'), validate({ body: requestBody }), async (req, res) => {
    res.status(201).json({ request: await service.create(currentUser(req), req.body) });
  });
  router.get('/:id', allow(requestsPolicy, 'read'), validate({ params: idParams }), async (req, res) => {
    res.json({ request: await service.get(currentUser(req), id(req)) });
  });
  router.put('/:id', allow(requestsPolicy, 'manage'), validate({ params: idParams, body: requestBody }), async (req, res) => {
    res.json({ request: await service.update(currentUser(req), id(req), req.body) });
  });
  for (const action of ['publish', 'withdraw', 'close'] as const) {
    router.post(`/:id/${action}`, allow(requestsPolicy, 'manage'), validate({ params: idParams }), async (req, res) => {
      res.json({ request: await service[action](currentUser(req), id(req)) });
    });
  }
  router.post('/:id/commitments', allow(commitmentsPolicy, 'offer'), validate({ params: idParams, body: commitmentBody }), async (req, res) => {
    res.status(201).json(await commitments.offer(currentUser(req), id(req), req.body));
  });
  return router;
}
