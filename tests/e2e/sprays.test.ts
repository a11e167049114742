// In the browser: the applicator plans a spray during bloom next to placed colonies and sees
// the conflicts before saving; the beekeeper, signed in in a second browser, sees the alert
// arrive without reloading and answers it; the grower sees the answer.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser } from 'playwright-core';
import { DateTime } from 'luxon';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { launchBrowser, openWatchedPage, signInThroughPage, saveScreenshot, watchFor } from '../support/browser.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildSignedSeason } from '../support/builders/season.js';
import { buildDailyTemperatures, buildStation } from '../support/builders/weather.js';
import { signedInClient } from '../support/api-client.js';
import type { PestTimingDto } from '../../shared/schemas/pests.js';
import { queueNames } from '../../server/src/jobs/queue-names.js';

const DAY = 86_400_000;
// Pages load slowly on a busy machine: give each wait a generous limit.
const slow = { timeout: 15_000 };

describe('spray plans and live alerts in the browser', () => {
  let t: TestApp;
  let browser: Browser;
  const zone = 'America/Los_Angeles';
  const now = new Date();
  let blockId: string;
  let farmId: string;

  beforeAll(async () => {
    t = await startTestApp();
    const farm = await buildOrganization({ kind: 'farm', name: 'Larchmont Bench Orchard', timeZone: zone });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Goldthread Apiaries' });
    await buildUser({ organization: farm, role: 'owner', email: 'grower@sprays-e2e.test', name: 'Ada Grower' });
    await buildUser({ organization: farm, role: 'applicator', email: 'applicator@sprays-e2e.test', name: 'Ivo Applicator' });
    await buildUser({ organization: apiary, role: 'owner', email: 'keeper@sprays-e2e.test', name: 'Bea Keeper' });
    const season = await buildSignedSeason({
      farm, apiary, colonies: 24, onSite: { from: new Date(now.getTime() - DAY), to: new Date(now.getTime() + 20 * DAY) },
      bloom: { bloomStart: new Date(now.getTime() - 2 * DAY).toISOString().slice(0, 10), petalFall: new Date(now.getTime() + 10 * DAY).toISOString().slice(0, 10) },
    });
    await t.context.sequelize.query("UPDATE blocks SET name = 'Cedar Row' WHERE id = :id", { replacements: { id: season.block.id } });
    blockId = season.block.id;
    farmId = farm.id;
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await t?.stop();
  });

  it('raises the alert live for the beekeeper, who answers; the grower sees the answer', async () => {
    const keeper = await openWatchedPage(browser);
    // The alert publications the beekeeper's page receives over its socket.
    const raisedFrames: string[] = [];
    keeper.page.on('websocket', (ws) => ws.on('framereceived', ({ payload }) => { if (String(payload).includes('"alert:raised"')) raisedFrames.push(String(payload)); }));
    await signInThroughPage(keeper.page, t.baseUrl, 'keeper@sprays-e2e.test');
    await keeper.page.goto(`${t.baseUrl}/alerts`);
    await expect.poll(() => keeper.page.getByText('No open alerts').isVisible(), slow).toBe(true);

    const applicator = await openWatchedPage(browser);
    await signInThroughPage(applicator.page, t.baseUrl, 'applicator@sprays-e2e.test');
    const page = applicator.page;
    // The block picker fills from GET /api/blocks: wait for it before opening the picker.
    const blocksLoaded = page.waitForResponse((res) => new URL(res.url()).pathname === '/api/blocks' && res.ok(), slow);
    await page.goto(`${t.baseUrl}/sprays/new`);
    await blocksLoaded;
    await page.locator('.p-multiselect').first().click();
    await page.getByRole('option', { name: 'Cedar Row' }).click();
    await page.keyboard.press('Escape');
    const start = DateTime.now().setZone(zone).plus({ days: 3 }).set({ hour: 22, minute: 0 });
    await page.getByLabel(`Start (${zone})`).fill(start.toFormat("yyyy-LL-dd'T'HH:mm"));
    await page.getByLabel(`End (${zone})`).fill(start.plus({ hours: 2 }).toFormat("yyyy-LL-dd'T'HH:mm"));
    await page.getByLabel('Product name').fill('Codling Shield 50WP');
    await page.getByLabel('EPA registration number').fill('12-ab');
    // The dry run names the bad field next to it, and shows nothing else.
    await expect.poll(() => page.locator('#spray-epa-error').textContent(), slow).toMatch(/EPA registration number/);
    await page.getByLabel('EPA registration number').fill('1234-56');
    const conflicts = page.locator('[data-spray-conflicts]');
    await expect.poll(() => conflicts.textContent(), slow).toMatch(/Acutely toxic, in bloom, colonies on the block/);
    expect(await conflicts.textContent()).toMatch(/Goldthread Apiaries/);
    expect(await conflicts.textContent()).toMatch(/treated as\s+highly toxic/);
    expect(await conflicts.textContent()).toMatch(/label is the law/);
    await saveScreenshot(page, 'sprays-form-dry-run');
    const alertToast = watchFor(keeper.page.locator('.p-toast-message', { hasText: 'Spray alert: Acutely toxic, in bloom, colonies on the block' }));
    await page.getByRole('button', { name: 'Save the plan' }).click();
    await page.waitForURL(/\/sprays\/[0-9a-f-]{36}$/);
    await expect.poll(() => page.locator('[data-spray-state]').textContent(), slow).toBe('Planned');

    // The beekeeper's page was not reloaded: the bell and the list update live, with a toast.
    await expect.poll(() => keeper.page.locator('[data-alert-count]').textContent(), slow).toBe('1');
    expect(await alertToast).toBe(true); // watched from before the save: the toast leaves after eight seconds
    const card = keeper.page.locator('[data-alert-card]').first();
    await expect.poll(() => card.textContent(), slow).toMatch(/Codling Shield 50WP on Cedar Row/);
    expect(await card.textContent()).toMatch(/licensed applicator/);
    await saveScreenshot(keeper.page, 'sprays-alert-arrived');

    // The queue delivers a publication at least once: the same revision sent again reaches
    // the page, which drops it (one card, one unseen, no second toast).
    expect(raisedFrames).toHaveLength(1);
    const alertId = (await t.context.models.Alert.findOne({ where: { farmId }, rejectOnEmpty: true })).id;
    expect(raisedFrames[0]).toContain(alertId);
    await keeper.page.evaluate(() => {
      const added = { toasts: 0 };
      (window as unknown as { addedToasts: typeof added }).addedToasts = added;
      new MutationObserver((changes) => {
        for (const change of changes) for (const node of change.addedNodes) if (node instanceof HTMLElement && node.matches('.p-toast-message')) added.toasts++;
      }).observe(document.body, { childList: true, subtree: true });
    });
    await t.context.jobs.send(queueNames.alertPublish, { alertId, event: 'alert:raised' });
    await expect.poll(() => raisedFrames.length, slow).toBe(2);
    await keeper.page.waitForTimeout(500);
    expect(await keeper.page.evaluate(() => (window as unknown as { addedToasts: { toasts: number } }).addedToasts.toasts)).toBe(0);
    expect(await keeper.page.locator('[data-alert-card]').count()).toBe(1);
    expect(await keeper.page.locator('[data-alert-count]').textContent()).toBe('1');
    await card.locator('.p-select').click();
    await keeper.page.getByRole('option', { name: 'We will close the colonies in for the spray' }).click();
    await card.getByLabel('Note (optional)').fill('Closing at dusk');
    await card.getByRole('button', { name: 'Send answer' }).click();
    await expect.poll(() => card.locator('[data-alert-state]').textContent(), slow).toBe('Answered');

    const grower = await openWatchedPage(browser);
    await signInThroughPage(grower.page, t.baseUrl, 'grower@sprays-e2e.test');
    await grower.page.goto(`${t.baseUrl}/alerts`);
    const growerCard = grower.page.locator('[data-alert-card]').first();
    await expect.poll(() => growerCard.locator('[data-alert-answer]').textContent(), slow).toMatch(/Goldthread Apiaries:\s*We will close the colonies in for the spray — “Closing at dusk”/);
    await saveScreenshot(grower.page, 'sprays-grower-sees-answer');

    for (const watched of [keeper, applicator, grower]) {
      expect(watched.externalRequests).toEqual([]);
      expect(watched.consoleErrors.filter((e) => !/status of 400/.test(e))).toEqual([]);
    }
  });

  it('shows this season\'s codling moth timing with suggested cover-spray days marked against bloom and colonies', async () => {
    // 60–80 °F days: 20 DD°F a day over 50 °F (single sine; UC IPM, Zalom et al. 1983). Catches on two successive
    // checks set the biofix (MSU Enviroweather codling moth model; Jones, Doerr & Brunner 2008), two days ago but
    // never before 1 January, so the checks stay in this season; egg hatch is then predicted from normals.
    const today = DateTime.now().setZone(zone).startOf('day');
    const biofix = DateTime.max(today.minus({ days: 2 }), today.startOf('year'));
    const station = await buildStation({ farm: { id: farmId }, name: 'Cedar Row mast', timeZone: zone });
    await t.context.sequelize.query('UPDATE blocks SET weather_station_id = :station WHERE id = :blockId', { replacements: { station: station.id, blockId } });
    await buildDailyTemperatures({ station, days: Array.from({ length: 31 }, (_, i) => ({ day: today.minus({ days: 30 - i }).toISODate()!, tminC: 15.5555556, tmaxC: 26.6666667 })) });
    const grower = await signedInClient(t.app, 'grower@sprays-e2e.test');
    for (const [day, moths] of [[biofix, 2], [biofix.plus({ days: 1 }), 3]] as const) {
      await grower.post('/api/pests/trap-counts', { blockId, pestModelId: 'codling-moth', checkedOn: day.toISODate(), moths }).expect(201);
    }
    const expected = (await grower.get(`/api/pests/timing?blockId=${blockId}`).expect(200)).body.timing as PestTimingDto;
    expect(expected.suggestedSprayDays.length).toBeGreaterThan(0);

    const { page, consoleErrors, externalRequests } = await openWatchedPage(browser);
    await signInThroughPage(page, t.baseUrl, 'grower@sprays-e2e.test');
    await page.goto(`${t.baseUrl}/sprays`);
    const card = page.getByTestId('suggested-spray-days');
    await expect.poll(() => card.locator('li[data-day]').count(), { timeout: 40_000 }).toBe(expected.suggestedSprayDays.length);
    for (const d of expected.suggestedSprayDays) {
      const text = await card.locator(`li[data-day="${d.day}"]`).innerText();
      expect(text.includes('in bloom')).toBe(d.duringBloom);
      expect(text.includes('colonies on site')).toBe(d.coloniesOnSite);
    }
    expect(expected.suggestedSprayDays.some((d) => d.coloniesOnSite)).toBe(true); // colonies stay 20 days
    expect(await card.innerText()).toMatch(/label is the law.*licensed applicator/s);
    expect(await page.locator('#pp-pest-title').locator('..').innerText()).toContain(`Biofix ${biofix.toFormat('d LLL yyyy')}`);
    await saveScreenshot(page, 'sprays-pest-timing');
    expect(externalRequests).toEqual([]);
    expect(consoleErrors).toEqual([]);
  });

  it('pre-fills the trap check with today at the farm on a US evening, not the UTC date', async () => {
    // 20:30 in Los Angeles is 03:30 or 04:30 the next day in UTC (UTC-7 / UTC-8: IANA time zone database).
    const evening = DateTime.now().setZone(zone).minus({ days: 1 }).set({ hour: 20, minute: 30, second: 0, millisecond: 0 });
    expect(evening.toUTC().toISODate()).not.toBe(evening.toISODate());
    const { page, consoleErrors, externalRequests } = await openWatchedPage(browser);
    await signInThroughPage(page, t.baseUrl, 'grower@sprays-e2e.test');
    await page.clock.setFixedTime(evening.toJSDate());
    await page.goto(`${t.baseUrl}/sprays`);
    await page.getByLabel('Checked on').waitFor(slow);
    expect(await page.getByLabel('Checked on').inputValue()).toBe(evening.toISODate());
    expect(externalRequests).toEqual([]);
    expect(consoleErrors).toEqual([]);
  });
});
