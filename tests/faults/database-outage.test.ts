// The database goes away for 10 seconds in the middle of a spray save (a TCP proxy between
// a server process and PostgreSQL drops every connection the moment the save writes the
// spray, and refuses new ones). The client gets a clear 503 with Retry-After, nothing of
// the save stays (PostgreSQL rolls back the transaction whose connection went), the health
// route reports the outage and then the recovery, and the same save then succeeds.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import request from 'supertest';
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
});
