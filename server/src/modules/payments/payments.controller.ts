// Payments over HTTP: start an online payment, record a cheque or transfer, refund, export.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { PaymentsService } from './payments.service.js';
import type { InvoicesService } from '../invoices/invoices.service.js';
import type { InvoiceReportsService } from '../invoices/invoice-reports.service.js';

export function createPaymentsController(service: PaymentsService, invoices: InvoicesService, reports: InvoiceReportsService) {
  return {
    async checkout(req: Request, res: Response) {
      // Back to the same origin the grower is using (the app trusts only a loopback proxy).
      const origin = `${req.protocol}://${req.get('host')}`;
      res.status(201).json(await service.startCheckout(currentUser(req), req.body.invoiceId, origin));
    },
    async recordManual(req: Request, res: Response) {
      const user = currentUser(req);
      const { invoiceId } = await service.recordManual(user, req.body);
      res.status(201).json({ invoice: await invoices.detail(user, invoiceId) });
    },
    async refund(req: Request, res: Response) {
      const result = await service.refund(currentUser(req), String(req.params.id), req.body);
      res.status(202).json(result);
    },
    async exportCsv(req: Request, res: Response) {
      res.type('text/csv').set('Content-Disposition', 'attachment; filename="payments.csv"').send(await reports.paymentsCsv(currentUser(req)));
    },
  };
}
