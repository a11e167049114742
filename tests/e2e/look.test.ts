// The main pages in Chromium for a grower, a beekeeper and the admin, at desktop and 360 px
// phone width: the key content is visible, axe-core finds no serious or critical
// accessibility violation, nothing leaves 127.0.0.1, and a screenshot of each is kept.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { AxeBuilder } from '@axe-core/playwright';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { launchBrowser, openWatchedPage, signInThroughPage, saveScreenshot, typeNumber } from '../support/browser.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildAgreement, buildBlock, buildBloomWindow, buildCommitment, buildDropSite, buildPlacement, buildRequest, buildYard } from '../support/builders/season.js';

const DAY = 86_400_000;
const widths = [
  { name: 'desktop', width: 1280, height: 860 },
  { name: 'phone', width: 360, height: 740 },
] as const;

/** Serious and critical findings only (axe-core impact levels), WCAG 2.x A and AA rules. */
async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']).analyze();
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(' ')).slice(0, 3).join(' | ')})`);
}

describe('the look: main pages for each side', () => {
  let t: TestApp;
  let browser: Browser;

  beforeAll(async () => {
    t = await startTestApp();
    const now = Date.now();
    const day = (offset: number) => new Date(now + offset * DAY);
    const isoDay = (offset: number) => day(offset).toISOString().slice(0, 10);
    const farm = await buildOrganization({ kind: 'farm', name: 'Brackenfold Orchard' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Cloverhythe Apiaries', coloniesOwned: 120 });
    await buildUser({ organization: farm, role: 'owner', email: 'look-grower@example.test', name: 'Wren Halloway' });
    await buildUser({ organization: apiary, role: 'owner', email: 'look-keeper@example.test', name: 'Ossian Pell' });
    await buildUser({ organization: null, role: 'admin', email: 'look-admin@example.test', name: 'Platform Admin' });

    const upper = await buildBlock({ farm, name: 'Upper Terrace Apples', crop: 'apple', acres: 24, withOutline: false, coloniesPerAcre: 2, lon: -120.51, lat: 46.6 });
    const lower = await buildBlock({ farm, name: 'Lower Bench Cherries', crop: 'sweet cherry', acres: 12, withOutline: false, coloniesPerAcre: 3, lon: -120.5, lat: 46.593 });
    await buildBloomWindow({ block: upper, bloomStart: isoDay(-4), fullBloom: isoDay(1), petalFall: isoDay(9) });
    await buildBloomWindow({ block: lower, bloomStart: isoDay(3), petalFall: isoDay(15) });
    const r1 = await buildRequest({ farm, blocks: [{ block: upper, colonies: 48 }], state: 'filled', onSite: { from: day(-5), to: day(11) } });
    const site1 = await buildDropSite({ request: r1, block: upper, name: 'Orchard lane gate', lon: -120.51, lat: 46.601, coloniesPlanned: 48 });
    const a1 = await buildAgreement({ commitment: await buildCommitment({ request: r1, apiary, colonies: 48 }) });
    await buildPlacement({ agreement: a1, dropSite: site1, coloniesPlanned: 48, deliveredAt: day(-4) });
    const r2 = await buildRequest({ farm, blocks: [{ block: lower, colonies: 36 }], state: 'listed', onSite: { from: day(2), to: day(17) } });
    const site2 = await buildDropSite({ request: r2, block: lower, name: 'Windbreak corner', lon: -120.5, lat: 46.594, coloniesPlanned: 24 });
    const a2 = await buildAgreement({ commitment: await buildCommitment({ request: r2, apiary, colonies: 24 }) });
    await buildPlacement({ agreement: a2, dropSite: site2, coloniesPlanned: 24 });
    await buildYard({ apiary, name: 'Sallow Hollow yard', lon: -120.6, lat: 46.65, colonies: 80 });
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await t?.stop();
  });

  /**
   * Opens a page, checks its key content and keeps a screenshot. axe-core runs on every page
   * at desktop width and on the overview at phone width (the phone layout changes the
   * overview most; axe is the slow part of these tests).
   */
  async function checkPage(page: Page, name: string, path: string, expectVisible: (page: Page) => Promise<void>, options: { axe?: boolean } = {}) {
    await page.goto(`${t.baseUrl}${path}`);
    await expect.poll(() => page.locator('h1').first().isVisible(), { timeout: 15_000 }).toBe(true);
    await expectVisible(page);
    await page.evaluate(() => document.fonts.ready);
    if (options.axe !== false) expect(await seriousViolations(page), `accessibility on ${name}`).toEqual([]);
    await saveScreenshot(page, name);
  }

  /** chart.js sizes its canvas once it has drawn (PrimeVue Chart loads chart.js on demand). */
  const chartDrawn = async (page: Page, selector: string) =>
    expect.poll(() => page.locator(selector).first().evaluate((c) => (c as HTMLCanvasElement).style.boxSizing === 'border-box' && (c as HTMLCanvasElement).width > 0), { timeout: 15_000 }).toBe(true);

  const visible = async (page: Page, text: string | RegExp) =>
    expect.poll(() => page.getByText(text).first().isVisible(), { timeout: 15_000, message: `"${text}" visible` }).toBe(true);

  for (const size of widths) {
    it(`shows the grower's overview, timeline and map at ${size.name} width`, async () => {
      const { page, context, consoleErrors, externalRequests } = await openWatchedPage(browser, { width: size.width, height: size.height });
      await signInThroughPage(page, t.baseUrl, 'look-grower@example.test');

      await checkPage(page, `look-grower-home-${size.name}`, '/', async (p) => {
        await visible(p, 'Upper Terrace Apples');
        await visible(p, 'Colonies needed');
        // 24 acres x 2 + 12 acres x 3 = 84 colonies needed (acres x colonies per acre, rounded up;
        // common practice, no source).
        await expect.poll(() => p.locator('.pp-stat').first().innerText()).toContain('84');
        await visible(p, 'In bloom');
        // Lower Bench: 36 needed, 24 planned.
        await visible(p, '12 short');
      });
      await checkPage(page, `look-grower-timeline-${size.name}`, '/season/timeline', async (p) => {
        await chartDrawn(p, '.pp-timeline-chart canvas');
        await visible(p, 'Bloom window');
        await p.getByText('Timeline as a list').click();
        await visible(p, /48 colonies at Orchard lane gate/);
      }, { axe: size.name === 'desktop' });
      await checkPage(page, `look-grower-map-${size.name}`, '/season/map', async (p) => {
        await expect.poll(() => p.locator('.pp-season-map path.leaflet-interactive').count()).toBeGreaterThanOrEqual(4);
        await visible(p, 'Block in bloom');
        await visible(p, 'Windbreak corner');
      }, { axe: size.name === 'desktop' });
      expect(consoleErrors).toEqual([]);
      expect(externalRequests).toEqual([]);
      await context.close();
    });

    it(`shows the beekeeper's overview, timeline and map at ${size.name} width`, async () => {
      const { page, context, consoleErrors, externalRequests } = await openWatchedPage(browser, { width: size.width, height: size.height });
      await signInThroughPage(page, t.baseUrl, 'look-keeper@example.test');
      await checkPage(page, `look-keeper-home-${size.name}`, '/', async (p) => {
        await visible(p, 'Colonies committed by week');
        await chartDrawn(p, '.pp-colonies-chart canvas');
        await visible(p, 'Windbreak corner');
        await expect.poll(() => p.locator('.pp-stat').first().innerText()).toContain('120');
      });
      await checkPage(page, `look-keeper-timeline-${size.name}`, '/season/timeline', async (p) => {
        await chartDrawn(p, '.pp-timeline-chart canvas');
        await visible(p, 'Colonies on site');
      }, { axe: size.name === 'desktop' });
      await checkPage(page, `look-keeper-map-${size.name}`, '/season/map', async (p) => {
        await visible(p, 'Sallow Hollow yard');
        await visible(p, 'Bee yard');
      }, { axe: size.name === 'desktop' });
      expect(consoleErrors).toEqual([]);
      expect(externalRequests).toEqual([]);
      await context.close();
    });
  }

  it('lets the beekeeper owner enter the colonies the business has', async () => {
    const { page, context } = await openWatchedPage(browser);
    await signInThroughPage(page, t.baseUrl, 'look-keeper@example.test');
    await visible(page, 'Colonies committed by week');
    const field = page.getByLabel('Colonies owned', { exact: true });
    await typeNumber(field, 150);
    await page.getByRole('button', { name: 'Save' }).click();
    await visible(page, 'Colony total saved');
    await expect.poll(() => page.locator('.pp-stat').first().innerText()).toContain('150');
    await context.close();
  });

  it('switches a grower to hectares from the display preferences', async () => {
    const { page, context } = await openWatchedPage(browser);
    await signInThroughPage(page, t.baseUrl, 'look-grower@example.test');
    await visible(page, 'Upper Terrace Apples');
    await page.getByRole('button', { name: /Account menu/ }).click();
    await page.getByRole('menuitem', { name: 'Display preferences' }).click();
    await page.getByLabel('Hectares and °C').check();
    await page.getByRole('button', { name: 'Save' }).click();
    // 24 acres = 9.7 ha (1 acre = 0.40468564224 ha, NIST Handbook 44, Appendix C).
    await visible(page, '9.7 ha');
    await context.close();
  });

  it("shows the admin's platform overview with organizations, users and queues", async () => {
    const { page, context, consoleErrors } = await openWatchedPage(browser);
    await signInThroughPage(page, t.baseUrl, 'look-admin@example.test');
    await checkPage(page, 'look-admin-home-desktop', '/', async (p) => {
      await visible(p, 'Platform overview');
      await visible(p, 'Brackenfold Orchard');
      await visible(p, 'look-keeper@example.test');
      await visible(p, 'Job queues');
    });
    expect(consoleErrors).toEqual([]);
    await context.close();
  });
});
