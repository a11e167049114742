// The season's main flow in the browser: a grower asks for colonies; one beekeeper commits
// part, a second commits the rest; grower and beekeeper confirm the agreement; the crew,
// on a phone, marks colonies delivered; the grower sees it arrive without reloading.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser, Locator } from 'playwright-core';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { launchBrowser, openWatchedPage, signInThroughPage, saveScreenshot, type WatchedPage, typeNumber, watchFor } from '../support/browser.js';
import { buildMarket } from '../support/builders/requests.js';

/** Waits for the page (a loaded machine may take a few seconds). */
const poll = <T>(check: () => T | Promise<T>) => expect.poll(check, { timeout: 15_000, interval: 100 });
/** What a screen reader reads with a field besides its name: the texts its aria-describedby points at. */
const descriptionOf = (field: Locator) => field.evaluate((el) =>
  (el.getAttribute('aria-describedby') ?? '').split(/\s+/).map((id) => document.getElementById(id)?.textContent?.trim()).filter(Boolean).join(' '));

describe('hive request to delivery in the browser', () => {
  let t: TestApp;
  let browser: Browser;
  let m: Awaited<ReturnType<typeof buildMarket>>;
  const pages: WatchedPage[] = [];

  beforeAll(async () => {
    t = await startTestApp();
    m = await buildMarket();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    // Where each page stood at the end, for a failed run.
    for (const [i, p] of pages.entries()) await saveScreenshot(p.page, `requests-flow-end-${i}`).catch(() => {});
    await browser?.close();
    await t?.stop();
  });

  async function signedIn(email: string, options: { width?: number; height?: number; permissions?: string[] } = {}) {
    const watched = await openWatchedPage(browser, options);
    pages.push(watched);
    await signInThroughPage(watched.page, t.baseUrl, email);
    return watched;
  }

  it('runs from the request to a live delivery notice', async () => {
    // The grower asks for 60 colonies on the block (about 30 acres x 2 colonies per acre, offered as a start).
    const grower = await signedIn(m.people.grower.email);
    const g = grower.page;
    await g.goto(`${t.baseUrl}/requests/new`);
    await g.getByLabel(/North Galas/).check();
    const colonies = g.getByLabel('colonies', { exact: true });
    await poll(async () => Number(await colonies.inputValue())).toBeGreaterThanOrEqual(60);
    await typeNumber(colonies, 60);
    await colonies.blur();
    // The number inputs and lists are read with their hint and message (FormField's aria-describedby on the focused element).
    expect(await descriptionOf(colonies)).toMatch(/^\d+\.\d ac × 2 per acre = \d+$/);
    expect(await g.locator('#arrive-rule').getAttribute('aria-describedby')).toBe('arrive-rule-error');
    await g.getByLabel('Title').fill('Galas at first bloom');
    // Opened before a drop site is added: refused, the drop sites marked, the draft kept.
    await g.getByRole('button', { name: 'Save and open for commitments' }).click();
    await poll(() => g.locator('#sites-error').textContent()).toMatch(/add at least one drop site/i);
    await poll(() => g.getByTestId('saved-draft-note').isVisible()).toBe(true);
    await g.getByRole('button', { name: 'Add a drop site' }).click();
    // The drop site starts at the block; a click on the map moves it there.
    const latitude = g.getByLabel('Latitude');
    const startLatitude = Number((await latitude.inputValue()).replace(/,/g, ''));
    const siteMap = g.getByRole('region', { name: /click to place the chosen drop site/ });
    const mapBox = (await siteMap.boundingBox())!;
    await siteMap.click({ position: { x: mapBox.width / 2, y: mapBox.height / 4 } });
    await poll(async () => Number((await latitude.inputValue()).replace(/,/g, ''))).toBeGreaterThan(startLatitude);
    await g.getByLabel('Gate code (private)').fill('7719');
    await g.getByRole('button', { name: 'Save and open for commitments' }).click();
    await g.waitForURL(/\/requests\/[0-9a-f-]{36}$/);
    await poll(() => g.getByText('Open for commitments', { exact: true }).isVisible()).toBe(true);
    const requestUrl = g.url();
    // Saved again, the same draft was changed and opened: one request, with its drop site.
    const saved = await t.context.models.HiveRequest.findAll({ where: { title: 'Galas at first bloom' }, include: ['dropSites'] });
    expect(saved.map((r) => ({ url: `${t.baseUrl}/requests/${r.id}`, state: r.state, sites: r.dropSites!.length }))).toEqual([{ url: requestUrl, state: 'listed', sites: 1 }]);

    // The first beekeeper finds it with its distance and commits 40.
    const keeper = await signedIn(m.people.keeper.email);
    const k = keeper.page;
    await k.goto(`${t.baseUrl}/requests`);
    await poll(() => k.getByText(/km from your nearest yard/).first().isVisible()).toBe(true);
    await k.getByRole('link', { name: 'Galas at first bloom' }).click();
    await k.waitForURL(requestUrl);
    await poll(() => k.getByText('gate code shown once your agreement is confirmed by both sides').isVisible()).toBe(true);
    await typeNumber(k.getByLabel(/Colonies \(up to 60 still open\)/), 40);
    await k.getByRole('button', { name: 'Commit colonies' }).click();
    await poll(() => k.getByText(/40 colonies · Accepted/).isVisible()).toBe(true);

    // The second beekeeper commits the 20 still open; the request is fully committed.
    const keeper2 = await signedIn(m.people.keeper2.email);
    const k2 = keeper2.page;
    await k2.goto(requestUrl);
    await poll(() => k2.getByLabel(/Colonies \(up to 20 still open\)/).inputValue()).toBe('20');
    await k2.getByRole('button', { name: 'Commit colonies' }).click();
    await poll(() => k2.getByText(/20 colonies · Accepted/).isVisible()).toBe(true);
    await poll(() => g.getByText('Fully committed', { exact: true }).isVisible()).toBe(true); // live on the grower's page

    // Both sides confirm the first beekeeper's agreement.
    await k.getByRole('link', { name: 'Open the agreement' }).click();
    await k.waitForURL(/\/agreements\//);
    const agreementUrl = k.url();
    await k.getByRole('button', { name: 'Confirm agreement' }).click();
    await poll(() => k.getByText(/Beekeeper:\s*Confirmed by Bram Tully/).isVisible()).toBe(true);
    await g.goto(agreementUrl);
    await g.getByRole('button', { name: 'Confirm agreement' }).click();
    await poll(() => g.getByText('Confirmed by both', { exact: true }).isVisible()).toBe(true);
    await poll(() => g.locator('[data-state="scheduled"]').count()).toBe(1); // one drop site, planned for all 60
    await saveScreenshot(g, 'requests-agreement-confirmed');

    // The crew, on a 360 px phone with its position, marks the North lane delivered.
    const crew = await signedIn(m.people.crew.email, { width: 360, height: 740, permissions: ['geolocation'] });
    await crew.context.setGeolocation({ latitude: m.lat + 0.0002, longitude: m.lon });
    const c = crew.page;
    await c.goto(`${t.baseUrl}/placements`);
    await c.getByRole('link', { name: /North Galas/ }).first().click();
    await c.waitForURL(/\/placements\//);
    await poll(() => c.getByText('7719').isVisible()).toBe(true); // the gate code, now that the agreement is confirmed
    const deliver = c.getByRole('button', { name: 'Mark dropped off' });
    const box = await deliver.boundingBox();
    expect(box!.height).toBeGreaterThanOrEqual(44); // a large touch target
    expect(box!.width).toBeLessThanOrEqual(360);
    expect(await c.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360); // nothing wider than the phone
    await c.getByRole('button', { name: 'Use my position' }).click();
    await poll(() => c.getByRole('button', { name: /Position taken/ }).isVisible()).toBe(true);
    // The grower's notice stays five seconds: watched from before the click, so the steps below cannot outlast it.
    const fieldUpdate = watchFor(g.locator('.p-toast-message', { hasText: 'Field update' }));
    await deliver.click();
    await poll(() => c.locator('[data-state="delivered"]').isVisible()).toBe(true);
    await saveScreenshot(c, 'requests-crew-delivered-360');

    // The grower's agreement page shows it without a reload.
    await poll(() => g.locator('[data-state="delivered"]').count()).toBe(1);
    expect(await fieldUpdate).toBe(true);

    // The one refusal asked for above (opened with no drop site) is the grower's only console error.
    expect(grower.consoleErrors).toEqual(['Failed to load resource: the server responded with a status of 400 (Bad Request)']);
    for (const p of pages) {
      if (p !== grower) expect(p.consoleErrors).toEqual([]);
      expect(p.externalRequests).toEqual([]);
    }
  }, 180_000);
});
