// The season pages in the browser: the season picker counts the farm's season in the
// farm's time zone, not the browser's calendar year.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser, Route } from 'playwright-core';
import { DateTime } from 'luxon';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { launchBrowser, signInThroughPage } from '../support/browser.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';

const slow = { timeout: 15_000 };

describe('season picker in the browser', () => {
  let t: TestApp;
  let browser: Browser;
  const zone = 'America/Los_Angeles';

  beforeAll(async () => {
    t = await startTestApp();
    const farm = await buildOrganization({ kind: 'farm', name: 'Larkspur Terrace Orchard', timeZone: zone });
    await buildUser({ organization: farm, role: 'owner', email: 'grower@season-e2e.test', name: 'Ada Grower' });
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await t?.stop();
  });

  it('offers the farm\'s seasons on a US New Year\'s Eve, when the browser\'s UTC calendar is already next year', async () => {
    // 20:30 on 31 December in Los Angeles is 04:30 on 1 January in UTC (UTC-8: IANA time zone database).
    const eve = DateTime.now().setZone(zone).set({ month: 12, day: 31, hour: 20, minute: 30, second: 0, millisecond: 0 });
    expect(eve.toUTC().year).toBe(eve.year + 1);
    const context = await browser.newContext({ timezoneId: 'UTC', serviceWorkers: 'block' });
    const page = await context.newPage();
    const consoleErrors: string[] = [];
    page.on('pageerror', (err) => consoleErrors.push(err.message));
    await signInThroughPage(page, t.baseUrl, 'grower@season-e2e.test');
    await page.clock.setFixedTime(eve.toJSDate());
    // Hold the timeline's answer so the picker shows the seasons it works out itself.
    const held: Route[] = [];
    await page.route((url) => url.pathname === '/api/dashboard/timeline', (route) => { held.push(route); });
    await page.goto(`${t.baseUrl}/season/timeline`);
    await expect.poll(() => held.length, slow).toBeGreaterThan(0);
    await page.getByRole('combobox', { name: 'Season' }).click();
    const options = page.getByRole('option');
    await options.first().waitFor(slow);
    expect(await options.allInnerTexts()).toEqual([eve.year + 1, eve.year, eve.year - 1, eve.year - 2].map(String));
    for (const route of held) await route.continue();
    expect(consoleErrors).toEqual([]);
    await context.close();
  });
});
