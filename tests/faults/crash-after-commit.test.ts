// The server process is killed (SIGKILL) right after a conflicting spray's alerts are
// committed and before any is published (the test-only FAULT_EXIT_AFTER_ALERT_COMMIT
// switch). Nothing is lost: the publication and e-mail jobs were committed with the alert,
// so once the process is started again both sides' sockets receive the alert and the
// e-mails arrive, exactly once each. The sockets are held by this test's own app, which
// runs no job workers, so only the restarted process can deliver.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { startServerProcess, freePort, type ServerProcess } from '../support/server-process.js';
import { openSocket, recordAlerts, signIn, withSession, type AppSocket, type Session } from '../support/realtime-client.js';
import { buildAlertWorld, type AlertWorld } from '../support/alert-world.js';

describe('a server killed between the alert commit and its publication', () => {
  let t: TestApp;
  let server: ServerProcess | undefined;
  let world: AlertWorld;
  let grower: Session;
  let keeper: Session;
  const sockets: AppSocket[] = [];
  let env: Record<string, string>;

  beforeAll(async () => {
    t = await startTestApp({ env: { JOBS_ENABLED: 'false' } });
    world = await buildAlertWorld('crash-after-commit');
    env = { DATABASE_URL: t.databaseUrl, SMTP_PORT: String(t.sink.smtpPort), MAIL_SINK_URL: `http://127.0.0.1:${t.sink.httpPort}` };
    grower = await signIn(t.baseUrl, world.growerEmail);
    keeper = await signIn(t.baseUrl, world.keeperEmail);
  }, 180_000);
  afterAll(async () => {
    for (const s of sockets) s.disconnect();
    await server?.stop();
    await t?.stop();
  });

  it('delivers the committed alert to both sides and e-mails it once each after a restart', async () => {
    const port = await freePort();
    server = await startServerProcess({ ...env, FAULT_EXIT_AFTER_ALERT_COMMIT: 'true' }, port);
    const [g, k] = await Promise.all([openSocket(t.baseUrl, grower), openSocket(t.baseUrl, keeper)]);
    sockets.push(g, k);
    const [gEvents, kEvents] = [recordAlerts(g), recordAlerts(k)];

    const product = 'Hollowstem 4F';
    const answer = await withSession(server.baseUrl, grower).post('/api/sprays').send(world.conflictingSpray(0, product)).then(() => 'answered', (err: Error) => err.message);
    expect(answer).not.toBe('answered'); // the process died before it could answer
    expect(await server.exited).toMatchObject({ signal: 'SIGKILL' });

    // The spray and its alert are committed; nothing has been published or sent.
    const alerts = await t.context.models.Alert.findAll({ include: [{ association: 'spray', where: { productName: product } }] });
    expect(alerts.map((a) => a.apiaryId)).toEqual([world.apiaryId]);
    await new Promise((r) => setTimeout(r, 1_000));
    expect([...gEvents, ...kEvents]).toEqual([]);
    const mailsFor = (to: string) => t.sink.messages.filter((m) => m.to.includes(to) && m.subject.includes(product));
    expect(mailsFor(world.growerEmail)).toEqual([]);

    server = await startServerProcess(env, port);
    const forKeeper = await eventually(() => kEvents.find((e) => e.event === 'alert:raised'), 45_000);
    expect(forKeeper.alert).toMatchObject({ id: alerts[0].id, apiary: { id: world.apiaryId }, spray: { productName: product } });
    await eventually(() => gEvents.find((e) => e.event === 'alert:raised' && e.alert.id === alerts[0].id), 45_000);
    await eventually(() => mailsFor(world.growerEmail).length && mailsFor(world.keeperEmail).length, 45_000);

    // Give any second delivery time to show up, then count.
    await new Promise((r) => setTimeout(r, 3_000));
    expect(kEvents.filter((e) => e.alert.id === alerts[0].id)).toHaveLength(1);
    expect(gEvents.filter((e) => e.alert.id === alerts[0].id)).toHaveLength(1);
    expect(mailsFor(world.growerEmail)).toHaveLength(1);
    expect(mailsFor(world.keeperEmail)).toHaveLength(1);
    expect(mailsFor(world.keeperEmail)[0].text).toMatch(/label is the law/);
  }, 240_000);
});
