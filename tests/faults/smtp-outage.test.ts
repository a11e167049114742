// The outgoing mail server is down while alerts are raised. Alert e-mails are jobs committed
// with the alerts; each failed send is retried with backoff and shows in the admin's queue
// view with its error. Once the mail server is back every alert e-mail arrives, none twice.
// The outage is the SMTP stand-in refusing for 60 seconds, with a retry every 2 s
// (JOB_RETRY_DELAY_SECONDS, no backoff, up to 60 tries) so the test need not wait out the
// default backoff after the server is back.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { signIn, type Session } from '../support/realtime-client.js';
import { buildAlertWorld, type AlertWorld } from '../support/alert-world.js';
import { buildUser } from '../support/builders/accounts.js';
import type { AdminQueueHealth } from '../../shared/schemas/dashboard.js';

const OUTAGE_MS = 60_000;

describe('alert e-mails through a mail server outage', () => {
  let t: TestApp;
  let world: AlertWorld;
  let grower: Session;
  let admin: Session;

  beforeAll(async () => {
    t = await startTestApp({ env: { JOB_RETRY_DELAY_SECONDS: '2', JOB_RETRY_BACKOFF: 'false', JOB_RETRY_LIMIT: '60' } });
    world = await buildAlertWorld('smtp-outage');
    await buildUser({ organization: null, role: 'admin', email: 'admin@smtp-outage.test' });
    grower = await signIn(t.baseUrl, world.growerEmail);
    admin = await signIn(t.baseUrl, 'admin@smtp-outage.test');
  });
  afterAll(async () => { await t?.stop(); });

  it('sends every alert e-mail once the mail server is back, none twice', async () => {
    await t.sink.stopSmtp();
    const downSince = Date.now();
    const products = ['Larchwood 2SC', 'Larchwood 3SC', 'Larchwood 4SC'];
    for (const [i, product] of products.entries()) {
      const saved = (await grower.agent.post('/api/sprays').set('X-CSRF-Token', grower.csrf).send(world.conflictingSpray(i, product)).expect(201)).body;
      expect(saved.spray.openAlerts).toBe(1);
    }
    // While it is down, the failing sends wait for another try, each with its error.
    const failing = await eventually(async () => {
      const health: AdminQueueHealth = (await admin.agent.get('/api/admin/queues').expect(200)).body;
      const email = health.failing.filter((j) => j.queue === 'email-send');
      return email.length >= 2 ? email : null;
    }, 15_000);
    expect(failing[0]).toMatchObject({ state: 'retry' });
    expect(failing[0].error).toMatch(/ECONNREFUSED|connect/i);
    expect(t.sink.messages.filter((m) => m.subject.includes('Larchwood'))).toEqual([]);

    // Still down at the end of the minute: nothing has gone out.
    await new Promise((r) => setTimeout(r, Math.max(0, OUTAGE_MS - (Date.now() - downSince))));
    expect(t.sink.messages.filter((m) => m.subject.includes('Larchwood'))).toEqual([]);
    await t.sink.startSmtp();
    const expected = products.flatMap((p) => [world.growerEmail, world.keeperEmail].map((to) => `${to} ${p}`)).sort();
    const received = () => t.sink.messages.filter((m) => m.subject.includes('Larchwood')).map((m) => `${m.to.join(',')} ${m.subject.match(/Larchwood \dSC/)![0]}`).sort();
    await eventually(() => received().length >= expected.length, 40_000, 250);
    await new Promise((r) => setTimeout(r, 3_000));
    expect(received()).toEqual(expected);
    const after: AdminQueueHealth = (await admin.agent.get('/api/admin/queues').expect(200)).body;
    expect(after.failing.filter((j) => j.queue === 'email-send')).toEqual([]);
  }, 150_000);
});
