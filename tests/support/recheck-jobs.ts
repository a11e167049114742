// Whether the spray conflict re-check asked for by a change has run: a conflict-recheck job
// with that key (`agreement:<id>`, `block:<id>`, `spray:<id>`) completed after `since`.
// Read from pg-boss's own table (the queue's jobs are the observable effect of a change).
import { QueryTypes } from 'sequelize';
import type { TestApp } from './test-app.js';

export async function recheckRanSince(t: TestApp, key: string, since: Date): Promise<boolean> {
  const [row] = await t.context.sequelize.query<{ n: number }>(
    `SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'conflict-recheck' AND singleton_key = $key AND state = 'completed' AND completed_on >= $since`,
    { bind: { key, since }, type: QueryTypes.SELECT },
  );
  return row.n > 0;
}
