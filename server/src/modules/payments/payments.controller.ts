// Payments over HTTP: start an online payment, record a cheque or transfer, refund, export,
// and the payments service's signed webhook.
import type { Request, Response } from 'express';
import type Stripe from 'stripe';
import type { AppContext } from '../../context.js';
import { currentUser } from '../../middleware/authenticate.js';
import type { PaymentsService } from './payments.service.js';
import type { PaymentEventsService } from './payment-events.service.js';
import type { InvoicesService } from '../invoices/invoices.service.js';
import type { InvoiceReportsService } from '../invoices/invoice-reports.service.js';
import { paymentsClient } from './payments-client.js';

export function createPaymentsController(
  ctx: AppContext, service: PaymentsService, events: PaymentEventsService, invoices: InvoicesService, reports: InvoiceReportsService,
) {
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
    /** POST /api/webhooks/payments: raw body, signature checked by the SDK; 400 and nothing changes when it does not verify. */
    async webhook(req: Request, res: Response) {
      const signature = req.get('stripe-signature');
      let event: Stripe.Event;
      try {
        if (!signature || !Buffer.isBuffer(req.body)) throw new Error('missing signature or body');
        event = paymentsClient(ctx.config).webhooks.constructEvent(req.body, signature, ctx.config.payments.webhookSecret);
      } catch {
        res.status(400).json({ error: { code: 'bad_request', message: 'The webhook signature does not verify.' } });
        return;
      }
      res.json({ received: true, outcome: await events.handle(event) });
    },
  };
}
