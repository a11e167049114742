// Every feature's router under /api. Features add their line here.
import { Router } from 'express';

import type { AppContext } from '../context.js';
import type { AppPassport as Passport } from './auth/passport.js';
import type { Csrf } from './auth/csrf.js';
import { healthRoutes } from './health/health.routes.js';
import { authRoutes } from './auth/auth.routes.js';

export function apiRoutes(ctx: AppContext, passport: Passport, csrf: Csrf): Router {
  const router = Router();
  router.use('/health', healthRoutes(ctx));
  router.use('/auth', authRoutes(ctx, passport, csrf));
  return router;
}

/**
 * Routes that take a raw body and their own signature instead of a session and CSRF
 * token (payment webhooks). Mounted before the JSON parser.
 */
export function webhookRoutes(_ctx: AppContext): Router {
  const router = Router();
  return router;
}

/** Started with the app: queue workers and schedules of each feature. */
export async function startFeatureWorkers(_ctx: AppContext): Promise<void> {}
