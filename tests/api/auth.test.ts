// Accounts: sign-up, sign-in, sign-out, sessions in PostgreSQL, CSRF, sign-in limits.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import request from 'supertest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { apiClient, signedInClient } from '../support/api-client.js';
import { buildOrganization, buildUser, defaultTestPassword } from '../support/builders/accounts.js';

const sessionCookieOf = (res: request.Response) => ([res.headers['set-cookie']].flat().filter(Boolean) as string[]).find((c) => c.startsWith('pp.sid='));

describe('POST /api/auth/signup', () => {
  let t: TestApp;
  beforeAll(async () => { t = await startTestApp(); });
  afterAll(async () => { await t?.stop(); });

  it('creates the organization and its owner, and signs them in', async () => {
    const client = await apiClient(t.app);
    const res = await client.post('/api/auth/signup', {
      name: 'Wren Applewood', email: 'Wren@Example.test', password: 'orchard-ladder-morning',
      organization: { name: 'Quillbrook Orchard', kind: 'farm', timeZone: 'America/Los_Angeles' },
    });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email: 'wren@example.test', name: 'Wren Applewood', role: 'owner', organization: { name: 'Quillbrook Orchard', kind: 'farm' } });
    expect(JSON.stringify(res.body)).not.toMatch(/passwordHash|scrypt/);
    const me = await client.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.id).toBe(res.body.user.id);
  });

  it('refuses a short password and a common one, naming the field', async () => {
    const client = await apiClient(t.app);
    const base = { name: 'A', email: 'short@example.test', organization: { name: 'Hive Co', kind: 'apiary' } };
    const short = await client.post('/api/auth/signup', { ...base, password: 'nine-char' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toMatch(/at least 10/);
    const common = await client.post('/api/auth/signup', { ...base, password: 'Password123' });
    expect(common.status).toBe(400);
    expect(common.body.error.fields.password).toMatch(/too common/);
  });

  it('answers 409 for an e-mail that is already registered', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'taken@example.test' });
    const client = await apiClient(t.app);
    const res = await client.post('/api/auth/signup', { name: 'B', email: 'taken@example.test', password: 'a-long-fresh-passphrase', organization: { name: 'X', kind: 'farm' } });
    expect(res.status).toBe(409);
    expect(res.body.error.fields).toEqual({ email: 'is already registered' });
  });
});

