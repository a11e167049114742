// A spray conflict re-check that keeps failing is retried, then given up, and the admin's
// queue view shows it with the error of its last try. The failing job is one whose
// agreement id the database refuses, so every try fails the same way; one retry a second
// apart keeps the test short (JOB_RETRY_LIMIT, JOB_RETRY_DELAY_SECONDS).
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildUser } from '../support/builders/accounts.js';
import { queueNames } from '../../server/src/jobs/queue-names.js';
import type { RecheckJob } from '../../server/src/modules/alerts/conflict-rechecks.js';
import type { AdminQueueHealth } from '../../shared/schemas/dashboard.js';

describe('a re-check job that keeps failing', () => {
  let t: TestApp;
  let admin: ApiClient;

  beforeAll(async () => {
    t = await startTestApp({ env: { JOB_RETRY_LIMIT: '1', JOB_RETRY_DELAY_SECONDS: '1', JOB_RETRY_BACKOFF: 'false' } });
    await buildUser({ organization: null, role: 'admin', email: 'admin@recheck-failures.test' });
    admin = await signedInClient(t.app, 'admin@recheck-failures.test');
  });
  afterAll(async () => { await t?.stop(); });

  it('is retried, then shown as failed in the admin queue view with its error', async () => {
    const id = await t.context.jobs.send<RecheckJob>(queueNames.conflictRecheck, { scope: 'agreement', id: 'not-an-agreement-id' }, { singletonKey: 'agreement:not-an-agreement-id' });
    expect(id).toEqual(expect.any(String));
    const failed = await eventually(async () => {
      const health: AdminQueueHealth = (await admin.get('/api/admin/queues').expect(200)).body;
      return health.failing.find((j) => j.id === id && j.state === 'failed');
    }, 20_000);
    expect(failed).toMatchObject({ queue: 'conflict-recheck', tries: 1, retryLimit: 1 });
    expect(failed.error).toMatch(/uuid/i);
  }, 30_000);
});
