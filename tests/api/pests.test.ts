// Pest timing per season: the biofix and egg-hatch dates come from the farm's current season
// (its calendar year in its time zone) only, earlier seasons stay viewable, and the days a
// cover spray fits best are marked where they meet the block's bloom and colonies on site.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildSignedSeason } from '../support/builders/season.js';
import { buildDailyTemperatures, buildStation } from '../support/builders/weather.js';
import type { PestTimingDto } from '../../shared/schemas/pests.js';

// 60–80 °F every day: wholly inside 50/88 °F, so 20 DD°F a day by the single sine (UC IPM, Zalom et al. 1983).
const warmDays = (from: string, n: number) => Array.from({ length: n }, (_, i) => {
  const d = new Date(`${from}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + i);
  return { day: d.toISOString().slice(0, 10), tminC: ((60 - 32) * 5) / 9, tmaxC: ((80 - 32) * 5) / 9 };
});

describe('GET /api/pests/timing', () => {
  let t: TestApp;
  let grower: ApiClient;
  let otherGrower: ApiClient;
  let blockId: string;

  beforeAll(async () => {
    // Noon on 20 May 2027 in the farm's zone (America/Los_Angeles, UTC-7 in summer).
    t = await startTestApp({ now: () => new Date('2027-05-20T19:00:00Z'), env: { LOG_LEVEL: 'error' } });
    const farm = await buildOrganization({ kind: 'farm', name: 'Hollowmere Orchards' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Ashgrove Apiaries' });
    const other = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'grower@pests-api.test' });
    await buildUser({ organization: other, role: 'owner', email: 'other@pests-api.test' });
    const season = await buildSignedSeason({
      farm, apiary, colonies: 20,
      onSite: { from: new Date('2027-05-12T07:00:00Z'), to: new Date('2027-05-24T07:00:00Z') }, // 12–23 May, local days
      bloom: { bloomStart: '2027-05-10', petalFall: '2027-05-22' },
    });
    blockId = season.block.id;
    const station = await buildStation({ farm, name: 'Hollowmere mast' });
    await t.context.sequelize.query('UPDATE blocks SET weather_station_id = :station WHERE id = :blockId', { replacements: { station: station.id, blockId } });
    await buildDailyTemperatures({ station, days: [...warmDays('2026-04-20', 40), ...warmDays('2027-04-20', 31)] }); // through 20 May 2027
    grower = await signedInClient(t.app, 'grower@pests-api.test');
    otherGrower = await signedInClient(t.app, 'other@pests-api.test');
    const checks: Array<[string, number]> = [['2026-05-02', 2], ['2026-05-05', 4], ['2027-05-04', 0], ['2027-05-06', 1], ['2027-05-08', 3]];
    for (const [checkedOn, moths] of checks) {
      await grower.post('/api/pests/trap-counts', { blockId, pestModelId: 'codling-moth', checkedOn, moths }).expect(201);
    }
  });
  afterAll(async () => { await t?.stop(); });

  const timingOf = async (query = '') => (await grower.get(`/api/pests/timing?blockId=${blockId}${query}`).expect(200)).body.timing as PestTimingDto;

  it('takes this season\'s checks and temperatures only, last season staying viewable', async () => {
    // Source: MSU Enviroweather codling moth model; Jones, Doerr & Brunner 2008: biofix on two successive catches,
    // first egg hatch 250 DD°F, 20% egg hatch 350 DD°F after it (50/88 °F, single sine, horizontal cutoff).
    const now = await timingOf();
    expect(now).toMatchObject({ season: 2027, biofix: '2027-05-06', lastDay: '2027-05-20', hasWeather: true, seasons: [2027, 2026] });
    expect(now.degreeDaysF).toBeCloseTo(15 * 20, 6); // 6–20 May observed
    expect(now.stages[0]).toMatchObject({ name: 'First egg hatch', reachedOn: '2027-05-18', estimated: false }); // 13 x 20 = 260
    expect(now.stages[1]).toMatchObject({ name: '20% egg hatch', reachedOn: '2027-05-23', estimated: true }); // 18 x 20 = 360, on normals
    const before = await timingOf('&season=2026');
    expect(before).toMatchObject({ season: 2026, biofix: '2026-05-02' });
    expect(before.stages[0].reachedOn).toBe('2026-05-14');
  });

  it('suggests cover-spray days from first to 20% egg hatch, marked against bloom and colonies on site, with the caution', async () => {
    // Source: MSU Enviroweather codling moth model: first egg hatch (250 DD°F) to 20% egg hatch (350 DD°F) after the
    // biofix, the span sprays against hatching larvae are timed in (from memory of its spray-timing guidance).
    const { suggestedSprayDays, sprayWindowCaution } = await timingOf();
    expect(suggestedSprayDays.map((d) => d.day)).toEqual(['2027-05-18', '2027-05-19', '2027-05-20', '2027-05-21', '2027-05-22', '2027-05-23']);
    // Bloom 10–22 May; colonies on site 12–23 May (local days); days after 20 May rest on estimated temperatures.
    expect(suggestedSprayDays.map((d) => [d.duringBloom, d.coloniesOnSite, d.estimated])).toEqual([
      [true, true, false], [true, true, false], [true, true, false], [true, true, true], [true, true, true], [false, true, true],
    ]);
    expect(sprayWindowCaution).toMatch(/label is the law.*licensed applicator/);
  });

  it('refuses a season that is not a year, naming the field, and another farm\'s block with 404', async () => {
    const bad = await grower.get(`/api/pests/timing?blockId=${blockId}&season=last`).expect(400);
    expect(bad.body.error.fields).toHaveProperty('season');
    await otherGrower.get(`/api/pests/timing?blockId=${blockId}`).expect(404);
  });
});
