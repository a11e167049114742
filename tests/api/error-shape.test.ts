// Every error answer has the shape { error: { code, message, fields? } }, never a 500 for bad input.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { apiClient } from '../support/api-client.js';

describe('API error answers', () => {
  let t: TestApp;
  beforeAll(async () => { t = await startTestApp(); });
  afterAll(async () => { await t?.stop(); });

  it('answers an unknown /api route with 404 in the error shape', async () => {
    const client = await apiClient(t.app);
    const res = await client.get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect(typeof res.body.error.message).toBe('string');
  });

  it('answers a malformed JSON body with 400 malformed_json, not 500', async () => {
    const client = await apiClient(t.app);
    const res = await client.agent
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .set('X-CSRF-Token', client.csrfToken)
      .send('{"email": "a@b.test", "password": ');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: { code: 'malformed_json', message: expect.any(String), fields: { body: 'is not valid JSON' } } });
  });

  it('answers a state-changing request without a CSRF token with 403 in the error shape', async () => {
    const client = await apiClient(t.app);
    const res = await client.agent.post('/api/auth/login').send({ email: 'a@b.test', password: 'x' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('csrf_invalid');
  });

  it('names each bad field in a 400', async () => {
    const client = await apiClient(t.app);
    const res = await client.post('/api/auth/login', { email: 'not-an-email' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('serves the built client and falls back to index.html for client routes', async () => {
    const client = await apiClient(t.app);
    const res = await client.get('/blocks/some-client-route');
    expect(res.status).toBe(200);
    expect(res.text).toContain('<div id="app">');
  });
});
