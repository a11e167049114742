// /api/auth: sign-up, sign-in, sign-out, current user, CSRF token, preferences, password reset.
import { Router } from 'express';

import { validate } from '../../middleware/validate.js';
import { allow } from '../../middleware/authenticate.js';
import { loginBody, signupBody, preferencesBody, passwordResetRequestBody, passwordResetConfirmBody } from '../../../../shared/schemas/auth.js';
import { createAuthController } from './auth.controller.js';
import { createAuthService } from './auth.service.js';
import { createPasswordResetService } from './password-reset.service.js';
import { createLoginRateLimits, createPasswordResetRateLimits } from './login-rate-limit.js';
import { authPolicy } from './auth.policy.js';
import type { Csrf } from './csrf.js';
import type { AppPassport as Passport } from './passport.js';
import type { AppContext } from '../../context.js';

export function authRoutes(ctx: AppContext, passport: Passport, csrf: Csrf): Router {
  const controller = createAuthController(passport, csrf, ctx.now, createAuthService(ctx), createPasswordResetService(ctx));
  const router = Router();
  router.get('/csrf', controller.csrfToken);
  router.post('/login', ...createLoginRateLimits(ctx.config), validate({ body: loginBody }), controller.login);
  router.post('/signup', validate({ body: signupBody }), controller.signup);
  router.post('/logout', controller.logout);
  router.get('/me', allow(authPolicy, 'viewSelf'), controller.me);
  router.patch('/me/preferences', allow(authPolicy, 'updatePreferences'), validate({ body: preferencesBody }), controller.updatePreferences);
  router.post('/password-reset', ...createPasswordResetRateLimits(ctx.config), validate({ body: passwordResetRequestBody }), controller.requestPasswordReset);
  router.post('/password-reset/confirm', validate({ body: passwordResetConfirmBody }), controller.confirmPasswordReset);
  return router;
}
