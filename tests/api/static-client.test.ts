// The built client as the server sends it: gzip to a browser that asks for it (crews open
// the app on weak signal; the API's JSON goes as it is, see README), the files under assets/
// (their names carry a hash of their content) kept a year, a missing one a 404 rather than
// the app's page in its place, and any other address the app's page (the client routes it).
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient } from '../support/api-client.js';
import { buildMarket } from '../support/builders/requests.js';

describe('the built client and the API over HTTP', () => {
  const dist = mkdtempSync(join(tmpdir(), 'pollenpact-dist-'));
  const script = `export const rows = [${Array.from({ length: 2000 }, (_, i) => `'row ${i}'`).join(', ')}];\n`;
  let t: TestApp;

  beforeAll(async () => {
    mkdirSync(join(dist, 'assets'));
    writeFileSync(join(dist, 'index.html'), '<!doctype html><title>Pollenpact</title><div id="app"></div>');
    writeFileSync(join(dist, 'assets', 'index-Ab12Cd34.js'), script);
    t = await startTestApp({ env: { CLIENT_DIST: dist } });
  });
  afterAll(async () => {
    await t?.stop();
    rmSync(dist, { recursive: true, force: true });
  });

  it('gzips the app\'s code for a browser that asks, sends it plain to one that does not, and keeps it a year', async () => {
    const zipped = await request(t.app).get('/assets/index-Ab12Cd34.js').set('Accept-Encoding', 'gzip, deflate').expect(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.text).toBe(script);
    expect(zipped.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    const plain = await request(t.app).get('/assets/index-Ab12Cd34.js').set('Accept-Encoding', 'identity').expect(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(Number(plain.headers['content-length'])).toBe(Buffer.byteLength(script));
  });

  it('answers a missing built file with a 404, and a page address with the app\'s page', async () => {
    const missing = await request(t.app).get('/assets/index-Zz99Yy88.js').expect(404);
    expect(missing.body.error.code).toBe('not_found');
    const page = await request(t.app).get('/blocks/some-block').expect(200);
    expect(page.headers['content-type']).toMatch(/^text\/html/);
    expect(page.text).toContain('<title>Pollenpact</title>');
  });

  it('sends the API\'s JSON as it is, even large and to a client that asks for gzip', async () => {
    const m = await buildMarket();
    const grower = await signedInClient(t.app, m.people.grower.email);
    const res = await grower.get('/api/blocks').set('Accept-Encoding', 'gzip, br').expect(200);
    expect(Buffer.byteLength(JSON.stringify(res.body))).toBeGreaterThan(1024);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.headers['content-type']).toMatch(/^application\/json/);
  });
});
