// The job queue (pg-boss on the app's own database) and the workers this server runs.
// Features register a worker with addWorker(); jobs are retried with backoff, so an
// e-mail that fails while the SMTP server is down is sent once it is back.
import PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import type { QueueName } from './queue-names.js';

export interface JobQueue {
  send<T extends object>(queue: QueueName, data: T, options?: PgBoss.SendOptions): Promise<string | null>;
  addWorker<T extends object>(queue: QueueName, handler: (data: T) => Promise<void>): Promise<void>;
  schedule(queue: QueueName, cron: string, data?: object): Promise<void>;
  boss: PgBoss | null;
  stop(): Promise<void>;
}

// A fixed short delay (not exponential) so mail resumes within seconds of the SMTP server coming back; about an hour of tries.
const retryOptions = { retryLimit: 1200, retryDelay: 3, retryBackoff: false, expireInSeconds: 120 } as const;

export async function createJobQueue(databaseUrl: string, logger: Logger, enabled: boolean): Promise<JobQueue> {
  if (!enabled) {
    return {
      send: async () => null,
      addWorker: async () => {},
      schedule: async () => {},
      boss: null,
      stop: async () => {},
    };
  }
  const boss = new PgBoss({ connectionString: databaseUrl, max: 4, schema: 'pgboss' });
  boss.on('error', (err) => logger.warn({ err }, 'job queue error'));
  await boss.start();
  const created = new Set<string>();
  const ensureQueue = async (name: string) => {
    if (created.has(name)) return;
    // Several server processes starting together create the same queues at once; pg-boss's
    // DDL can then deadlock (40P01) or collide (23505): the queue exists after a retry.
    for (let attempt = 1; ; attempt += 1) {
      try {
        await boss.createQueue(name);
        break;
      } catch (err) {
        const code = (err as { code?: string }).code;
        if (attempt >= 5 || (code !== '40P01' && code !== '23505')) throw err;
        await new Promise((r) => setTimeout(r, 50 * attempt));
      }
    }
    created.add(name);
  };
  return {
    boss,
    async send(queue, data, options) {
      await ensureQueue(queue);
      return boss.send(queue, data, { ...retryOptions, ...options });
    },
    async addWorker(queue, handler) {
      await ensureQueue(queue);
      await boss.work(queue, { pollingIntervalSeconds: 0.5, batchSize: 1 }, async (jobs) => {
        for (const job of jobs) await handler(job.data as never);
      });
    },
    async schedule(queue, cron, data = {}) {
      await ensureQueue(queue);
      await boss.schedule(queue, cron, data);
    },
    async stop() {
      await boss.stop({ graceful: true, timeout: 5_000, wait: true });
    },
  };
}
