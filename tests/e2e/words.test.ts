// Every demo role walks its pages in Chromium (each navigation entry, the first record of each
// list, the preferences dialog) and no visible text reads like a code: no stored state code
// with a hyphen, no camelCase key, no "cents", no raw ISO timestamp. The grower's and the
// beekeeper's main pages are kept as screenshots at desktop width (on the walk) and phone width.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { launchBrowser, openWatchedPage, signInThroughPage, saveScreenshot } from '../support/browser.js';
import { seedScenario } from '../../seed/scenario.js';
import { labelSets } from '../../shared/labels/index.js';

/** Every stored code with a hyphen (a single word like "listed" could be an ordinary word). */
const hyphenCodes = [...new Set(labelSets.flatMap((s) => s.codes.filter((c) => c.includes('-'))))];
const codePattern = new RegExp(`(?<![\\w-])(${hyphenCodes.map((c) => c.replace(/-/g, '\\-')).join('|')})(?![\\w-])`);
/** camelCase keys; the trade's and standards' own spellings are words, not keys. */
const camelCase = /\b[a-z]+[A-Z][A-Za-z]*\b/g;
const camelCaseWords = new Set(['iCalendar']);
const isoTimestamp = /\b\d{4}-\d{2}-\d{2}T\d{2}:\d{2}/;

/** What a person reads on the page that looks like a code, if anything. */
async function codeLikeText(page: Page): Promise<string[]> {
  const text = await page.evaluate(() => document.body.innerText);
  const found: string[] = [];
  const code = text.match(codePattern);
  if (code) found.push(`state code "${code[1]}"`);
  for (const word of text.match(camelCase) ?? []) if (!camelCaseWords.has(word)) found.push(`key "${word}"`);
  if (/\bcents\b/i.test(text)) found.push('"cents"');
  const iso = text.match(isoTimestamp);
  if (iso) found.push(`timestamp "${iso[0]}"`);
  return found;
}

const roles = [
  { email: 'grower@orchard.test', name: 'grower', screenshots: true },
  { email: 'applicator@orchard.test', name: 'applicator', screenshots: false },
  { email: 'grower2@ridge.test', name: 'grower2', screenshots: false },
  { email: 'keeper@apiary.test', name: 'beekeeper', screenshots: true },
  { email: 'crew@apiary.test', name: 'crew', screenshots: false },
  { email: 'keeper2@hives.test', name: 'keeper2', screenshots: false },
  { email: 'admin@pollenpact.test', name: 'admin', screenshots: false },
] as const;

/** The list pages whose first record is opened too, and the link that leads to one. */
const firstRecord: Record<string, RegExp> = {
  blocks: /^\/blocks\/[0-9a-f-]{36}$/,
  'weather-stations': /^\/weather\/[0-9a-f-]{36}$/,
  sprays: /^\/sprays\/[0-9a-f-]{36}$/,
  requests: /^\/requests\/[0-9a-f-]{36}$/,
  agreements: /^\/agreements\/[0-9a-f-]{36}$/,
  placements: /^\/placements\/[0-9a-f-]{36}$/,
  invoices: /^\/invoices\/[0-9a-f-]{36}$/,
};

