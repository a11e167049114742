// /api/agreements: list, read, confirm, amend, and the PDF.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow, currentUser } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { amendmentBody, amendmentParams } from '../../../../shared/schemas/agreements.js';
import { agreementsPolicy } from './agreements.policy.js';
import { createAgreementsService } from './agreements.service.js';
import { agreementPdf } from './agreement-pdf.js';

export function agreementsRoutes(ctx: AppContext): Router {
  const service = createAgreementsService(ctx);
  const router = Router();
  const id = (req: { params: Record<string, unknown> }) => String(req.params.id);
  router.get('/', allow(agreementsPolicy, 'read'), async (req, res) => {
    res.json({ agreements: await service.list(currentUser(req)) });
  });
  router.get('/:id', allow(agreementsPolicy, 'read'), validate({ params: idParams }), async (req, res) => {
    res.json({ agreement: await service.get(currentUser(req), id(req)) });
  });
  router.get('/:id/pdf', allow(agreementsPolicy, 'read'), validate({ params: idParams }), async (req, res) => {
    const user = currentUser(req);
    const agreement = await service.get(user, id(req));
    const pdf = await agreementPdf(agreement, user.timeZone ?? user.organizationTimeZone ?? 'UTC');
    res.type('application/pdf').set('Content-Disposition', `attachment; filename="agreement-${agreement.id.slice(0, 8)}-v${agreement.version}.pdf"`).send(pdf);
  });
  router.post('/:id/confirm', allow(agreementsPolicy, 'confirm'), validate({ params: idParams }), async (req, res) => {
    res.json({ agreement: await service.confirm(currentUser(req), id(req)) });
  });
  router.post('/:id/amendments', allow(agreementsPolicy, 'amend'), validate({ params: idParams, body: amendmentBody }), async (req, res) => {
    res.status(201).json({ agreement: await service.proposeAmendment(currentUser(req), id(req), req.body) });
  });
  for (const answer of ['confirm', 'reject', 'withdraw'] as const) {
    router.post(`/:id/amendments/:amendmentId/${answer}`, allow(agreementsPolicy, 'amend'), validate({ params: amendmentParams }), async (req, res) => {
      res.json({ agreement: await service.answerAmendment(currentUser(req), id(req), String(req.params.amendmentId), answer) });
    });
  }
  return router;
}
