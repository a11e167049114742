// Sign-in, sign-out, the current user and CSRF tokens. Thin: the rules live in passport
// and auth.service.
import type { Request, Response, NextFunction, RequestHandler } from 'express';

import { createError } from '../../errors/create-error.js';
import { toSessionUser, type AuthUser } from './auth-user.js';
import type { Csrf } from './csrf.js';
import type { AppPassport as Passport } from './passport.js';
import type { AuthService } from './auth.service.js';
import { currentUser } from '../../middleware/authenticate.js';

const badCredentials = () => createError('unauthenticated', 'That e-mail and password do not match an account.', 401);

function logIn(req: Request, user: AuthUser): Promise<void> {
  return new Promise((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())));
}

export function createAuthController(passport: Passport, csrf: Csrf, service: AuthService) {
  const signIn = async (req: Request, res: Response, user: AuthUser, status = 200) => {
    await logIn(req, user);
    req.session.createdAt = Date.now();
    res.status(status).json({ user: toSessionUser(user), csrfToken: csrf.issue(req, res) });
  };

  const login: RequestHandler = (req, res, next: NextFunction) => {
    passport.authenticate('local', { session: false }, (err: unknown, user: AuthUser | false) => {
      if (err) return next(err);
      if (!user) return next(badCredentials());
      signIn(req, res, user).catch(next);
    })(req, res, next);
  };

  return {
    login,
    async signup(req: Request, res: Response) {
      const user = await service.signup(req.body);
      await signIn(req, res, user, 201);
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
  };
}
