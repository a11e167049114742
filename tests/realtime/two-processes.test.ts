// Two server processes on one database: this test's own app, which runs no job workers, and
// a child process running server/src/index.ts. A spray saved through the child reaches
// sockets held by this process only through the alert outbox (the child's worker) and the
// socket.io Postgres adapter, and each socket gets it once.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { startServerProcess, type ServerProcess } from '../support/server-process.js';
import { openSocket, recordAlerts, signIn, withSession, type AppSocket, type Session } from '../support/realtime-client.js';
import { buildAlertWorld, type AlertWorld } from '../support/alert-world.js';

describe('alerts across two server processes', () => {
  let t: TestApp;
  let other: ServerProcess;
  let world: AlertWorld;
  let grower: Session;
  let keeper: Session;
  const sockets: AppSocket[] = [];

  beforeAll(async () => {
    t = await startTestApp({ env: { JOBS_ENABLED: 'false' } });
    world = await buildAlertWorld('two-processes');
    other = await startServerProcess({ DATABASE_URL: t.databaseUrl, SMTP_PORT: String(t.sink.smtpPort), MAIL_SINK_URL: `http://127.0.0.1:${t.sink.httpPort}` });
    grower = await signIn(t.baseUrl, world.growerEmail);
    keeper = await signIn(t.baseUrl, world.keeperEmail);
  }, 180_000);
  afterAll(async () => {
    for (const s of sockets) s.disconnect();
    await other?.stop();
    await t?.stop();
  });

  it('sends a spray saved through the other process to sockets held by this one, once each', async () => {
    const [g, k, kThere] = await Promise.all([openSocket(t.baseUrl, grower), openSocket(t.baseUrl, keeper), openSocket(other.baseUrl, keeper)]);
    sockets.push(g, k, kThere);
    const [gEvents, kEvents, kThereEvents] = [recordAlerts(g), recordAlerts(k), recordAlerts(kThere)];
    const saved = (await withSession(other.baseUrl, grower).post('/api/sprays').send(world.conflictingSpray(0, 'Crossfield 50WP')).expect(201)).body;
    expect(saved.spray.openAlerts).toBe(1);
    const raised = await eventually(() => kEvents.find((e) => e.event === 'alert:raised'));
    expect(raised.alert).toMatchObject({ spray: { id: saved.spray.id }, apiary: { id: world.apiaryId } });
    await eventually(() => gEvents.find((e) => e.event === 'alert:raised' && e.alert.id === raised.alert.id));
    await eventually(() => kThereEvents.find((e) => e.event === 'alert:raised' && e.alert.id === raised.alert.id));
    await new Promise((r) => setTimeout(r, 1_500));
    for (const events of [kEvents, gEvents, kThereEvents]) expect(events.filter((e) => e.alert.id === raised.alert.id)).toHaveLength(1);
  });
});
