// /api/agreements: list, read, confirm, amend, and the PDF.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { amendmentBody, amendmentParams } from '../../../../shared/schemas/agreements.js';
import { agreementsPolicy } from './agreements.policy.js';
import { createAgreementsService } from './agreements.service.js';
import { createAgreementsController } from './agreements.controller.js';

export function agreementsRoutes(ctx: AppContext): Router {
  const controller = createAgreementsController(createAgreementsService(ctx));
  const router = Router();
  router.get('/', allow(agreementsPolicy, 'read'), controller.list);
  router.get('/:id', allow(agreementsPolicy, 'read'), validate({ params: idParams }), controller.get);
  router.get('/:id/pdf', allow(agreementsPolicy, 'read'), validate({ params: idParams }), controller.pdf);
  router.post('/:id/confirm', allow(agreementsPolicy, 'confirm'), validate({ params: idParams }), controller.confirm);
  router.post('/:id/amendments', allow(agreementsPolicy, 'amend'), validate({ params: idParams, body: amendmentBody }), controller.proposeAmendment);
  for (const answer of ['confirm', 'reject', 'withdraw'] as const) {
    router.post(`/:id/amendments/:amendmentId/${answer}`, allow(agreementsPolicy, 'amend'), validate({ params: amendmentParams }), controller.answerAmendment(answer));
  }
  return router;
}
