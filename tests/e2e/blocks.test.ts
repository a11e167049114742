// The grower in the browser: uploads a station's temperatures (a bad line is listed and
// skipped on request), uploads a block outline, sees its acres and colonies needed, the
// degree-day chart and the predicted stages; also at phone width.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import type { Browser } from 'playwright-core';
import { DateTime } from 'luxon';
import { writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import turfArea from '@turf/area';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { launchBrowser, openWatchedPage, signInThroughPage, saveScreenshot } from '../support/browser.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildStation } from '../support/builders/weather.js';
import { squareOutline } from '../support/builders/season.js';
import { signedInClient } from '../support/api-client.js';
import type { ChillDto } from '../../shared/schemas/weather.js';

describe('blocks and weather in the browser', () => {
  let t: TestApp;
  let browser: Browser;
  let stationId: string;
  const dir = mkdtempSync(join(tmpdir(), 'pollenpact-blocks-'));
  const start = DateTime.utc().startOf('day').minus({ days: 30 });
  const outline = squareOutline(-119.9, 44.9, 25);

  beforeAll(async () => {
    t = await startTestApp({ config: { mapTileUrl: '' } });
    const farm = await buildOrganization({ kind: 'farm', name: 'Sorrelwick Orchards' });
    await buildUser({ organization: farm, role: 'owner', email: 'owner@sorrelwick.test', name: 'Ivo Sorrelwick', units: 'imperial' });
    stationId = (await buildStation({ farm, name: 'Sorrelwick mast' })).id;
    // 30 days at 10–20 °C (16 DD°F a day over 43 °F), and one bad line (minimum above maximum).
    const lines = ['date,tmin,tmax', ...Array.from({ length: 30 }, (_, i) => `${start.plus({ days: i }).toISODate()},10,20`), `${start.plus({ days: 31 }).toISODate()},25,5`];
    writeFileSync(join(dir, 'temperatures.csv'), lines.join('\n'));
    writeFileSync(join(dir, 'outline.geojson'), JSON.stringify({ type: 'Feature', properties: { name: 'Upper bench' }, geometry: outline }));
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await t?.stop();
  });

  it('uploads temperatures and a block outline, then shows acres, colonies needed, the chart and predicted stages', async () => {
    const { page, consoleErrors, externalRequests } = await openWatchedPage(browser);
    await signInThroughPage(page, t.baseUrl, 'owner@sorrelwick.test');

    await page.goto(`${t.baseUrl}/weather/${stationId}`);
    await page.getByRole('heading', { name: 'Sorrelwick mast' }).waitFor();
    await page.getByLabel('Temperature file (CSV)').setInputFiles(join(dir, 'temperatures.csv'));
    await page.getByRole('radio', { name: '°C' }).or(page.getByRole('button', { name: '°C' })).first().click();
    await page.getByRole('button', { name: 'Upload', exact: true }).click();
    const errors = page.getByRole('table', { name: 'Lines with errors' });
    await errors.waitFor();
    expect(await errors.getByRole('row').nth(1).innerText()).toMatch(/32\s+tmin\s+the minimum is above the maximum/);
    await page.getByRole('button', { name: 'Skip these 1 lines and save the rest' }).click();
    await expect.poll(() => page.getByTestId('upload-result').innerText()).toMatch(/Saved 30 days; skipped 1 bad lines/);

    await page.goto(`${t.baseUrl}/blocks`);
    await page.getByText('No blocks yet').waitFor();
    await page.getByRole('button', { name: 'Add a block' }).first().click();
    await page.getByLabel('Block name').fill('Upper bench');
    await page.getByLabel('Upload an outline (GeoJSON)').setInputFiles(join(dir, 'outline.geojson'));
    await expect.poll(() => page.getByTestId('outline-status').innerText()).toMatch(/4 corners/);
    await page.locator('#block-station').click();
    await page.getByRole('option', { name: 'Sorrelwick mast' }).click();
    await page.getByLabel('Degree days from (start date or biofix)').fill(start.toISODate()!);
    await page.getByRole('button', { name: 'Save block' }).click();

    await page.getByRole('heading', { name: 'Upper bench' }).waitFor();
    // Source: @turf/area (general-purpose geodesic area); 1 acre = 4,046.8564224 m² (NIST Handbook 44).
    const acres = turfArea({ type: 'Feature', properties: {}, geometry: outline }) / 4046.8564224;
    const shownAcres = await page.getByTestId('block-area').innerText();
    expect(shownAcres).toMatch(/^\d+\.\d ac$/);
    expect(Math.abs(parseFloat(shownAcres) - acres)).toBeLessThanOrEqual(0.05 + acres * 0.005); // shown to 0.1, within 0.5%
    // Apple default 1.5 colonies per acre (Project Apis m. range 1–2); rounded up.
    expect(await page.getByTestId('block-colonies').innerText()).toBe(String(Math.ceil(acres * 1.5)));
    await page.getByRole('img', { name: /Accumulated degree days \(°F\)/ }).waitFor();
    expect(await page.getByTestId('dd-to-date').innerText()).toBe('480');
    // Green tip 100–120 DD°F (Cornell/UMass): 16 a day reaches 100 on day 7.
    const greenTip = page.locator('tr[data-stage="green-tip"]');
    expect(await greenTip.innerText()).toContain(start.plus({ days: 6 }).toFormat('d LLL yyyy'));
    expect(await page.getByTestId('forecast-extension').innerText()).toMatch(/Dashed: estimated/);
    // 480 DD°F is past apple petal fall (439–523 DD°F, Cornell / UMass): frost risk uses WSU's "Post bloom" row,
    // 10% kill 28 °F, 90% kill 25 °F (WSU Extension EB0913 via Penn State Extension).
    expect(await page.getByTestId('frost-stage').innerText()).toMatch(/Stage Petal fall uses the row Post bloom: 10% of buds killed at 28 °F, 90% at 25 °F/);
    expect(await page.getByTestId('frost-risk').innerText()).toMatch(/Critical temperatures: WSU Extension.*Stage: Cornell/s);
    await saveScreenshot(page, 'block-detail-desktop');

    await page.setViewportSize({ width: 360, height: 800 });
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(1);
    await saveScreenshot(page, 'block-detail-phone');

    // The one 400 is the server's answer to the file with a bad line, which the page lists.
    expect(consoleErrors.filter((e) => !/status of 400 \(Bad Request\)/.test(e))).toEqual([]);
    expect(consoleErrors.filter((e) => /status of 400/.test(e))).toHaveLength(1);
    expect(externalRequests).toEqual([]);
  });

  it('names on the chill chart the day Utah chill counting starts', async () => {
    // Source: Richardson, Seeley & Walker 1974, HortScience 9:331–332 (Utah model): counted from the fall's most
    // negative running total, searched from September 1 (from memory of the paper); the API computes the day.
    const owner = await signedInClient(t.app, 'owner@sorrelwick.test');
    const chill = (await owner.get(`/api/weather/stations/${stationId}/chill`).expect(200)).body.chill as ChillDto;
    const { page, consoleErrors, externalRequests } = await openWatchedPage(browser);
    await signInThroughPage(page, t.baseUrl, 'owner@sorrelwick.test');
    await page.goto(`${t.baseUrl}/weather/${stationId}`);
    const caption = page.getByTestId('chill-start');
    await caption.waitFor();
    expect(await caption.innerText()).toMatch(new RegExp(`^Counted from ${DateTime.fromISO(chill.from).toFormat('d LLL yyyy')}\\. .*most negative`));
    if (chill.series.length) await page.getByRole('img', { name: `Utah chill units counted from ${DateTime.fromISO(chill.from).toFormat('d LLL yyyy')}`, exact: false }).waitFor();
    expect(externalRequests).toEqual([]);
    expect(consoleErrors).toEqual([]);
  });
});
