// The platform admin's views: organizations with member counts, users, the e-mails the
// SMTP sink received and the job queue's health; nobody else may open them.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { enqueueEmail } from '../../server/src/jobs/send-email.job.js';
import type { AdminEmail, AdminOrganization, AdminQueueHealth, AdminUser } from '../../shared/schemas/dashboard.js';

describe('admin API', () => {
  let t: TestApp;
  let admin: ApiClient;
  let grower: ApiClient;
  let keeper: ApiClient;

  beforeAll(async () => {
    t = await startTestApp();
    const farm = await buildOrganization({ kind: 'farm', name: 'Admin Test Orchard' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Admin Test Apiary' });
    await buildUser({ organization: farm, role: 'owner', email: 'admin-grower@example.test', name: 'Tamsin Orchard' });
    await buildUser({ organization: farm, role: 'applicator', email: 'admin-applicator@example.test' });
    await buildUser({ organization: apiary, role: 'owner', email: 'admin-keeper@example.test' });
    const disabled = await buildUser({ organization: apiary, role: 'crew', email: 'admin-gone@example.test' });
    await disabled.update({ disabledAt: new Date() });
    await buildUser({ organization: null, role: 'admin', email: 'admin-admin@example.test' });
    admin = await signedInClient(t.app, 'admin-admin@example.test');
    grower = await signedInClient(t.app, 'admin-grower@example.test');
    keeper = await signedInClient(t.app, 'admin-keeper@example.test');
  });
  afterAll(async () => {
    await t?.stop();
  });

  it('GET /api/admin/organizations lists every organization with its member count', async () => {
    const res = await admin.get('/api/admin/organizations').expect(200);
    const orgs = res.body.organizations as AdminOrganization[];
    expect(orgs.find((o) => o.name === 'Admin Test Orchard')).toMatchObject({ kind: 'farm', members: 2 });
    expect(orgs.find((o) => o.name === 'Admin Test Apiary')).toMatchObject({ kind: 'apiary', members: 2 });
  });

  it('GET /api/admin/users lists users with their organization and whether they are disabled', async () => {
    const res = await admin.get('/api/admin/users').expect(200);
    const users = res.body.users as AdminUser[];
    expect(users.find((u) => u.email === 'admin-grower@example.test')).toMatchObject({ name: 'Tamsin Orchard', role: 'owner', organizationName: 'Admin Test Orchard', disabled: false });
    expect(users.find((u) => u.email === 'admin-gone@example.test')!.disabled).toBe(true);
    expect(users.find((u) => u.email === 'admin-admin@example.test')!.organizationName).toBeNull();
    expect(users[0]).not.toHaveProperty('passwordHash');
  });

  it('GET /api/admin/emails shows the messages the SMTP sink received, newest first, and the queue that sent them', async () => {
    await enqueueEmail(t.context.jobs, { to: 'someone@example.test', subject: 'First notice', text: 'one' });
    await enqueueEmail(t.context.jobs, { to: 'other@example.test', subject: 'Second notice', text: 'two' });
    const emails = await eventually(async () => {
      const res = await admin.get('/api/admin/emails').expect(200);
      const list = res.body.emails as AdminEmail[];
      return list.length >= 2 ? list : null;
    });
    expect(emails.map((e) => e.subject).slice(0, 2).sort()).toEqual(['First notice', 'Second notice']);
    expect(emails[0].id).toBeGreaterThan(emails[1].id);
    expect(emails.find((e) => e.subject === 'First notice')!.to).toEqual(['someone@example.test']);

    const queues = await eventually(async () => {
      const res = await admin.get('/api/admin/queues').expect(200);
      const body = res.body as AdminQueueHealth;
      const mail = body.queues.find((q) => q.name === 'email-send');
      return mail && (mail.states.completed ?? 0) >= 2 ? body : null;
    });
    expect(queues.running).toBe(true);
  });

  it('answers 503 when the e-mail sink cannot be reached', async () => {
    const sinkUrl = t.context.config.mail.sinkUrl;
    t.context.config.mail.sinkUrl = 'http://127.0.0.1:1';
    try {
      const res = await admin.get('/api/admin/emails').expect(503);
      expect(res.body.error.code).toBe('unavailable');
    } finally {
      t.context.config.mail.sinkUrl = sinkUrl;
    }
  });

  it('refuses growers and beekeepers with 403 on every admin route', async () => {
    for (const path of ['/api/admin/organizations', '/api/admin/users', '/api/admin/emails', '/api/admin/queues']) {
      await grower.get(path).expect(403);
      await keeper.get(path).expect(403);
    }
  });
});
