// Field work without signal, in Debian's Chromium against the production build: the crew
// member opens a drop site, loses the connection, records the drop-off with the phone's
// position and two photos and a strength check, reloads the page still offline (the page
// and the records survive, from the service worker and the phone's outbox), and when the
// connection returns the records are sent once each; the grower then sees them.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Browser } from 'playwright-core';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { launchBrowser, openWatchedPage, signInThroughPage, saveScreenshot, type WatchedPage, typeNumber } from '../support/browser.js';
import { buildScheduledFieldPlacement } from '../support/field-placement.js';
import { solidPng } from '../support/test-png.js';

const poll = <T>(check: () => T | Promise<T>) => expect.poll(check, { timeout: 20_000, interval: 150 });

/** Width and height from a JPEG's frame header (SOF0 or SOF2). */
function jpegSize(data: Buffer): { width: number; height: number } | null {
  for (let i = 2; i < data.length - 9; ) {
    if (data[i] !== 0xff) return null;
    const marker = data[i + 1];
    if (marker === 0xc0 || marker === 0xc2) return { height: data.readUInt16BE(i + 5), width: data.readUInt16BE(i + 7) };
    i += 2 + data.readUInt16BE(i + 2);
  }
  return null;
}

describe('field pages without signal', () => {
  let t: TestApp;
  let browser: Browser;
  let placementId: string;
  const pages: WatchedPage[] = [];

  beforeAll(async () => {
    t = await startTestApp();
    placementId = await buildScheduledFieldPlacement(20);
    browser = await launchBrowser();
  });
  afterAll(async () => {
    for (const [i, p] of pages.entries()) await saveScreenshot(p.page, `field-offline-end-${i}`).catch(() => {});
    await browser?.close();
    await t?.stop();
  });

  const rows = <T extends object>(sql: string) => t.context.sequelize.query<T>(sql, { replacements: { id: placementId }, type: QueryTypes.SELECT });

  it('keeps a drop-off, photos and a strength check through an offline reload and sends each once', async () => {
    const crew = await openWatchedPage(browser, { width: 412, height: 915, permissions: ['geolocation'], serviceWorkers: 'allow' });
    pages.push(crew);
    const { page, context } = crew;
    await context.setGeolocation({ latitude: 44.9004, longitude: -119.9003, accuracy: 12 });
    await signInThroughPage(page, t.baseUrl, 'crew@apiary.test', 'pollen-demo-2026');

    // The production build registers its service worker; once it controls the page, the
    // drop site's reads are kept for offline use.
    await page.goto(`${t.baseUrl}/placements/${placementId}`);
    await poll(() => page.evaluate(() => navigator.serviceWorker.ready.then(() => !!navigator.serviceWorker.controller))).toBe(true);
    await page.reload();
    await page.locator('#delivered-count').waitFor();
    await poll(() => page.evaluate(async (id) => {
      const cache = await caches.open('field-reads');
      return !!(await cache.match('/api/auth/me')) && !!(await cache.match('/api/auth/csrf')) && !!(await cache.match(`/api/placements/${id}`));
    }, placementId)).toBe(true);

    await context.setOffline(true);
    await poll(() => page.evaluate(() => navigator.onLine)).toBe(false);

    // Photos at the drop-off (camera-sized; the phone shrinks them), then the drop-off with the position.
    await page.locator('#placement-photo').setInputFiles([
      { name: 'pallets.png', mimeType: 'image/png', buffer: solidPng(2400, 1800, [82, 128, 61]) },
      { name: 'gate.png', mimeType: 'image/png', buffer: solidPng(1800, 2400, [199, 125, 18]) },
    ]);
    await poll(() => page.getByTestId('pending-photo').count()).toBe(2);
    await page.getByRole('button', { name: 'Use my position' }).click();
    await poll(() => page.getByRole('button', { name: /±12 m/ }).isVisible()).toBe(true);
    await typeNumber(page.locator('#delivered-count'), 20);
    await page.locator('form:has(#delivered-count) button[type="submit"]').click();

    // Offline, the colonies count as on site on this phone: the strength check comes next (2 of 20 opened).
    await page.locator('#frames-0').waitFor();
    await typeNumber(page.locator('#frames-0'), 7);
    await typeNumber(page.locator('#frames-1'), 8);
    await page.locator('#frames-1').blur();
    await page.locator('form:has(#frames-0) button[type="submit"]').click();
    await poll(() => page.getByTestId('pending-check').count()).toBe(1);
    await poll(() => page.getByTestId('outbox-waiting').textContent()).toBe('4 records waiting to send');

    // Reload while still offline: the page comes from the service worker, the records from IndexedDB.
    await page.reload();
    await poll(() => page.getByTestId('outbox-waiting').textContent()).toBe('4 records waiting to send');
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toBeTruthy();
    expect(await page.getByTestId('pending-photo').count()).toBe(2);
    expect(await page.getByTestId('pending-check').count()).toBe(1);
    // Nothing reached the server yet.
    expect((await rows<{ state: string }>('SELECT state FROM placements WHERE id = :id'))[0].state).toBe('scheduled');

    // The signal returns: everything is sent, in order, once.
    await context.setOffline(false);
    await poll(() => page.getByTestId('outbox-waiting').textContent()).toBe('Everything recorded here is sent');
    const [placement] = await rows<{ state: string; colonies_delivered: number; delivered_accuracy_m: number; lon: number; lat: number; delivered_recorded_at: Date; delivered_received_at: Date }>(
      'SELECT state, colonies_delivered, delivered_accuracy_m, ST_X(delivered_location) AS lon, ST_Y(delivered_location) AS lat, delivered_recorded_at, delivered_received_at FROM placements WHERE id = :id');
    expect(placement).toMatchObject({ state: 'delivered', colonies_delivered: 20, delivered_accuracy_m: 12 });
    expect(placement.lon).toBeCloseTo(-119.9003, 5);
    expect(placement.lat).toBeCloseTo(44.9004, 5);
    expect(placement.delivered_received_at.getTime()).toBeGreaterThan(placement.delivered_recorded_at.getTime());
    expect(await rows('SELECT id FROM strength_checks WHERE placement_id = :id')).toHaveLength(1);
    expect(await rows("SELECT id FROM hive_request_events WHERE action = 'placement-delivered' AND detail->>'placementId' = :id")).toHaveLength(1);
    const photos = await rows<{ content_type: string; data: Buffer; step: string }>('SELECT content_type, data, step FROM placement_photos WHERE placement_id = :id ORDER BY created_at');
    expect(photos).toHaveLength(2);
    // Shrunk on the phone to at most 1600 pixels on the long side, as JPEG.
    expect(photos.map((p) => [p.content_type, p.step])).toEqual([['image/jpeg', 'delivery'], ['image/jpeg', 'delivery']]);
    expect(photos.map((p) => jpegSize(p.data))).toEqual([{ width: 1600, height: 1200 }, { width: 1200, height: 1600 }]);
    expect(await rows('SELECT id FROM idempotency_keys')).toHaveLength(4);

    // The grower sees the drop-off, the check and the photos.
    const grower = await openWatchedPage(browser);
    pages.push(grower);
    await signInThroughPage(grower.page, t.baseUrl, 'grower@orchard.test', 'pollen-demo-2026');
    await grower.page.goto(`${t.baseUrl}/placements/${placementId}`);
    await poll(() => grower.page.getByText('Rosa Linden-Marsh').first().isVisible()).toBe(true);
    await poll(() => grower.page.locator('.pp-photos img').count()).toBe(2);
    await poll(() => grower.page.getByText(/2 of 20 opened/).isVisible()).toBe(true);
    expect([...crew.externalRequests, ...grower.externalRequests]).toEqual([]);
  });
});
