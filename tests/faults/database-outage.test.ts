// The database goes away for 10 seconds in the middle of a spray save (a TCP proxy between
// a server process and PostgreSQL drops every connection the moment the save writes the
// spray, and refuses new ones). The client gets a clear 503 with Retry-After, nothing of
// the save stays (PostgreSQL rolls back the transaction whose connection went), the health
// route reports the outage and then the recovery, and the same save then succeeds.
// When the connection goes just after the save's COMMIT reached the database (its answer
// lost), the plan is saved and the server cannot know: the 503 says it may be saved, and
// the same plan sent again under its Idempotency-Key (as the spray form does) is kept once.
// A connection lost as the job queue marks a finished job done does not end the process.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import request from 'supertest';
import { randomUUID } from 'node:crypto';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { startServerProcess, type ServerProcess } from '../support/server-process.js';
import { startTcpProxy, type TcpProxy } from '../support/tcp-proxy.js';
import { signIn, withSession, type Session } from '../support/realtime-client.js';
import { buildAlertWorld, type AlertWorld } from '../support/alert-world.js';

const OUTAGE_MS = 10_000;

describe('a database outage during a spray save', () => {
  let t: TestApp;
  let proxy: TcpProxy;
  let server: ServerProcess;
  let world: AlertWorld;
  let grower: Session;

  beforeAll(async () => {
    t = await startTestApp({ env: { JOBS_ENABLED: 'false' } });
    world = await buildAlertWorld('database-outage');
    const direct = new URL(t.databaseUrl);
    proxy = await startTcpProxy({ host: direct.hostname, port: Number(direct.port) });
    const viaProxy = new URL(t.databaseUrl);
    viaProxy.port = String(proxy.port);
    server = await startServerProcess({ DATABASE_URL: viaProxy.toString(), SMTP_PORT: String(t.sink.smtpPort), MAIL_SINK_URL: `http://127.0.0.1:${t.sink.httpPort}` });
    grower = await signIn(server.baseUrl, world.growerEmail);
  }, 180_000);
  afterAll(async () => {
    await server?.stop();
    await proxy?.close();
    await t?.stop();
  });

  // Without a session cookie, so the answer is the health route's own, not the session store's.
  const health = () => request(server.baseUrl).get('/api/health');
  const countOf = async (product: string) => ({
    sprays: await t.context.models.SprayPlan.count({ where: { productName: product } }),
    alerts: await t.context.models.Alert.count({ include: [{ association: 'spray', where: { productName: product } }] }),
  });

  it('answers 503 with a retry hint, keeps nothing half-written, and recovers', async () => {
    expect((await health().expect(200)).body).toMatchObject({ status: 'ok', database: 'ok' });
    const product = 'Brackenfold 25WG';
    const cut = proxy.cutOn(/INSERT INTO "spray_plans"/, OUTAGE_MS);
    const started = Date.now();
    const res = await withSession(server.baseUrl, grower).post('/api/sprays').send(world.conflictingSpray(0, product));
    await cut;
    expect(res.status).toBe(503);
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    expect(res.body.error).toMatchObject({ code: 'unavailable' });
    expect(res.body.error.message).toMatch(/nothing was saved/);

    // During the outage the health route says so.
    const during = await health();
    expect(Date.now() - started).toBeLessThan(OUTAGE_MS);
    expect(during.status).toBe(503);
    expect(during.body).toMatchObject({ database: 'unreachable' });
    expect(await countOf(product)).toEqual({ sprays: 0, alerts: 0 });

    // Then it recovers, and the same save goes through once.
    await eventually(async () => (await health()).status === 200, OUTAGE_MS + 15_000, 500);
    expect(proxy.down).toBe(false);
    const saved = await withSession(server.baseUrl, grower).post('/api/sprays').send(world.conflictingSpray(0, product));
    expect(saved.status).toBe(201);
    expect(await countOf(product)).toEqual({ sprays: 1, alerts: 1 });
  }, 120_000);

  it('says the plan may be saved when the database goes as it commits, and keeps it once when sent again under its key', async () => {
    await eventually(async () => (await health()).status === 200, OUTAGE_MS + 15_000, 500);
    const product = 'Hollowmere 4SC';
    const key = randomUUID();
    const send = () => withSession(server.baseUrl, grower).post('/api/sprays').set('Idempotency-Key', key).send(world.conflictingSpray(1, product));
    // The COMMIT of the save's own transaction: the one that wrote the key.
    const cut = proxy.cutOn(/COMMIT;/, 2_000, { passOn: true, afterOnSameConnection: /INSERT INTO "idempotency_keys"/ });
    const res = await send();
    await cut;
    expect(res.status).toBe(503);
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    expect(res.body.error.message).toMatch(/may be saved or not/);
    // The COMMIT ran: the plan and its alert are there.
    expect(await countOf(product)).toEqual({ sprays: 1, alerts: 1 });

    await eventually(async () => (await health()).status === 200, 15_000, 500);
    const again = await send();
    expect(again.status).toBe(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body.spray.productName).toBe(product);
    expect(await countOf(product)).toEqual({ sprays: 1, alerts: 1 });
  }, 120_000);

  it('keeps serving when the database goes just as a finished job is marked done', async () => {
    await eventually(async () => (await health()).status === 200, 15_000, 500);
    // The save's alert publication and e-mails are jobs; the first one marked done loses its connection.
    const logged = server.output().length;
    const cut = proxy.cutOn(/SET completed_on = now\(\)/, 1_000);
    const saved = await withSession(server.baseUrl, grower).post('/api/sprays').send(world.conflictingSpray(2, 'Marrowdeep 2SC'));
    expect([201, 503]).toContain(saved.status);
    await cut;
    await eventually(async () => (await health()).status === 200, 15_000, 500);
    expect(server.child.exitCode).toBeNull();
    expect(server.output().slice(logged)).toMatch(/database connection lost outside a request/);
  }, 60_000);
});
