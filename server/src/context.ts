// What createApp() builds once and hands to every feature: config, database, realtime
// server and job queue. Services take it instead of reaching for globals.
import type { Sequelize } from 'sequelize';
import type { Models } from './db/models/index.js';
import type { Server as SocketServer } from 'socket.io';
import type { Logger } from 'pino';
import type { Config } from './config/env.js';
import type { JobQueue } from './jobs/queue.js';
import type { ClientToServerEvents, InterServerEvents, ServerToClientEvents, SocketData } from '../../shared/events.js';

export type RealtimeServer = SocketServer<ClientToServerEvents, ServerToClientEvents, InterServerEvents, SocketData>;

export interface AppContext {
  config: Config;
  sequelize: Sequelize;
  /** This app's models, bound to its own Sequelize instance. */
  models: Models;
  io: RealtimeServer;
  jobs: JobQueue;
  logger: Logger;
  /** The clock services use; tests move it instead of sleeping. */
  now: () => Date;
}
