// createApp(config) builds the whole server: Express app, HTTP server, socket.io, job
// queue and database, and returns them with close(). index.ts only listens; tests start
// it on port 0 against their own database.
import express from 'express';
import { createServer, type Server as HttpServer } from 'node:http';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import helmet from 'helmet';
import compression from 'compression';
import cookieParser from 'cookie-parser';
import pg from 'pg';
import { pino } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Config } from './config/env.js';
import type { AppContext, RealtimeServer } from './context.js';
import { createSequelize } from './db/sequelize.js';
import { defineModels } from './db/models/index.js';
import { createJobQueue } from './jobs/queue.js';
import { startEmailWorker } from './jobs/send-email.job.js';
import { createMailer } from './mail/mailer.js';
import { createRealtimeServer } from './realtime/io.js';
import { createPassport } from './modules/auth/passport.js';
import { createSessionMiddleware, absoluteSessionExpiry } from './modules/auth/session.js';
import { createCsrf } from './modules/auth/csrf.js';
import { apiRoutes, webhookRoutes, startFeatureWorkers } from './modules/api-routes.js';
import { apiNotFound } from './middleware/not-found.js';
import { errorHandler } from './middleware/error-handler.js';
import { notFound } from './errors/http-errors.js';

export interface CreatedApp {
  app: express.Express;
  io: RealtimeServer;
  server: HttpServer;
  context: AppContext;
  /** Starts listening; resolves with the port (use 0 in tests). */
  listen(port?: number, host?: string): Promise<number>;
  close(): Promise<void>;
}

export async function createApp(config: Config, options: { now?: () => Date } = {}): Promise<CreatedApp> {
  const logger = pino({ level: config.logLevel });
  const sequelize = createSequelize(config.databaseUrl, config.databasePoolMax);
  const models = defineModels(sequelize);
  const pool = new pg.Pool({ connectionString: config.databaseUrl, max: 5 });
  pool.on('error', (err) => logger.warn({ err }, 'database pool error'));
  // The realtime adapter holds one LISTEN connection for good, so it gets a pool of its
  // own: a dropped connection (database restart) is logged, not fatal, and never released,
  // so closing that pool is bounded by a timeout below.
  const realtimePool = config.realtimeAdapter === 'postgres' ? new pg.Pool({ connectionString: config.databaseUrl, max: 3 }) : null;
  realtimePool?.on('error', (err) => logger.warn({ err }, 'realtime pool error'));
  realtimePool?.on('connect', (client) => client.on('error', (err) => logger.warn({ err }, 'realtime connection lost')));

  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  const server = createServer(app);

  const passport = createPassport(models);
  const sessionMiddleware = createSessionMiddleware(config, pool);
  const now = options.now ?? (() => new Date());
  const sessionStack = [sessionMiddleware, passport.initialize(), passport.session(), absoluteSessionExpiry(config, now)];
  const io = createRealtimeServer(server, sessionStack, realtimePool);
  const jobs = await createJobQueue(config.databaseUrl, logger, config.jobsEnabled, config.jobRetry);
  const mailer = createMailer(config);
  const context: AppContext = { config, sequelize, models, io, jobs, logger, now };
  const csrf = createCsrf(config);

  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      // One short line a request: never headers (cookies, CSRF tokens) or bodies (passwords).
      serializers: {
        req: (req: { id: unknown; method: string; url: string }) => ({ id: req.id, method: req.method, url: req.url.split('?')[0] }),
        res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      },
    }),
  );
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'img-src': ["'self'", 'data:', 'blob:', ...(config.mapTileUrl ? [new URL(config.mapTileUrl.replace(/\{[a-z]\}/g, 'a')).origin] : [])],
          'style-src': ["'self'", "'unsafe-inline'"],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );
  app.use('/api/webhooks', webhookRoutes(context));
  app.use(express.json({ limit: config.jsonBodyLimit }));
  app.use(cookieParser());
  // Sessions on the API only. A rolling session cookie is sent again with every answer, so a
  // static file asked with the session of before sign-in (the service worker precaches the
  // whole app while the sign-in page is open) and answered after it would set that ended
  // session back in the browser and sign the user straight out again.
  app.use('/api', ...sessionStack);
  app.use('/api', csrf.protection);
  app.use('/api', apiRoutes(context, passport, csrf));
  app.use('/api', apiNotFound);

  const clientDist = resolve(config.clientDist);
  if (config.serveClient && existsSync(resolve(clientDist, 'index.html'))) {
    // The app's code and styles compressed for a browser that asks (phones in the field are on
    // weak signal; images, fonts and files under 1 kB go as they are). The API's JSON is not:
    // on this machine compressing each answer took a third of the read throughput (README).
    app.use(compression());
    // Built files under assets/ carry a hash of their content in their name: kept a year.
    // A missing one is a 404, not the app's page in its place.
    app.use('/assets', express.static(resolve(clientDist, 'assets'), { index: false, maxAge: '1y', immutable: true }), (_req, _res, next) => next(notFound('That file')));
    app.use(express.static(clientDist, { index: false, maxAge: '1h' }));
    app.get('/{*any}', (_req, res) => res.sendFile(resolve(clientDist, 'index.html')));
  }
  app.use(errorHandler);

  await startEmailWorker(jobs, mailer);
  await startFeatureWorkers(context);

  let closed = false;
  return {
    app,
    io,
    server,
    context,
    listen(port = config.port, host = config.host) {
      return new Promise((resolvePort, reject) => {
        server.once('error', reject);
        server.listen(port, host, () => {
          const address = server.address();
          resolvePort(typeof address === 'object' && address ? address.port : port);
        });
      });
    },
    async close() {
      if (closed) return;
      closed = true;
      await new Promise<void>((r) => io.close(() => r()));
      if (server.listening) await new Promise<void>((r) => server.close(() => r()));
      await jobs.stop();
      mailer.close();
      await sequelize.close();
      await pool.end();
      if (realtimePool) await Promise.race([realtimePool.end(), new Promise((r) => setTimeout(r, 1_000).unref())]);
    },
  };
}
