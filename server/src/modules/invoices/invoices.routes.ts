// /api/invoices: list, reports and CSV, draft from an agreement, review, issue, void, credit notes, PDF.
import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { draftInvoiceSchema, updateDraftSchema, voidInvoiceSchema, creditNoteSchema, invoiceListQuery } from '../../../../shared/schemas/invoices.js';
import { invoicesPolicy as policy } from './invoices.policy.js';
import { createInvoicesService } from './invoices.service.js';
import { createInvoiceReportsService } from './invoice-reports.service.js';
import { createInvoicesController } from './invoices.controller.js';

const seasonQuery = invoiceListQuery.pick({ season: true });

export function invoicesRoutes(ctx: AppContext): Router {
  const c = createInvoicesController(createInvoicesService(ctx), createInvoiceReportsService(ctx));
  const router = Router();
  router.get('/', allow(policy, 'read'), validate({ query: invoiceListQuery }), c.list);
  router.get('/export.csv', allow(policy, 'read'), c.exportCsv);
  router.get('/receivables', allow(policy, 'receivables'), validate({ query: seasonQuery }), c.receivables);
  router.get('/payables', allow(policy, 'payables'), validate({ query: seasonQuery }), c.payables);
  router.get('/billable-agreements', allow(policy, 'draft'), c.billableAgreements);
  router.post('/', allow(policy, 'draft'), validate({ body: draftInvoiceSchema }), c.draft);
  router.get('/:id', allow(policy, 'read'), validate({ params: idParams }), c.detail);
  router.get('/:id/pdf', allow(policy, 'read'), validate({ params: idParams }), c.pdf);
  router.patch('/:id', allow(policy, 'draft'), validate({ params: idParams, body: updateDraftSchema }), c.updateDraft);
  router.delete('/:id', allow(policy, 'draft'), validate({ params: idParams }), c.discardDraft);
  router.post('/:id/issue', allow(policy, 'issue'), validate({ params: idParams, body: z.object({}) }), c.issue);
  router.post('/:id/void', allow(policy, 'void'), validate({ params: idParams, body: voidInvoiceSchema }), c.voidInvoice);
  router.post('/:id/credit-notes', allow(policy, 'creditNote'), validate({ params: idParams, body: creditNoteSchema }), c.addCreditNote);
  return router;
}
