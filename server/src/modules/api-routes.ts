// Every feature's router under /api. Features add their line here.
import { Router } from 'express';

import type { AppContext } from '../context.js';
import type { AppPassport as Passport } from './auth/passport.js';
import type { Csrf } from './auth/csrf.js';
import { healthRoutes } from './health/health.routes.js';
import { authRoutes } from './auth/auth.routes.js';
import { requestsRoutes } from './requests/requests.routes.js';
import { yardsRoutes } from './yards/yards.routes.js';
import { commitmentOfferRoutes, commitmentsRoutes } from './commitments/commitments.routes.js';
import { agreementsRoutes } from './agreements/agreements.routes.js';
import { placementsRoutes } from './placements/placements.routes.js';
import { calendarRoutes } from './calendar/calendar.routes.js';
import { exportsRoutes } from './exports/exports.routes.js';
import { organizationRoutes } from './organization/organization.routes.js';
import { dashboardRoutes } from './dashboard/dashboard.routes.js';
import { adminRoutes } from './admin/admin.routes.js';
import { spraysRoutes } from './sprays/sprays.routes.js';
import { alertsRoutes } from './alerts/alerts.routes.js';
import { pestsRoutes } from './pests/pests.routes.js';
import { blocksRoutes } from './blocks/blocks.routes.js';
import { weatherRoutes } from './weather/weather.routes.js';
import { blockBloomRoutes, bloomRoutes } from './bloom/bloom.routes.js';
import { metaRoutes } from './meta/meta.routes.js';
import { startBloomDigestWorker } from './bloom/bloom-digest.job.js';
import { startConflictRecheckWorker } from './alerts/conflict-rechecks.js';
import { startAlertPublishWorker } from './alerts/alert-publish.js';
import { invoicesRoutes } from './invoices/invoices.routes.js';
import { paymentsRoutes, paymentsWebhookRoutes } from './payments/payments.routes.js';
import { startOverdueReminders } from './invoices/overdue-reminders.job.js';
import { startIdempotencyKeyPrune } from './placements/idempotency-keys-prune.job.js';
import { startInvoiceEmailWorker } from './invoices/invoice-mail.js';

export function apiRoutes(ctx: AppContext, passport: Passport, csrf: Csrf): Router {
  const router = Router();
  router.use('/health', healthRoutes(ctx));
  router.use('/auth', authRoutes(ctx, passport, csrf));
  router.use('/meta', metaRoutes(ctx));
  router.use('/blocks', blocksRoutes(ctx));
  router.use('/blocks', blockBloomRoutes(ctx));
  router.use('/weather', weatherRoutes(ctx));
  router.use('/bloom', bloomRoutes(ctx));
  router.use('/requests', requestsRoutes(ctx));
  router.use('/requests', commitmentOfferRoutes(ctx));
  router.use('/yards', yardsRoutes(ctx));
  router.use('/commitments', commitmentsRoutes(ctx));
  router.use('/agreements', agreementsRoutes(ctx));
  router.use('/placements', placementsRoutes(ctx));
  router.use('/calendar', calendarRoutes(ctx));
  router.use('/exports', exportsRoutes(ctx));
  router.use('/organization', organizationRoutes(ctx, csrf));
  router.use('/dashboard', dashboardRoutes(ctx));
  router.use('/admin', adminRoutes(ctx));
  router.use('/sprays', spraysRoutes(ctx));
  router.use('/alerts', alertsRoutes(ctx));
  router.use('/pests', pestsRoutes(ctx));
  router.use('/invoices', invoicesRoutes(ctx));
  router.use('/payments', paymentsRoutes(ctx));
  return router;
}

/**
 * Routes that take a raw body and their own signature instead of a session and CSRF
 * token (payment webhooks). Mounted before the JSON parser.
 */
export function webhookRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use(paymentsWebhookRoutes(ctx));
  return router;
}

/** Started with the app: queue workers and schedules of each feature. */
export async function startFeatureWorkers(ctx: AppContext): Promise<void> {
  await startBloomDigestWorker(ctx);
  await startOverdueReminders(ctx);
  await startInvoiceEmailWorker(ctx);
  await startConflictRecheckWorker(ctx);
  await startAlertPublishWorker(ctx);
  await startIdempotencyKeyPrune(ctx);
}
