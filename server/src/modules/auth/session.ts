// Sessions in PostgreSQL (connect-pg-simple), so they survive a restart. The cookie is
// httpOnly, SameSite=Lax and Secure over HTTPS; it rolls with activity (idle expiry) and a
// session older than the absolute limit is ended whatever its activity. The stored expiry
// is moved on at most once every few minutes per session and process, not on every
// request: the idle limit is hours long, and a write per read was most of a read's cost.
import session, { type SessionData } from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import type { RequestHandler } from 'express';
import type pg from 'pg';
import type { Config } from '../../config/env.js';
import { preparingPgPool } from '../../db/query-rows.js';

export const sessionCookieName = 'pp.sid';

/** How often one process moves a session's stored expiry on while it is in use. */
export const sessionTouchIntervalMs = 5 * 60_000;
const rememberedTouches = 50_000;

function throttledTouchStore(PgStore: ReturnType<typeof connectPgSimple>) {
  return class ThrottledTouchStore extends PgStore {
    private touchedAt = new Map<string, number>();

    override touch(sid: string, sess: SessionData, callback?: () => void) {
      const now = Date.now();
      const last = this.touchedAt.get(sid);
      if (last !== undefined && now - last < sessionTouchIntervalMs) return callback?.();
      if (this.touchedAt.size >= rememberedTouches) this.touchedAt.clear();
      this.touchedAt.set(sid, now);
      super.touch(sid, sess, callback);
    }

    override set(sid: string, sess: SessionData, callback?: (err?: unknown) => void) {
      this.touchedAt.set(sid, Date.now());
      super.set(sid, sess, callback);
    }

    override destroy(sid: string, callback?: (err?: unknown) => void) {
      this.touchedAt.delete(sid);
      super.destroy(sid, callback);
    }
  };
}

export function createSessionMiddleware(config: Config, pool: pg.Pool): RequestHandler {
  const Store = throttledTouchStore(connectPgSimple(session));
  return session({
    name: sessionCookieName,
    secret: config.session.secret,
    // Its few statements (read, write, touch, end, prune) are prepared once per connection, so
    // the session read on every signed-in request is not planned each time.
    store: new Store({ pool: preparingPgPool(pool), tableName: 'user_sessions', pruneSessionInterval: 15 * 60 }),
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