describe('words on every page, for every demo role', () => {
  let t: TestApp;
  let browser: Browser;

  beforeAll(async () => {
    t = await startTestApp();
    await seedScenario(new Date());
    browser = await launchBrowser();
  }, 120_000);
  afterAll(async () => {
    await browser?.close();
    await t?.stop();
  });

  /** Waits for the page's heading, then (a few seconds at most) for its loading skeletons to go. */
  async function settled(page: Page) {
    await expect.poll(() => page.locator('h1').first().isVisible(), { timeout: 30_000 }).toBe(true);
    await page.locator('.pp-loading').first().waitFor({ state: 'detached', timeout: 8_000 }).catch(() => undefined);
  }

  /**
   * Follows a link inside the app, as a person does (no page reload), and waits for the
   * page it leads to: the URL, then a heading the previous page did not have.
   */
  async function follow(page: Page, link: string, path: string) {
    await page.evaluate(() => document.querySelectorAll('h1').forEach((h) => h.setAttribute('data-left', '')));
    await page.locator(link).first().click();
    await page.waitForURL((url) => url.pathname === path);
    await expect.poll(() => page.locator('h1:not([data-left])').first().isVisible(), { timeout: 30_000 }).toBe(true);
    await page.locator('.pp-loading').first().waitFor({ state: 'detached', timeout: 8_000 }).catch(() => undefined);
  }

  async function check(page: Page, where: string, problems: string[]) {
    for (const found of await codeLikeText(page)) problems.push(`${where}: ${found}`);
  }

  const mainPages = {
    grower: ['/', '/blocks', '/sprays', '/requests', '/agreements', '/placements', '/alerts', '/invoices', '/season/timeline', '/season/map'],
    beekeeper: ['/', '/requests', '/agreements', '/placements', '/yards', '/alerts', '/invoices', '/season/timeline', '/season/map'],
  };

  /**
   * Keeps a screenshot of a main page at the window's width, after checking that nothing is
   * wider than the window.
   */
  async function keepScreenshot(page: Page, role: string, path: string, size: string) {
    await page.evaluate(() => document.fonts.ready);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow, `${role} ${path} at ${size} width is wider than the window`).toBeLessThanOrEqual(1);
    await saveScreenshot(page, `words-${role}-${path === '/' ? 'home' : path.slice(1).replace(/\//g, '-')}-${size}`);
  }

  for (const role of roles) {
    it(`${role.name}: no code-like words on any page or dialog`, { timeout: 360_000 }, async () => {
      const { page, consoleErrors, externalRequests } = await openWatchedPage(browser);
      await signInThroughPage(page, t.baseUrl, role.email);
      await settled(page);
      await expect.poll(() => page.locator('nav[aria-label="Main"] a[data-nav]').count(), { timeout: 30_000 }).toBeGreaterThan(1);
      const entries = await page.locator('nav[aria-label="Main"] a[data-nav]').evaluateAll((links) =>
        links.map((a) => ({ name: a.getAttribute('data-nav')!, path: new URL((a as HTMLAnchorElement).href).pathname })));
      expect(entries.length).toBeGreaterThan(1);
      const problems: string[] = [];

      // The grower's and the beekeeper's main pages are kept at desktop width on the way.
      const shots: string[] = role.screenshots ? [...mainPages[role.name as keyof typeof mainPages]] : [];
      const shoot = async (path: string) => {
        if (!shots.includes(path)) return;
        shots.splice(shots.indexOf(path), 1);
        await keepScreenshot(page, role.name, path, 'desktop');
      };
      for (const entry of entries) {
        if (new URL(page.url()).pathname !== entry.path) await follow(page, `nav[aria-label="Main"] a[data-nav="${entry.name}"]`, entry.path);
        await shoot(entry.path);
        if (entry.name === 'season-timeline') await page.getByText('Timeline as a list').click();
        await check(page, entry.path, problems);
        const recordPath = firstRecord[entry.name];
        if (recordPath) {
          const hrefs = await page.locator('main a[href]').evaluateAll((links) => links.map((a) => new URL((a as HTMLAnchorElement).href).pathname));
          const record = hrefs.find((h) => recordPath.test(h));
          if (record) {
            await follow(page, `main a[href="${record}"]`, record);
            await check(page, record, problems);
          }
        }
      }

      for (const path of [...shots]) {
        await page.goto(`${t.baseUrl}${path}`);
        await settled(page);
        await shoot(path);
      }

      // The preferences dialog, from the top bar's account menu.
      await page.getByRole('button', { name: /^Account menu for / }).click();
      const preferences = page.getByRole('menuitem', { name: /preferences/i });
      if (await preferences.count()) await preferences.first().click();
      await expect.poll(() => page.getByRole('dialog').count(), { timeout: 10_000 }).toBeGreaterThan(0);
      await check(page, 'preferences dialog', problems);

      expect(problems).toEqual([]);
      expect(consoleErrors).toEqual([]);
      expect(externalRequests).toEqual([]);
    });
  }

  it("keeps screenshots of the grower's and the beekeeper's main pages at phone width", { timeout: 420_000 }, async () => {
    for (const role of roles.filter((r) => r.screenshots)) {
      const { page, context } = await openWatchedPage(browser, { width: 360, height: 740 });
      await signInThroughPage(page, t.baseUrl, role.email);
      for (const path of mainPages[role.name as keyof typeof mainPages]) {
        await page.goto(`${t.baseUrl}${path}`);
        await settled(page);
        await keepScreenshot(page, role.name, path, 'phone');
      }
      await context.close();
    }
  });
});
