// The signed-in user as passport puts it on req.user.
import type { AuthUser } from '../modules/auth/auth-user.js';

declare global {
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends AuthUser {}
  }
}

declare module 'express-session' {
  interface SessionData {
    createdAt?: number;
    csrfIssued?: boolean;
  }
}

export {};
