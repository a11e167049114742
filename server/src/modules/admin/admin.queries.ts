// The job queue's health, read from pg-boss's own tables (they belong to the library, so
// they have no models).
import type { Sequelize } from 'sequelize';
import { queryOne, queryRows } from '../../db/query-rows.js';

export interface QueueStateRow { name: string; state: string | null; jobs: number; oldest_waiting: Date | null }

/** Whether pg-boss has created its tables in this database yet. */
export async function queueTablesExist(sequelize: Sequelize): Promise<boolean> {
  const row = await queryOne<{ ok: boolean }>(sequelize, `SELECT to_regclass('pgboss.job') IS NOT NULL AS ok`);
  return Boolean(row?.ok);
}

/** Jobs per queue and state, with the oldest job still waiting. */
export function queueStates(sequelize: Sequelize): Promise<QueueStateRow[]> {
  return queryRows<QueueStateRow>(
    sequelize,
    `SELECT q.name, j.state::text AS state, count(j.id)::int AS jobs,
       min(j.created_on) FILTER (WHERE j.state IN ('created', 'retry')) AS oldest_waiting
     FROM pgboss.queue q LEFT JOIN pgboss.job j ON j.name = q.name
     GROUP BY q.name, j.state ORDER BY q.name`,
  );
}

export interface FailingJobRow { name: string; id: string; state: string; retry_count: number; retry_limit: number; output: { message?: string } | null; at: Date }

/** The latest jobs that failed or wait for another try, with the error of their last try. */
export function failingJobs(sequelize: Sequelize, limit = 50): Promise<FailingJobRow[]> {
  return queryRows<FailingJobRow>(
    sequelize,
    `SELECT name, id::text AS id, state::text AS state, retry_count, retry_limit, output, coalesce(completed_on, started_on, created_on) AS at
     FROM pgboss.job WHERE state IN ('retry', 'failed') ORDER BY coalesce(completed_on, started_on, created_on) DESC LIMIT $limit`,
    { bind: { limit } },
  );
}
