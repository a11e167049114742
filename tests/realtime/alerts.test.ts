// Live conflict alerts: a spray planned next to placed colonies reaches the grower's and
// the beekeeper's sockets (not a third apiary's), moving it out of range resolves it, a
// reconnecting client fetches what it missed, and the e-mail survives an SMTP outage.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import request from 'supertest';
import { io as connect, type Socket } from 'socket.io-client';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { buildOrganization, buildUser, defaultTestPassword } from '../support/builders/accounts.js';
import { buildBlock, buildSignedSeason } from '../support/builders/season.js';
import { sprayInput } from '../support/builders/sprays.js';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/events.js';
import type { AlertDto } from '../../shared/schemas/alerts.js';

type AppSocket = Socket<ServerToClientEvents, ClientToServerEvents>;
const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const isoDay = (d: Date) => d.toISOString().slice(0, 10);

interface Session { agent: ReturnType<typeof request.agent>; csrf: string; cookie: string }

/** Signs in against the listening server and keeps the session cookie for the socket. */
async function signIn(t: TestApp, email: string): Promise<Session> {
  const agent = request.agent(t.baseUrl);
  const csrf = (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken;
  const res = await agent.post('/api/auth/login').set('X-CSRF-Token', csrf).send({ email, password: defaultTestPassword }).expect(200);
  const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]).join('; ');
  return { agent, csrf: res.body.csrfToken, cookie };
}

function openSocket(t: TestApp, session: Session): Promise<AppSocket> {
  const socket: AppSocket = connect(t.baseUrl, { transports: ['websocket'], extraHeaders: { Cookie: session.cookie }, reconnection: false, forceNew: true });
  return new Promise((resolve, reject) => {
    socket.once('session:ready', () => resolve(socket));
    socket.once('connect_error', reject);
  });
}

/** Records every alert event a socket receives. */
function record(socket: AppSocket) {
  const events: Array<{ event: 'alert:raised' | 'alert:updated'; alert: AlertDto }> = [];
  socket.on('alert:raised', (alert) => events.push({ event: 'alert:raised', alert }));
  socket.on('alert:updated', (alert) => events.push({ event: 'alert:updated', alert }));
  return events;
}

