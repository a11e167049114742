// /api/auth: sign-up, sign-in, sign-out, current user, CSRF token, preferences.
import { Router } from 'express';

import { validate } from '../../middleware/validate.js';
import { requireUser } from '../../middleware/authenticate.js';
import { loginBody, signupBody, preferencesBody } from '../../../../shared/schemas/auth.js';
import { createAuthController } from './auth.controller.js';
import { createAuthService } from './auth.service.js';
import { createLoginRateLimits } from './login-rate-limit.js';
import type { Csrf } from './csrf.js';
import type { AppPassport as Passport } from './passport.js';
import type { AppContext } from '../../context.js';

export function authRoutes(ctx: AppContext, passport: Passport, csrf: Csrf): Router {
  const controller = createAuthController(passport, csrf, createAuthService(ctx.sequelize));
  const router = Router();
  router.get('/csrf', controller.csrfToken);
  router.post('/login', ...createLoginRateLimits(ctx.config), validate({ body: loginBody }), controller.login);
  router.post('/signup', validate({ body: signupBody }), controller.signup);
  router.post('/logout', controller.logout);
  router.get('/me', requireUser, controller.me);
  router.patch('/me/preferences', requireUser, validate({ body: preferencesBody }), controller.updatePreferences);
  return router;
}
