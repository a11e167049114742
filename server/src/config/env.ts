// The server's configuration: parsed once from the environment with zod, with safe
// defaults for the local demo. The only module that reads process.env.
import { z } from 'zod';

const bool = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  PUBLIC_URL: z.string().url().optional(),
  DATABASE_URL: z.string().min(1).default('postgres://pollenpact@127.0.0.1:54329/pollenpact'),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  SESSION_SECRET: z.string().min(16).default('pollenpact-local-demo-session-secret'),
  SESSION_IDLE_MINUTES: z.coerce.number().int().min(1).default(60 * 12),
  SESSION_ABSOLUTE_HOURS: z.coerce.number().int().min(1).default(24 * 7),
  COOKIE_SECURE: z.enum(['auto', 'true', 'false']).default('auto'),
  JSON_BODY_LIMIT: z.string().default('1mb'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  SERVE_CLIENT: bool.optional(),
  CLIENT_DIST: z.string().default('dist/client'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  MAIL_FROM: z.string().default('Pollenpact <no-reply@pollenpact.test>'),
  MAIL_SINK_URL: z.string().url().default('http://127.0.0.1:2526'),
  PAYMENTS_API_URL: z.string().url().default('http://127.0.0.1:12111'),
  PAYMENTS_SECRET_KEY: z.string().default('sk_test_pollenpact_local'),
  PAYMENTS_WEBHOOK_SECRET: z.string().default('whsec_pollenpact_local'),
  MAP_TILE_URL: z.string().default(''),
  MAP_ATTRIBUTION: z.string().default(''),
  BLOOM_DIGEST_DELAY_SECONDS: z.coerce.number().int().min(0).max(86_400).default(900),
  UPLOAD_DIR: z.string().default('.data/uploads'),
  LOGIN_RATE_LIMIT_PER_ACCOUNT: z.coerce.number().int().min(1).default(10),
  LOGIN_RATE_LIMIT_PER_ADDRESS: z.coerce.number().int().min(1).default(50),
  JOBS_ENABLED: bool.default(true),
  REALTIME_ADAPTER: z.enum(['postgres', 'memory']).default('postgres'),
  JOB_RETRY_DELAY_SECONDS: z.coerce.number().int().min(1).max(3_600).default(2),
  JOB_RETRY_BACKOFF: bool.default(true),
  JOB_RETRY_LIMIT: z.coerce.number().int().min(0).max(100).default(12),
  /** Test-only fault: the process kills itself right after a spray's alerts are committed. */
  FAULT_EXIT_AFTER_ALERT_COMMIT: bool.default(false),
  /** Server processes behind Node's cluster module (the usual name for it on hosting platforms). */
  WEB_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(1),
});

export type Env = z.infer<typeof envSchema>;

export interface Config {
  env: Env['NODE_ENV'];
  host: string;
  port: number;
  publicUrl: string;
  databaseUrl: string;
  databasePoolMax: number;
  session: { secret: string; idleMinutes: number; absoluteHours: number; cookieSecure: 'auto' | boolean };
  jsonBodyLimit: string;
  logLevel: Env['LOG_LEVEL'];
  serveClient: boolean;
  clientDist: string;
  mail: { host: string; port: number; from: string; sinkUrl: string };
  payments: { apiUrl: string; secretKey: string; webhookSecret: string };
  mapTileUrl: string;
  mapAttribution: string;
  /** How long bloom-window revisions are gathered before an apiary's e-mail digest goes out. */
  bloomDigestDelaySeconds: number;
  uploadDir: string;
  loginRateLimit: { perAccount: number; perAddress: number };
  jobsEnabled: boolean;
  realtimeAdapter: 'postgres' | 'memory';
  /** Retries of failed jobs: delay, doubling with jitter when backoff is on, number of tries. */
  jobRetry: { delaySeconds: number; backoff: boolean; limit: number };
  /** Faults the fault tests inject; honoured only when NODE_ENV=test. */
  faults: { exitAfterAlertCommit: boolean };
  /** How many server processes index.ts runs (1: no cluster). */
  webConcurrency: number;
}

/** Parses an environment (process.env by default) into a Config; throws naming each bad variable. */
export function loadConfig(source: Record<string, string | undefined> = process.env, overrides: Partial<Config> = {}): Config {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
    throw new Error(`Invalid configuration: ${problems}`);
  }
  const e = parsed.data;
  const config: Config = {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    publicUrl: e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`,
    databaseUrl: e.DATABASE_URL,
    databasePoolMax: e.DATABASE_POOL_MAX,
    session: {
      secret: e.SESSION_SECRET,
      idleMinutes: e.SESSION_IDLE_MINUTES,
      absoluteHours: e.SESSION_ABSOLUTE_HOURS,
      cookieSecure: e.COOKIE_SECURE === 'auto' ? 'auto' : e.COOKIE_SECURE === 'true',
    },
    jsonBodyLimit: e.JSON_BODY_LIMIT,
    logLevel: e.LOG_LEVEL,
    serveClient: e.SERVE_CLIENT ?? e.NODE_ENV === 'production',
    clientDist: e.CLIENT_DIST,
    mail: { host: e.SMTP_HOST, port: e.SMTP_PORT, from: e.MAIL_FROM, sinkUrl: e.MAIL_SINK_URL },
    payments: { apiUrl: e.PAYMENTS_API_URL, secretKey: e.PAYMENTS_SECRET_KEY, webhookSecret: e.PAYMENTS_WEBHOOK_SECRET },
    mapTileUrl: e.MAP_TILE_URL,
    mapAttribution: e.MAP_ATTRIBUTION,
    bloomDigestDelaySeconds: e.BLOOM_DIGEST_DELAY_SECONDS,
    uploadDir: e.UPLOAD_DIR,
    loginRateLimit: { perAccount: e.LOGIN_RATE_LIMIT_PER_ACCOUNT, perAddress: e.LOGIN_RATE_LIMIT_PER_ADDRESS },
    jobsEnabled: e.JOBS_ENABLED,
    realtimeAdapter: e.REALTIME_ADAPTER,
    jobRetry: { delaySeconds: e.JOB_RETRY_DELAY_SECONDS, backoff: e.JOB_RETRY_BACKOFF, limit: e.JOB_RETRY_LIMIT },
    faults: { exitAfterAlertCommit: e.NODE_ENV === 'test' && e.FAULT_EXIT_AFTER_ALERT_COMMIT },
    webConcurrency: e.WEB_CONCURRENCY,
  };
  return { ...config, ...overrides };
}
