// Sign-in, sign-out, the current user, CSRF tokens and password reset. Thin: the rules
// live in passport, auth.service and password-reset.service.
import type { Request, Response, NextFunction, RequestHandler } from 'express';

import { createError } from '../../errors/create-error.js';
import { toSessionUser, type AuthUser } from './auth-user.js';
import type { Csrf } from './csrf.js';
import type { AppPassport as Passport } from './passport.js';
import type { AuthService } from './auth.service.js';
import type { PasswordResetService } from './password-reset.service.js';
import { currentUser } from '../../middleware/authenticate.js';

const badCredentials = () => createError('unauthenticated', 'That e-mail and password do not match an account.', 401);

function logIn(req: Request, user: AuthUser): Promise<void> {
  return new Promise((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())));
}

/** Signs the user in on a fresh session id (passport regenerates it) and answers with the user and a new CSRF token. */
export async function signIn(req: Request, res: Response, csrf: Csrf, now: () => Date, user: AuthUser, status = 200) {
  await logIn(req, user);
  // The start of the session's absolute lifetime, on the app's clock (absoluteSessionExpiry).
  req.session.createdAt = now().getTime();
  res.status(status).json({ user: toSessionUser(user), csrfToken: csrf.issue(req, res) });
}

export function createAuthController(passport: Passport, csrf: Csrf, now: () => Date, service: AuthService, passwordReset: PasswordResetService) {

  const login: RequestHandler = (req, res, next: NextFunction) => {
    passport.authenticate('local', { session: false }, (err: unknown, user: AuthUser | false) => {
      if (err) return next(err);
      if (!user) return next(badCredentials());
      signIn(req, res, csrf, now, user).catch(next);
    })(req, res, next);
  };

  return {
    login,
    async signup(req: Request, res: Response) {
      const user = await service.signup(req.body);
      await signIn(req, res, csrf, now, user, 201);
    },
    logout(req: Request, res: Response, next: NextFunction) {
      req.logout((err) => {
        if (err) return next(err);
        req.session.regenerate((regenerateErr) => {
          if (regenerateErr) return next(regenerateErr);
          res.json({ ok: true, csrfToken: csrf.issue(req, res) });
        });
      });
    },
    me(req: Request, res: Response) {
      res.json({ user: toSessionUser(currentUser(req)) });
    },
    csrfToken(req: Request, res: Response) {
      res.json({ csrfToken: csrf.issue(req, res), signedIn: Boolean(req.user) });
    },
    async updatePreferences(req: Request, res: Response) {
      const user = await service.updatePreferences(currentUser(req), req.body);
      res.json({ user: toSessionUser(user) });
    },
    /** Always 202: the answer does not reveal whether the e-mail has an account. */
    async requestPasswordReset(req: Request, res: Response) {
      await passwordReset.request(req.body);
      res.status(202).json({ ok: true });
    },
    async confirmPasswordReset(req: Request, res: Response) {
      await passwordReset.confirm(req.body);
      res.json({ ok: true });
    },
  };
}
