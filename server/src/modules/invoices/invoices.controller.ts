// Invoices over HTTP: a few lines each; the rules (and telling the sockets of a change) are in
// invoices.service and the reports service.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { InvoicesService } from './invoices.service.js';
import type { InvoiceReportsService } from './invoice-reports.service.js';
import type { InvoiceListQuery } from '../../../../shared/schemas/invoices.js';
import { renderInvoicePdf } from './invoice-pdf.js';

const idOf = (req: Request) => String(req.params.id);

export function createInvoicesController(service: InvoicesService, reports: InvoiceReportsService) {
  return {
    async list(req: Request, res: Response) {
      res.json({ invoices: await service.list(currentUser(req), req.query as unknown as InvoiceListQuery) });
    },
    async detail(req: Request, res: Response) {
      res.json({ invoice: await service.detail(currentUser(req), idOf(req)) });
    },
    async pdf(req: Request, res: Response) {
      const invoice = await service.detail(currentUser(req), idOf(req));
      const pdf = await renderInvoicePdf(invoice);
      res.type('application/pdf').set('Content-Disposition', `inline; filename="${invoice.number ?? 'draft-invoice'}.pdf"`).send(pdf);
    },
    async billableAgreements(req: Request, res: Response) {
      res.json({ agreements: await service.billableAgreements(currentUser(req)) });
    },
    async draft(req: Request, res: Response) {
      res.status(201).json({ invoice: await service.draft(currentUser(req), req.body) });
    },
    async updateDraft(req: Request, res: Response) {
      res.json({ invoice: await service.updateDraft(currentUser(req), idOf(req), req.body) });
    },
    async discardDraft(req: Request, res: Response) {
      await service.discardDraft(currentUser(req), idOf(req));
      res.status(204).end();
    },
    async issue(req: Request, res: Response) {
      res.json({ invoice: await service.issue(currentUser(req), idOf(req)) });
    },
    async voidInvoice(req: Request, res: Response) {
      res.json({ invoice: await service.voidInvoice(currentUser(req), idOf(req), req.body) });
    },
    async addCreditNote(req: Request, res: Response) {
      res.status(201).json({ invoice: await service.addCreditNote(currentUser(req), idOf(req), req.body) });
    },
    async receivables(req: Request, res: Response) {
      res.json(await reports.receivables(currentUser(req), (req.query as { season?: number }).season));
    },
    async payables(req: Request, res: Response) {
      res.json(await reports.payables(currentUser(req), (req.query as { season?: number }).season));
    },
    async exportCsv(req: Request, res: Response) {
      res.type('text/csv').set('Content-Disposition', 'attachment; filename="invoices.csv"').send(await reports.invoicesCsv(currentUser(req)));
    },
  };
}
