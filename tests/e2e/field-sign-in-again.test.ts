// A session that ends while the crew works without signal, in Debian's Chromium against
// the production build: the drop-off recorded offline waits in the phone's outbox; when
// the signal returns the server answers 401, so the outbox keeps the record and asks the
// crew member to sign in again, with a link back to the drop site; after signing in the
// record is sent, and the server keeps it exactly once.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Browser } from 'playwright-core';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { launchBrowser, openWatchedPage, signInThroughPage, saveScreenshot, type WatchedPage, typeNumber } from '../support/browser.js';
import { buildScheduledFieldPlacement } from '../support/field-placement.js';

const poll = <T>(check: () => T | Promise<T>) => expect.poll(check, { timeout: 20_000, interval: 150 });

describe('field pages when the session ends without signal', () => {
  let t: TestApp;
  let browser: Browser;
  let placementId: string;
  let crew: WatchedPage | undefined;

  beforeAll(async () => {
    t = await startTestApp();
    placementId = await buildScheduledFieldPlacement(12);
    browser = await launchBrowser();
  });
  afterAll(async () => {
    if (crew) await saveScreenshot(crew.page, 'field-sign-in-again-end').catch(() => {});
    await browser?.close();
    await t?.stop();
  });

  const rows = <T extends object>(sql: string) => t.context.sequelize.query<T>(sql, { replacements: { id: placementId }, type: QueryTypes.SELECT });

  it('keeps the drop-off, asks to sign in again, then sends it once', async () => {
    crew = await openWatchedPage(browser, { width: 412, height: 915 });
    const { page, context } = crew;
    await signInThroughPage(page, t.baseUrl, 'crew@apiary.test', 'pollen-demo-2026');
    await page.goto(`${t.baseUrl}/placements/${placementId}`);
    await page.locator('#delivered-count').waitFor();

    await context.setOffline(true);
    await poll(() => page.evaluate(() => navigator.onLine)).toBe(false);
    await typeNumber(page.locator('#delivered-count'), 11);
    await page.getByRole('button', { name: 'Mark dropped off' }).click();
    await poll(() => page.getByTestId('outbox-waiting').textContent()).toBe('1 record waiting to send');

    // Meanwhile the session ends on the server (expired, or ended from another device).
    const ended = await t.context.sequelize.query('DELETE FROM user_sessions RETURNING sid', { type: QueryTypes.SELECT });
    expect(ended.length).toBeGreaterThan(0);

    // The signal returns: the server refuses the record as signed out; the phone keeps it and asks.
    await context.setOffline(false);
    const prompt = page.getByRole('alert').filter({ hasText: 'Your session has ended' });
    await poll(() => prompt.isVisible()).toBe(true);
    expect(await prompt.textContent()).toContain('the 1 waiting record is sent; nothing is lost');
    expect(new URL(page.url()).pathname).toBe(`/placements/${placementId}`);
    expect(await page.getByTestId('outbox-waiting').textContent()).toBe('1 record waiting to send');
    expect((await rows<{ state: string }>('SELECT state FROM placements WHERE id = :id'))[0].state).toBe('scheduled');
    expect(await rows('SELECT id FROM idempotency_keys')).toHaveLength(0);

    // The link leads to sign-in and, once signed in, back to this drop site.
    const link = prompt.getByRole('link', { name: 'Sign in again' });
    const href = new URL((await link.getAttribute('href'))!, t.baseUrl);
    expect([href.pathname, href.searchParams.get('redirect')]).toEqual(['/sign-in', `/placements/${placementId}`]);
    await link.click();
    await page.waitForURL((url) => url.pathname === '/sign-in');
    await page.getByLabel('E-mail').fill('crew@apiary.test');
    await page.getByLabel('Password').fill('pollen-demo-2026');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === `/placements/${placementId}`);

    await poll(() => page.getByTestId('outbox-waiting').textContent()).toBe('Everything recorded here is sent');
    await poll(async () => (await rows<{ state: string }>('SELECT state FROM placements WHERE id = :id'))[0].state).toBe('delivered');
    const [placement] = await rows<{ colonies_delivered: number; email: string }>('SELECT p.colonies_delivered, u.email FROM placements p JOIN users u ON u.id = p.delivered_by WHERE p.id = :id');
    expect(placement).toEqual({ colonies_delivered: 11, email: 'crew@apiary.test' });
    expect(await rows("SELECT id FROM hive_request_events WHERE action = 'placement-delivered' AND detail->>'placementId' = :id")).toHaveLength(1);
    expect(await rows('SELECT id FROM idempotency_keys')).toHaveLength(1);
    expect(await page.getByRole('alert').filter({ hasText: 'Your session has ended' }).count()).toBe(0);
    expect(crew.externalRequests).toEqual([]);
  });
});
