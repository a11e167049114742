// Boots the real app for a test file: its own database copy, its own SMTP sink, the HTTP
// server on a free port. Nothing of ours is mocked.
import { loadConfig, type Config } from '../../server/src/config/env.js';
import { createApp, type CreatedApp } from '../../server/src/app.js';
import { startSmtpSink, type SmtpSink } from '../../server/src/fakes/smtp-sink.js';
import { startPaymentsStandIn, type PaymentsStandIn } from '../../server/src/fakes/payments-stand-in.js';
import { createTestDatabase } from './test-database.js';
import { useBuilderDatabase } from './builders/builder-database.js';

export interface TestApp extends CreatedApp {
  baseUrl: string;
  port: number;
  databaseUrl: string;
  sink: SmtpSink;
  /** The payments stand-in; its webhooks go to this app. */
  payments: PaymentsStandIn;
  config: Config;
  /** Closes the app and starts it again against the same database (a server restart). */
  restart(): Promise<TestApp>;
  /** Closes everything and drops the database. */
  stop(): Promise<void>;
}

export interface TestAppOptions {
  now?: () => Date;
  config?: Partial<Config>;
  env?: Record<string, string>;
}

export async function startTestApp(options: TestAppOptions = {}): Promise<TestApp> {
  const database = await createTestDatabase();
  const sink = await startSmtpSink();
  const payments = await startPaymentsStandIn(loadConfig({ ...options.env }).payments);
  return boot(database, sink, payments, options);
}

async function boot(database: { url: string; drop: () => Promise<void> }, sink: SmtpSink, payments: PaymentsStandIn, options: TestAppOptions): Promise<TestApp> {
  const config = loadConfig(
    {
      NODE_ENV: 'test',
      DATABASE_URL: database.url,
      LOG_LEVEL: 'silent',
      SMTP_PORT: String(sink.smtpPort),
      MAIL_SINK_URL: `http://127.0.0.1:${sink.httpPort}`,
      SERVE_CLIENT: 'true',
      CLIENT_DIST: process.env.CLIENT_DIST ?? 'dist/client',
      DATABASE_POOL_MAX: '20',
      PAYMENTS_API_URL: payments.url,
      ...options.env,
    },
    options.config,
  );
  const created = await createApp(config, { now: options.now });
  useBuilderDatabase(created.context);
  const port = await created.listen(0, '127.0.0.1');
  payments.setWebhookUrl(`http://127.0.0.1:${port}/api/webhooks/payments`);
  const testApp: TestApp = {
    ...created,
    baseUrl: `http://127.0.0.1:${port}`,
    port,
    databaseUrl: database.url,
    sink,
    payments,
    config,
    async restart() {
      await created.close();
      return boot(database, sink, payments, options);
    },
    async stop() {
      await created.close();
      await sink.stop();
      await payments.stop();
      await database.drop();
    },
  };
  return testApp;
}

/** Waits until check() returns a truthy value, polling; fails after timeoutMs. */
export async function eventually<T>(check: () => Promise<T> | T, timeoutMs = 10_000, intervalMs = 100): Promise<NonNullable<T>> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value) return value as NonNullable<T>;
    if (Date.now() > deadline) throw new Error(`condition not met within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, intervalMs));
  }
}
