// Sessions in PostgreSQL (connect-pg-simple), so they survive a restart. The cookie is
// httpOnly, SameSite=Lax and Secure over HTTPS; it rolls with activity (idle expiry) and a
// session older than the absolute limit is ended whatever its activity.
import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { RequestHandler } from 'express';
import type pg from 'pg';
import type { Config } from '../../config/env.js';

export const sessionCookieName = 'pp.sid';

export function createSessionMiddleware(config: Config, pool: pg.Pool): RequestHandler {
  const PgStore = connectPgSimple(session);
  return session({
    name: sessionCookieName,
    secret: config.session.secret,
    store: new PgStore({ pool, tableName: 'user_sessions', pruneSessionInterval: 15 * 60 }),
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: true,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.session.cookieSecure,
      maxAge: config.session.idleMinutes * 60_000,
    },
  });
}

/** Ends a session past its absolute lifetime; stamps new ones with their start. */
export function absoluteSessionExpiry(config: Config, now: () => Date): RequestHandler {
  const limitMs = config.session.absoluteHours * 3_600_000;
  return (req, _res, next) => {
    if (!req.session) return next();
    const started = req.session.createdAt;
    if (started && now().getTime() - started > limitMs) {
      // passport has already put the user on the request: take it off with the session.
      return req.session.regenerate((err) => {
        req.user = undefined;
        next(err);
      });
    }
    if (!started && req.session.passport) req.session.createdAt = now().getTime();
    next();
  };
}

declare module 'express-session' {
  interface SessionData {
    passport?: { user?: string };
  }
}
