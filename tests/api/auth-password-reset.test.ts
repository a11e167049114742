// Password reset by e-mail: the link goes through the job queue to the mail sink; the
// token works once, expires after one hour (the clock is moved, not waited for), never
// reveals whether an account exists, and ends the user's other sessions.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { apiClient, signedInClient } from '../support/api-client.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { hashEmailedToken } from '../../server/src/modules/auth/emailed-tokens.js';

const tokenIn = (text: string) => /reset-password#token=([A-Za-z0-9_-]+)/.exec(text)?.[1];

describe('password reset', () => {
  let t: TestApp;
  let clock = Date.now();
  beforeAll(async () => { t = await startTestApp({ now: () => new Date(clock) }); });
  afterAll(async () => { await t?.stop(); });

  async function askForReset(email: string) {
    const seen = t.sink.messages.length;
    const client = await apiClient(t.app);
    const res = await client.post('/api/auth/password-reset', { email });
    expect(res.status).toBe(202);
    const message = await eventually(() => t.sink.messages.slice(seen).find((m) => m.to.includes(email)));
    expect(message.subject).toBe('Reset your Pollenpact password');
    return tokenIn(message.text)!;
  }

  it('e-mails a single-use link; the new password works and the old one no longer does', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    const user = await buildUser({ organization: farm, role: 'manager', email: 'forgetful@example.test' });
    const token = await askForReset('forgetful@example.test');
    expect(token).toHaveLength(43);

    // Only the hash is stored.
    const stored = await t.context.sequelize.query<{ token_hash: string }>('SELECT token_hash FROM password_reset_tokens WHERE user_id = :id', { replacements: { id: user.id }, type: QueryTypes.SELECT });
    expect(stored).toEqual([{ token_hash: hashEmailedToken(token) }]);
    expect(stored[0].token_hash).not.toContain(token);

    const client = await apiClient(t.app);
    const first = await client.post('/api/auth/password-reset/confirm', { token, password: 'bright-new-passphrase' });
    expect(first.status).toBe(200);
    const again = await client.post('/api/auth/password-reset/confirm', { token, password: 'another-new-passphrase' });
    expect(again.status).toBe(400);
    expect(again.body.error.fields.token).toMatch(/invalid, used or expired/);

    expect((await client.post('/api/auth/login', { email: 'forgetful@example.test', password: 'bright-new-passphrase' })).status).toBe(200);
    const old = await apiClient(t.app);
    expect((await old.post('/api/auth/login', { email: 'forgetful@example.test', password: 'pollen-demo-2026' })).status).toBe(401);
  });

  it('refuses a token after one hour', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'slow-reader@example.test' });
    const token = await askForReset('slow-reader@example.test');
    clock += 61 * 60_000;
    try {
      const client = await apiClient(t.app);
      const res = await client.post('/api/auth/password-reset/confirm', { token, password: 'bright-new-passphrase' });
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
    } finally {
      clock = Date.now();
    }
  });

  it('accepts a token just before the hour is up', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'just-in-time@example.test' });
    const token = await askForReset('just-in-time@example.test');
    clock += 59 * 60_000;
    try {
      const client = await apiClient(t.app);
      expect((await client.post('/api/auth/password-reset/confirm', { token, password: 'bright-new-passphrase' })).status).toBe(200);
    } finally {
      clock = Date.now();
    }
  });

  it('ends the sessions the user had open', async () => {
    const apiary = await buildOrganization({ kind: 'apiary' });
    await buildUser({ organization: apiary, role: 'owner', email: 'reset-sessions@example.test' });
    const elsewhere = await signedInClient(t.app, 'reset-sessions@example.test');
    expect((await elsewhere.get('/api/auth/me')).status).toBe(200);
    const token = await askForReset('reset-sessions@example.test');
    const client = await apiClient(t.app);
    expect((await client.post('/api/auth/password-reset/confirm', { token, password: 'bright-new-passphrase' })).status).toBe(200);
    expect((await elsewhere.get('/api/auth/me')).status).toBe(401);
  });

  it('answers the same for an unknown e-mail and sends nothing', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'has-account@example.test' });
    const client = await apiClient(t.app);
    const unknown = await client.post('/api/auth/password-reset', { email: 'no-account@example.test' });
    const known = await client.post('/api/auth/password-reset', { email: 'has-account@example.test' });
    expect([unknown.status, unknown.body]).toEqual([known.status, known.body]);
    // Nothing was queued for the unknown address (the known one was): no waiting needed.
    const queuedFor = (to: string) =>
      t.context.sequelize.query(`SELECT id FROM pgboss.job WHERE name = 'email-send' AND data ->> 'to' = :to`, { replacements: { to }, type: QueryTypes.SELECT });
    expect(await queuedFor('has-account@example.test')).toHaveLength(1);
    expect(await queuedFor('no-account@example.test')).toHaveLength(0);
  });

  it('refuses a common password and names the field', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'weak-choice@example.test' });
    const token = await askForReset('weak-choice@example.test');
    const client = await apiClient(t.app);
    const res = await client.post('/api/auth/password-reset/confirm', { token, password: 'password123' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ password: 'is too common; choose another' });
    // The token was not spent by the refused attempt.
    expect((await client.post('/api/auth/password-reset/confirm', { token, password: 'bright-new-passphrase' })).status).toBe(200);
  });
});
