// /api/payments: online checkout (grower), manual payments and refunds (beekeeper), CSV.
// The payments service's webhook is mounted separately (see paymentsWebhookRoutes).
import { Router, raw } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { checkoutSchema, manualPaymentSchema, refundSchema } from '../../../../shared/schemas/invoices.js';
import { paymentsPolicy as policy } from './payments.policy.js';
import { createPaymentsService } from './payments.service.js';
import { createPaymentsController } from './payments.controller.js';
import { createInvoicesService } from '../invoices/invoices.service.js';
import { createInvoiceReportsService } from '../invoices/invoice-reports.service.js';
import { createPaymentEventsService } from './payment-events.service.js';

function controllerFor(ctx: AppContext) {
  return createPaymentsController(ctx, createPaymentsService(ctx), createPaymentEventsService(ctx), createInvoicesService(ctx), createInvoiceReportsService(ctx));
}

export function paymentsRoutes(ctx: AppContext): Router {
  const c = controllerFor(ctx);
  const router = Router();
  router.post('/checkout', allow(policy, 'payOnline'), validate({ body: checkoutSchema }), c.checkout);
  router.post('/', allow(policy, 'recordManual'), validate({ body: manualPaymentSchema }), c.recordManual);
  router.post('/:id/refunds', allow(policy, 'refund'), validate({ params: idParams, body: refundSchema }), c.refund);
  router.get('/export.csv', allow(policy, 'export'), c.exportCsv);
  return router;
}

/** Mounted under /api/webhooks before the JSON parser: the signature is checked on the raw body. */
export function paymentsWebhookRoutes(ctx: AppContext): Router {
  const c = controllerFor(ctx);
  const router = Router();
  router.post('/payments', raw({ type: 'application/json', limit: '1mb' }), c.webhook);
  return router;
}
