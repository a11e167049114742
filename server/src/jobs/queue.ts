// The job queue (pg-boss on the app's own database) and the workers this server runs.
// Features register a worker with addWorker(). A job can be written inside the caller's
// database transaction (`transaction` option): it exists exactly when the change that asked
// for it is committed, and the local worker is woken at commit instead of waiting to poll.
// Failed jobs are retried with backoff (JOB_RETRY_* settings); after the last try a job
// stays 'failed' with its error, which the admin's queue view shows.
import PgBoss from 'pg-boss';
import type { Sequelize, Transaction } from 'sequelize';
import type { Logger } from 'pino';
import { queueNames, queuePolicies, type QueueName } from './queue-names.js';
import { queryRows } from '../db/query-rows.js';

export interface JobRetry {
  delaySeconds: number;
  backoff: boolean;
  limit: number;
}

export type JobSendOptions = PgBoss.SendOptions & {
  /** Write the job in this transaction (with the Sequelize instance that owns it). */
  transaction?: { sequelize: Sequelize; transaction: Transaction };
};

export interface JobQueue {
  send<T extends object>(queue: QueueName, data: T, options?: JobSendOptions): Promise<string | null>;
  /** Several jobs of one queue in one statement (with the queue's retries), optionally in a transaction. */
  sendAll<T extends object>(queue: QueueName, data: T[], options?: Pick<JobSendOptions, 'transaction'>): Promise<void>;
  addWorker<T extends object>(queue: QueueName, handler: (data: T) => Promise<void>): Promise<void>;
  schedule(queue: QueueName, cron: string, data?: object): Promise<void>;
  /** Lets this process's workers of a queue fetch at once instead of at their next poll. */
  wake(queue: QueueName): void;
  boss: PgBoss | null;
  stop(): Promise<void>;
}

/** pg-boss's database hook on a Sequelize transaction's own connection. */
export function transactionDb(sequelize: Sequelize, transaction: Transaction): PgBoss.Db {
  return {
    async executeSql(text, values) {
      const bind = values.map((v) => (v === undefined ? null : v));
      return { rows: await queryRows(sequelize, text, { bind, transaction }) };
    },
  };
}

export async function createJobQueue(databaseUrl: string, logger: Logger, enabled: boolean, retry: JobRetry = { delaySeconds: 2, backoff: true, limit: 12 }): Promise<JobQueue> {
  if (!enabled) {
    return {
      send: async () => null,
      sendAll: async () => {},
      addWorker: async () => {},
      schedule: async () => {},
      wake: () => {},
      boss: null,
      stop: async () => {},
    };
  }
  const retryOptions = { retryLimit: retry.limit, retryDelay: retry.delaySeconds, retryBackoff: retry.backoff, expireInSeconds: 120 };
  const boss = new PgBoss({ connectionString: databaseUrl, max: 4, schema: 'pgboss' });
  boss.on('error', (err) => logger.warn({ err }, 'job queue error'));
  await boss.start();
  // Every queue exists before the first send: a send inside a transaction cannot create one.
  for (const name of Object.values(queueNames)) await createQueue(boss, name);
  const workers = new Map<QueueName, string[]>();
  const wake = (queue: QueueName) => {
    for (const id of workers.get(queue) ?? []) boss.notifyWorker(id);
  };
  return {
    boss,
    async send(queue, data, options = {}) {
      const { transaction, ...rest } = options;
      if (!transaction) return boss.send(queue, data, { ...retryOptions, ...rest });
      const id = await boss.send(queue, data, { ...retryOptions, ...rest, db: transactionDb(transaction.sequelize, transaction.transaction) });
      transaction.transaction.afterCommit(() => wake(queue));
      return id;
    },
    async sendAll(queue, data, options = {}) {
      if (!data.length) return;
      const jobs = data.map((d) => ({ name: queue, data: d, ...retryOptions }));
      const { transaction } = options;
      await boss.insert(jobs, transaction ? { db: transactionDb(transaction.sequelize, transaction.transaction) } : {});
      if (transaction) transaction.transaction.afterCommit(() => wake(queue));
      else wake(queue);
    },
    async addWorker(queue, handler) {
      // pg-boss waits the polling interval after every fetch, even one that found a job: without
      // the wake below a worker handles at most one job per interval (a burst of 30 e-mails took 15 s).
      let id = '';
      id = await boss.work(queue, { pollingIntervalSeconds: 0.5, batchSize: 1 }, async (jobs) => {
        for (const job of jobs) await handler(job.data as never);
        if (jobs.length && id) boss.notifyWorker(id);
      });
      workers.set(queue, [...(workers.get(queue) ?? []), id]);
    },
    async schedule(queue, cron, data = {}) {
      await boss.schedule(queue, cron, data);
    },
    wake,
    async stop() {
      await boss.stop({ graceful: true, timeout: 5_000, wait: true });
    },
  };
}

/**
 * Several server processes starting together create the same queues at once; pg-boss's
 * DDL can then deadlock (40P01) or collide (23505): the queue exists after a retry.
 */
async function createQueue(boss: PgBoss, name: QueueName): Promise<void> {
  for (let attempt = 1; ; attempt += 1) {
    try {
      await boss.createQueue(name, { name, policy: queuePolicies[name] ?? 'standard' });
      return;
    } catch (err) {
      const code = (err as { code?: string }).code;
      if (attempt >= 5 || (code !== '40P01' && code !== '23505')) throw err;
      await new Promise((r) => setTimeout(r, 50 * attempt));
    }
  }
}
