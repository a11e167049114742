// CSRF protection by double submit (csrf-csrf): GET /api/auth/csrf hands out a token bound
// to the session; every state-changing request sends it back as X-CSRF-Token.
import { doubleCsrf } from 'csrf-csrf';
import type { Request, Response } from 'express';
import type { Config } from '../../config/env.js';

export function createCsrf(config: Config) {
  const { generateCsrfToken, doubleCsrfProtection } = doubleCsrf({
    getSecret: () => config.session.secret,
    getSessionIdentifier: (req) => req.sessionID ?? '',
    cookieName: 'pp.csrf',
    cookieOptions: { sameSite: 'lax', secure: config.session.cookieSecure === true, httpOnly: true, path: '/' },
    getCsrfTokenFromRequest: (req) => req.headers['x-csrf-token'] as string | undefined,
  });
  return {
    protection: doubleCsrfProtection,
    /**
     * The session's token, saving the session first so its id (which the token is bound to)
     * stays stable. A valid token already in the cookie is handed out again, not replaced: the
     * phone's page and its service worker may each ask for one at once, and a replaced token
     * would refuse the other's send. A new session (after sign-in) gets a new token.
     */
    issue(req: Request, res: Response): string {
      req.session.csrfIssued = true;
      return generateCsrfToken(req, res, { overwrite: false });
    },
  };
}

export type Csrf = ReturnType<typeof createCsrf>;