describe('live conflict alerts', () => {
  let t: TestApp;
  let grower: Session;
  let keeper: Session;
  let bystander: Session;
  let sockets: AppSocket[] = [];
  let blockId: string;
  let farBlockId: string;
  let apiaryId: string;
  const now = new Date();
  const nightStart = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + 4, 8));

  beforeAll(async () => {
    t = await startTestApp();
    const farm = await buildOrganization({ kind: 'farm', name: 'Hollowbrook Fruit' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Emberwing Apiaries' });
    const third = await buildOrganization({ kind: 'apiary', name: 'Farhill Bee Co.' });
    apiaryId = apiary.id;
    await buildUser({ organization: farm, role: 'owner', email: 'grower@alerts-rt.test' });
    await buildUser({ organization: apiary, role: 'owner', email: 'keeper@alerts-rt.test' });
    await buildUser({ organization: third, role: 'owner', email: 'third@alerts-rt.test' });
    const season = await buildSignedSeason({
      farm, apiary, colonies: 30, onSite: { from: new Date(now.getTime() - DAY), to: new Date(now.getTime() + 20 * DAY) },
      bloom: { bloomStart: isoDay(new Date(now.getTime() - 2 * DAY)), petalFall: isoDay(new Date(now.getTime() + 10 * DAY)) },
    });
    // The third apiary has colonies 40 km away, far outside the buffer.
    await buildSignedSeason({ farm: await buildOrganization({ kind: 'farm' }), apiary: third, lon: -119.4, lat: 44.9, onSite: { from: now, to: new Date(now.getTime() + 20 * DAY) } });
    blockId = season.block.id;
    farBlockId = (await buildBlock({ farm, lon: -119.6, lat: 44.9, name: 'Far Bench' })).id;
    grower = await signIn(t, 'grower@alerts-rt.test');
    keeper = await signIn(t, 'keeper@alerts-rt.test');
    bystander = await signIn(t, 'third@alerts-rt.test');
  });
  afterAll(async () => {
    for (const s of sockets) s.disconnect();
    await t?.stop();
  });

  const plan = (startsAt: Date, blockIds = [blockId]) =>
    grower.agent.post('/api/sprays').set('X-CSRF-Token', grower.csrf).send(sprayInput({ blockIds, startsAt })).expect(201);

  it('sends a raised alert to the grower and the beekeeper, not to a third apiary; moving the spray away resolves it', async () => {
    const [g, k, b] = await Promise.all([openSocket(t, grower), openSocket(t, keeper), openSocket(t, bystander)]);
    sockets.push(g, k, b);
    const [gEvents, kEvents, bEvents] = [record(g), record(k), record(b)];

    const created = (await plan(nightStart)).body;
    const growerAlert = await eventually(() => gEvents.find((e) => e.event === 'alert:raised'));
    const keeperAlert = await eventually(() => kEvents.find((e) => e.event === 'alert:raised'));
    expect(growerAlert.alert).toMatchObject({ grade: 'label-bar', state: 'raised', apiary: { id: apiaryId }, spray: { id: created.spray.id } });
    expect(keeperAlert.alert.id).toBe(growerAlert.alert.id);
    expect(keeperAlert.alert.cautions.join(' ')).toMatch(/licensed applicator/);
    // The live alert, built by the save from what its check holds, is the alert as each side reads it.
    const read = async (s: Session) => (await s.agent.get(`/api/alerts/${growerAlert.alert.id}`).expect(200)).body;
    const [asGrowerReads, asKeeperReads] = [await read(grower), await read(keeper)];
    expect(growerAlert.alert).toEqual(asGrowerReads.alert);
    expect(keeperAlert.alert).toEqual(asKeeperReads.alert);
    expect(growerAlert.alert.history).toEqual([expect.objectContaining({ action: 'raised', actorName: null, note: null })]);

    await grower.agent.patch(`/api/sprays/${created.spray.id}`).set('X-CSRF-Token', grower.csrf).send({ blockIds: [farBlockId] }).expect(200);
    const resolvedForKeeper = await eventually(() => kEvents.find((e) => e.event === 'alert:updated' && e.alert.state === 'resolved'));
    expect(resolvedForKeeper.alert.id).toBe(keeperAlert.alert.id);
    await eventually(() => gEvents.find((e) => e.event === 'alert:updated' && e.alert.state === 'resolved'));
    // Everything has reached the two rooms; the bystander's room got nothing.
    await new Promise((r) => setTimeout(r, 300));
    expect(bEvents).toEqual([]);
  });

  it('gives a reconnecting client every alert it missed', async () => {
    const before = (await keeper.agent.get('/api/alerts').expect(200)).body;
    const k = await openSocket(t, keeper);
    k.disconnect();
    const missed = (await plan(new Date(nightStart.getTime() + DAY))).body;
    const again = await openSocket(t, keeper);
    sockets.push(again);
    const since = (await keeper.agent.get(`/api/alerts?since=${before.latestRevision}`).expect(200)).body;
    // What is newer than the revision held is the one missed; anything else sent is one held already.
    expect(since.alerts.filter((a: AlertDto) => a.revision > before.latestRevision).map((a: AlertDto) => a.spray.id)).toEqual([missed.spray.id]);
    expect(since.latestRevision).toBeGreaterThan(before.latestRevision);
    const bad = await keeper.agent.get('/api/alerts?since=-3').expect(400);
    expect(bad.body.error.fields).toHaveProperty('since');
  });

  it('tells the grower live when the beekeeper answers', async () => {
    const g = await openSocket(t, grower);
    sockets.push(g);
    const gEvents = record(g);
    const [open] = (await keeper.agent.get('/api/alerts?state=open').expect(200)).body.alerts;
    await keeper.agent.post(`/api/alerts/${open.id}/answer`).set('X-CSRF-Token', keeper.csrf).send({ response: 'will-move-colonies' }).expect(200);
    const answered = await eventually(() => gEvents.find((e) => e.alert.id === open.id && e.alert.state === 'answered'));
    expect(answered.alert.history.at(-1)).toMatchObject({ action: 'answered', response: 'will-move-colonies', organizationName: 'Emberwing Apiaries' });
  });

  it('delivers the alert e-mail once the SMTP server is back', async () => {
    await t.sink.stopSmtp();
    const sent = t.sink.messages.length;
    const created = (await plan(new Date(nightStart.getTime() + 2 * DAY))).body;
    expect(created.spray.openAlerts).toBe(1);
    await new Promise((r) => setTimeout(r, 1500));
    expect(t.sink.messages.length).toBe(sent);
    await t.sink.startSmtp();
    // The queue retries every 3 s.
    const mail = await eventually(() => t.sink.messages.slice(sent).find((m) => m.to.includes('keeper@alerts-rt.test')), 20_000);
    expect(mail.subject).toMatch(/Spray alert/);
    expect(mail.text).toMatch(/label is the law/);
    await eventually(() => t.sink.messages.slice(sent).find((m) => m.to.includes('grower@alerts-rt.test')), 20_000);
  });
});
