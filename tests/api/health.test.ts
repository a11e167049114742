// GET /api/health reports the database as it really is: up, stopped, back.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import request from 'supertest';
import { startThrowawayCluster } from '../support/throwaway-cluster.js';
import { loadConfig } from '../../server/src/config/env.js';
import { createApp, type CreatedApp } from '../../server/src/app.js';
import { createSequelize } from '../../server/src/db/sequelize.js';
import { createMigrator } from '../../server/src/db/migrator.js';
import { eventually } from '../support/test-app.js';

describe('GET /api/health', () => {
  let cluster: Awaited<ReturnType<typeof startThrowawayCluster>>;
  let created: CreatedApp;

  beforeAll(async () => {
    cluster = await startThrowawayCluster();
    const migrationDb = createSequelize(cluster.url, 2);
    try {
      await createMigrator(migrationDb).up();
    } finally {
      await migrationDb.close();
    }
    created = await createApp(loadConfig({ NODE_ENV: 'test', DATABASE_URL: cluster.url, LOG_LEVEL: 'silent', JOBS_ENABLED: 'false' }));
  });

  afterAll(async () => {
    await created?.close().catch(() => {});
    cluster?.destroy();
  });

  it('answers 200 with the database up, 503 once it is stopped, and 200 again after a restart', async () => {
    const up = await request(created.app).get('/api/health');
    expect(up.status).toBe(200);
    expect(up.body).toEqual({ status: 'ok', database: 'ok' });

    cluster.stop();
    const down = await request(created.app).get('/api/health');
    expect(down.status).toBe(503);
    expect(down.body.database).not.toBe('ok');

    cluster.start();
    await eventually(async () => (await request(created.app).get('/api/health')).status === 200, 15_000, 250);
  });
});
