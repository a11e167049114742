// A signed-in user as a browser would be: a supertest agent against a listening server
// that keeps the session cookie and CSRF token, and socket.io clients opened with that
// cookie. Sessions live in PostgreSQL, so one sign-in works against every server process.
import request from 'supertest';
import { io as connect, type Socket } from 'socket.io-client';
import { defaultTestPassword } from './builders/accounts.js';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/events.js';
import type { AlertDto } from '../../shared/schemas/alerts.js';

export type AppSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

export interface Session { agent: ReturnType<typeof request.agent>; csrf: string; cookie: string }

export async function signIn(baseUrl: string, email: string): Promise<Session> {
  const agent = request.agent(baseUrl);
  const csrf = (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken;
  const res = await agent.post('/api/auth/login').set('X-CSRF-Token', csrf).send({ email, password: defaultTestPassword }).expect(200);
  const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]).join('; ');
  return { agent, csrf: res.body.csrfToken, cookie };
}

/** A request with this session against any server process (sessions live in PostgreSQL). */
export function withSession(baseUrl: string, session: Session) {
  const r = request(baseUrl);
  return {
    get: (path: string) => r.get(path).set('Cookie', session.cookie),
    post: (path: string) => r.post(path).set('Cookie', session.cookie).set('X-CSRF-Token', session.csrf),
    patch: (path: string) => r.patch(path).set('Cookie', session.cookie).set('X-CSRF-Token', session.csrf),
  };
}

export function openSocket(baseUrl: string, session: Session): Promise<AppSocket> {
  const socket: AppSocket = connect(baseUrl, { transports: ['websocket'], extraHeaders: { Cookie: session.cookie }, reconnection: false, forceNew: true });
  return new Promise((resolve, reject) => {
    socket.once('session:ready', () => resolve(socket));
    socket.once('connect_error', reject);
  });
}

export interface AlertDelivery { event: 'alert:raised' | 'alert:updated'; alert: AlertDto }

/** Records every alert event a socket receives, as delivered (replays included). */
export function recordAlerts(socket: AppSocket): AlertDelivery[] {
  const events: AlertDelivery[] = [];
  socket.on('alert:raised', (alert) => events.push({ event: 'alert:raised', alert }));
  socket.on('alert:updated', (alert) => events.push({ event: 'alert:updated', alert }));
  return events;
}

/** What a client shows after dropping repeated deliveries (by alert id and revision), as client/src/stores/alerts.ts does. */
export function distinctRevisions(events: AlertDelivery[]): AlertDelivery[] {
  const seen = new Set<string>();
  return events.filter((e) => {
    const key = `${e.alert.id}@${e.alert.revision}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}