describe('POST /api/auth/login and the session', () => {
  let t: TestApp;
  let clock = Date.now();
  beforeAll(async () => {
    t = await startTestApp({ now: () => new Date(clock) });
  });
  afterAll(async () => { await t?.stop(); });

  it('answers 200 with the user and their organization', async () => {
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Fernhollow Bees' });
    const user = await buildUser({ organization: apiary, role: 'crew', email: 'crew-login@example.test', name: 'Kit Ashby' });
    const client = await apiClient(t.app);
    const res = await client.post('/api/auth/login', { email: 'crew-login@example.test', password: defaultTestPassword });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: user.id, email: 'crew-login@example.test', name: 'Kit Ashby', role: 'crew', organization: { id: apiary.id, name: 'Fernhollow Bees', kind: 'apiary' } });
    expect(res.body.user).not.toHaveProperty('passwordHash');
  });

  it('gives the same 401 message for an unknown e-mail and a wrong password', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'same-message@example.test' });
    const client = await apiClient(t.app);
    const wrong = await client.post('/api/auth/login', { email: 'same-message@example.test', password: 'wrong-password-here' });
    const unknown = await client.post('/api/auth/login', { email: 'nobody-here@example.test', password: 'wrong-password-here' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  it('issues a new session id on sign-in, with an httpOnly SameSite=Lax cookie, Secure over HTTPS', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'cookie@example.test' });
    const agent = request.agent(t.app);
    const first = await agent.get('/api/auth/csrf');
    const before = sessionCookieOf(first)!;
    const login = await agent.post('/api/auth/login').set('X-CSRF-Token', first.body.csrfToken).send({ email: 'cookie@example.test', password: defaultTestPassword });
    expect(login.status).toBe(200);
    const after = sessionCookieOf(login)!;
    expect(after.split(';')[0]).not.toBe(before.split(';')[0]);
    expect(after).toMatch(/HttpOnly/i);
    expect(after).toMatch(/SameSite=Lax/i);
    expect(after).not.toMatch(/Secure/i);
    // Behind a TLS-terminating proxy on the same machine the cookie is marked Secure.
    const overHttps = await request(t.app).get('/api/auth/csrf').set('X-Forwarded-Proto', 'https');
    expect(sessionCookieOf(overHttps)).toMatch(/;\s*Secure/i);
  });

  it('answers /me with 401 when signed out and after sign-out', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'viewer', email: 'leaving@example.test' });
    const anonymous = await apiClient(t.app);
    expect((await anonymous.get('/api/auth/me')).status).toBe(401);
    const client = await signedInClient(t.app, 'leaving@example.test');
    expect((await client.get('/api/auth/me')).status).toBe(200);
    const out = await client.post('/api/auth/logout');
    expect(out.status).toBe(200);
    expect((await client.get('/api/auth/me')).status).toBe(401);
  });

  it('refuses a state-changing request without the CSRF token with 403 in the error shape', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'csrf@example.test' });
    const client = await signedInClient(t.app, 'csrf@example.test');
    const res = await client.agent.patch('/api/auth/me/preferences').send({ units: 'metric' });
    expect(res.status).toBe(403);
    expect(res.body).toEqual({ error: { code: 'csrf_invalid', message: expect.any(String) } });
    const withToken = await client.patch('/api/auth/me/preferences', { units: 'metric' });
    expect(withToken.status).toBe(200);
    expect(withToken.body.user.units).toBe('metric');
  });

  it('keeps one CSRF token per session, so two senders asking at once do not refuse each other; a sign-in gets a new one', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'two-senders@example.test' });
    const agent = request.agent(t.app);
    const beforeSignIn = (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken as string;
    await agent.post('/api/auth/login').set('X-CSRF-Token', beforeSignIn).send({ email: 'two-senders@example.test', password: defaultTestPassword }).expect(200);
    // The token of before sign-in is bound to the ended session id.
    expect((await agent.patch('/api/auth/me/preferences').set('X-CSRF-Token', beforeSignIn).send({ units: 'metric' })).status).toBe(403);
    // The phone's page and its service worker each ask for a token, then each sends with its own.
    const [page, worker] = await Promise.all([agent.get('/api/auth/csrf'), agent.get('/api/auth/csrf')]);
    const fresh = (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken as string;
    expect(fresh).not.toBe(beforeSignIn);
    for (const token of [fresh, page.body.csrfToken, worker.body.csrfToken]) {
      expect((await agent.patch('/api/auth/me/preferences').set('X-CSRF-Token', token).send({ units: 'metric' })).status).toBe(200);
    }
  });

  it('ends a session past its absolute lifetime whatever its activity', async () => {
    const t2 = await startTestApp({ now: () => new Date(clock) });
    try {
      const farm = await buildOrganization({ kind: 'farm' });
      await buildUser({ organization: farm, role: 'owner', email: 'long-session@example.test' });
      const client = await signedInClient(t2.app, 'long-session@example.test');
      expect((await client.get('/api/auth/me')).status).toBe(200);
      clock += (t2.config.session.absoluteHours + 1) * 3_600_000;
      expect((await client.get('/api/auth/me')).status).toBe(401);
    } finally {
      clock = Date.now();
      await t2.stop();
    }
  });
});

describe('sign-in rate limits', () => {
  let t: TestApp;
  beforeAll(async () => { t = await startTestApp({ config: { loginRateLimit: { perAccount: 3, perAddress: 10 } } }); });
  afterAll(async () => { await t?.stop(); });

  it('limits sign-in attempts per account, even with the right password afterwards', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'guessed@example.test' });
    const client = await apiClient(t.app);
    for (let i = 0; i < 3; i++) expect((await client.post('/api/auth/login', { email: 'guessed@example.test', password: `guess-number-${i}` })).status).toBe(401);
    const blocked = await client.post('/api/auth/login', { email: 'guessed@example.test', password: defaultTestPassword });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
  });

  it('limits sign-in attempts per address across accounts', async () => {
    // The account test above used 4 of the address's 10 attempts.
    const client = await apiClient(t.app);
    let status = 0;
    for (let i = 0; i < 7 && status !== 429; i++) status = (await client.post('/api/auth/login', { email: `spray-${i}@example.test`, password: 'not-a-real-one' })).status;
    expect(status).toBe(429);
  });

});

describe('sessions survive a server restart', () => {
  let t: TestApp;
  beforeAll(async () => { t = await startTestApp(); });
  afterAll(async () => { await t?.stop(); });

  it('keeps the user signed in after createApp is restarted against the same database', async () => {
    const farm = await buildOrganization({ kind: 'farm', name: 'Restart Orchard' });
    await buildUser({ organization: farm, role: 'owner', email: 'restart@example.test' });
    const client = await signedInClient(t.app, 'restart@example.test');
    const me = await client.get('/api/auth/me');
    expect(me.status).toBe(200);
    const cookie = sessionCookieOf(me) ?? (await client.agent.get('/api/auth/me').then(sessionCookieOf));
    expect(cookie).toBeDefined();
    t = await t.restart();
    const after = await request(t.app).get('/api/auth/me').set('Cookie', cookie!.split(';')[0]);
    expect(after.status).toBe(200);
    expect(after.body.user.organization.name).toBe('Restart Orchard');
  });
});
