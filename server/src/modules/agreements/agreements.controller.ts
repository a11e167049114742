// Thin handlers for /api/agreements: list, read, the PDF, confirm, amend.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { AmendmentBody } from '../../../../shared/schemas/agreements.js';
import type { AgreementsService } from './agreements.service.js';
import { agreementPdf } from './agreement-pdf.js';

const id = (req: Request) => String(req.params.id);

export function createAgreementsController(service: AgreementsService) {
  return {
    async list(req: Request, res: Response) {
      res.json({ agreements: await service.list(currentUser(req)) });
    },
    async get(req: Request, res: Response) {
      res.json({ agreement: await service.get(currentUser(req), id(req)) });
    },
    async pdf(req: Request, res: Response) {
      const user = currentUser(req);
      const agreement = await service.get(user, id(req));
      const pdf = await agreementPdf(agreement, user.timeZone ?? user.organizationTimeZone ?? 'UTC');
      res.type('application/pdf').set('Content-Disposition', `attachment; filename="agreement-${agreement.id.slice(0, 8)}-v${agreement.version}.pdf"`).send(pdf);
    },
    async confirm(req: Request, res: Response) {
      res.json({ agreement: await service.confirm(currentUser(req), id(req)) });
    },
    async proposeAmendment(req: Request, res: Response) {
      res.status(201).json({ agreement: await service.proposeAmendment(currentUser(req), id(req), req.body as AmendmentBody) });
    },
    answerAmendment(answer: 'confirm' | 'reject' | 'withdraw') {
      return async (req: Request, res: Response) => {
        res.json({ agreement: await service.answerAmendment(currentUser(req), id(req), String(req.params.amendmentId), answer) });
      };
    },
  };
}
