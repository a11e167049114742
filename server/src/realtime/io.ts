// socket.io on the app's HTTP server. Sockets are authenticated by the same session
// cookie as HTTP; a socket without a signed-in user is refused. With the Postgres
// adapter, several server processes share rooms.
import type { Server as HttpServer } from 'node:http';
import type { RequestHandler } from 'express';
import { Server } from 'socket.io';
import { createAdapter } from '@socket.io/postgres-adapter';
import type pg from 'pg';
import type { RealtimeServer } from '../context.js';
import { rooms } from './rooms.js';

export function createRealtimeServer(httpServer: HttpServer, sessionMiddlewares: RequestHandler[], pool: pg.Pool | null): RealtimeServer {
  const io: RealtimeServer = new Server(httpServer, { serveClient: false, cors: { origin: false } });
  if (pool) io.adapter(createAdapter(pool, { tableName: 'socket_io_attachments', heartbeatInterval: 2_000 }));
  for (const middleware of sessionMiddlewares) io.engine.use(middleware);

  io.use((socket, next) => {
    const user = (socket.request as unknown as { user?: Express.User }).user;
    if (!user) return next(new Error('unauthenticated'));
    socket.data.userId = user.id;
    socket.data.organizationId = user.organizationId;
    next();
  });

  io.on('connection', (socket) => {
    const user = (socket.request as unknown as { user: Express.User }).user;
    const joined = [rooms.user(user.id)];
    if (user.organizationId) joined.push(rooms.organization(user.organizationId));
    if (user.roleKey === 'admin') joined.push(rooms.admins());
    socket.join(joined);
    socket.emit('session:ready', { userId: user.id, rooms: joined });
    socket.on('session:ping', (ack) => {
      if (typeof ack === 'function') ack({ at: new Date().toISOString() });
    });
  });
  return io;
}
