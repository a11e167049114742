// A client that was offline while three alerts were raised gets exactly those three when
// it reconnects (GET /api/alerts?since=<the last revision it held>), and, counting what its
// new socket receives live as well, nothing twice once repeated deliveries are dropped by
// alert id and revision (as client/src/stores/alerts.ts does).
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { distinctRevisions, openSocket, recordAlerts, signIn, type AppSocket, type Session } from '../support/realtime-client.js';
import { buildAlertWorld, type AlertWorld } from '../support/alert-world.js';
import type { AlertDto } from '../../shared/schemas/alerts.js';

describe('catching up on alerts after a disconnect', () => {
  let t: TestApp;
  let world: AlertWorld;
  let grower: Session;
  let keeper: Session;
  const sockets: AppSocket[] = [];

  beforeAll(async () => {
    t = await startTestApp();
    world = await buildAlertWorld('catch-up');
    grower = await signIn(t.baseUrl, world.growerEmail);
    keeper = await signIn(t.baseUrl, world.keeperEmail);
  });
  afterAll(async () => {
    for (const s of sockets) s.disconnect();
    await t?.stop();
  });

  it('receives the three alerts it missed and nothing twice', async () => {
    // Another of the keeper's tabs stays connected throughout: it gets each alert live, once.
    const watcher = await openSocket(t.baseUrl, keeper);
    sockets.push(watcher);
    const watched = recordAlerts(watcher);
    const first = await openSocket(t.baseUrl, keeper);
    const held = (await keeper.agent.get('/api/alerts').expect(200)).body.latestRevision as number;
    first.disconnect();

    const sprayIds: string[] = [];
    for (const [i, product] of ['Fernleap 1EC', 'Fernleap 2EC', 'Fernleap 3EC'].entries()) {
      sprayIds.push((await grower.agent.post('/api/sprays').set('X-CSRF-Token', grower.csrf).send(world.conflictingSpray(i, product)).expect(201)).body.spray.id);
    }

    const again = await openSocket(t.baseUrl, keeper);
    sockets.push(again);
    const live = recordAlerts(again);
    const caughtUp: AlertDto[] = (await keeper.agent.get(`/api/alerts?since=${held}`).expect(200)).body.alerts;
    expect(caughtUp.map((a) => a.spray.id).sort()).toEqual([...sprayIds].sort());
    expect(new Set(caughtUp.map((a) => a.id)).size).toBe(3);

    // Publication may still be on its way: whatever arrives live is a revision already held.
    await new Promise((r) => setTimeout(r, 1_500));
    const shown = distinctRevisions([...caughtUp.map((alert) => ({ event: 'alert:raised' as const, alert })), ...live]);
    expect(shown.map((e) => e.alert.spray.id).sort()).toEqual([...sprayIds].sort());
    await eventually(() => watched.length >= 3);
    await new Promise((r) => setTimeout(r, 1_000));
    expect(watched.map((e) => e.alert.spray.id).sort()).toEqual([...sprayIds].sort());
    expect(live.every((e) => caughtUp.some((a) => a.id === e.alert.id && a.revision === e.alert.revision))).toBe(true);
  });

  it('also sends what changed shortly before the revision held, which a slower save may have committed after it', async () => {
    // Revisions come from one sequence as saves take them: a save holding a lower revision can
    // commit after one with a higher revision, while this client is away. So a catch-up from
    // revision R also sends the alerts changed in the ten minutes before R's change.
    const plan = async (i: number, product: string) => (await grower.agent.post('/api/sprays').set('X-CSRF-Token', grower.csrf).send(world.conflictingSpray(i, product)).expect(201)).body.spray.id as string;
    const old = await plan(4, 'Fernleap 4EC');
    const late = await plan(5, 'Fernleap 5EC');
    const newest = await plan(6, 'Fernleap 6EC');
    const alertOf = async (sprayId: string) => (await t.context.models.Alert.findOne({ where: { sprayPlanId: sprayId, apiaryId: world.apiaryId } }))!;
    // The oldest one changed an hour before: out of reach.
    await t.context.sequelize.query("UPDATE alerts SET updated_at = now() - interval '1 hour' WHERE id = $id", { bind: { id: (await alertOf(old)).id } });
    const held = Number((await alertOf(newest)).revision);
    const caughtUp: AlertDto[] = (await keeper.agent.get(`/api/alerts?since=${held}`).expect(200)).body.alerts;
    const sprays = caughtUp.map((a) => a.spray.id);
    expect(sprays).toContain(late);
    expect(sprays).not.toContain(old);
    expect(Number((await alertOf(late)).revision)).toBeLessThan(held);
  });
});
