// Weather stations: CSV upload with every bad line reported and nothing saved unless the
// user accepts skipping those lines, hand entry, forecast lows and chill units.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import type { StationDto } from '../../shared/schemas/weather.js';

const mixedCsv = [
  'date,tmin,tmax',
  '2027-03-01,34,52', // line 2 good
  '2027-03-02,36,55', // line 3 good
  '2027-02-30,35,50', // line 4 bad date
  '2027-03-03,60,48', // line 5 min above max
  '2027-03-02,37,56', // line 6 duplicate day
  '2027-03-04,35,190', // line 7 max out of range
  '2027-03-05,abc,50', // line 8 not a number
  '03/06/2027,35,50', // line 9 bad date format
  '2027-03-07,38,58', // line 10 good
].join('\n');

describe('/api/weather/stations', () => {
  let t: TestApp;
  let grower: ApiClient;
  let otherGrower: ApiClient;
  let station: StationDto;

  beforeAll(async () => {
    t = await startTestApp();
    const farm = await buildOrganization({ kind: 'farm', name: 'Wrenfield Orchards' });
    const other = await buildOrganization({ kind: 'farm', name: 'Stonemoss Farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'owner@wren.test' });
    await buildUser({ organization: other, role: 'owner', email: 'owner@stonemoss.test' });
    grower = await signedInClient(t.app, 'owner@wren.test');
    otherGrower = await signedInClient(t.app, 'owner@stonemoss.test');
    const res = await grower.post('/api/weather/stations', { name: 'Wren hill', location: { type: 'Point', coordinates: [-119.9, 44.9] }, timeZone: 'America/Los_Angeles' });
    expect(res.status).toBe(201);
    station = res.body.station;
  });
  afterAll(async () => { await t?.stop(); });

  const upload = (client: ApiClient, csv: string, fields: Record<string, string>) => {
    let req = client.agent.post(`/api/weather/stations/${station.id}/temperatures/upload`).set('X-CSRF-Token', client.csrfToken);
    for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
    return req.attach('file', Buffer.from(csv), { filename: 'temps.csv', contentType: 'text/csv' });
  };

  it('reports every bad line of a mixed file and saves nothing', async () => {
    const res = await upload(grower, mixedCsv, { unit: 'F' });
    expect(res.status).toBe(400);
    const fields = res.body.error.fields as Record<string, string>;
    expect(fields['lines.4.date']).toMatch(/not a date/);
    expect(fields['lines.5.tmin']).toMatch(/minimum is above the maximum/);
    expect(fields['lines.6.date']).toMatch(/duplicate day 2027-03-02 \(also on line 3\)/);
    expect(fields['lines.7.tmax']).toMatch(/out of range/);
    expect(fields['lines.8.tmin']).toMatch(/not a number/);
    expect(fields['lines.9.date']).toMatch(/not a date/);
    const badLines = new Set(Object.keys(fields).map((k) => Number(k.split('.')[1])));
    expect([...badLines].sort((a, b) => a - b)).toEqual([4, 5, 6, 7, 8, 9]);
    expect(res.body.error.message).toMatch(/6 lines have errors, so nothing was saved/);
    const stored = await grower.get(`/api/weather/stations/${station.id}/temperatures`).expect(200);
    expect(stored.body.temperatures).toEqual([]);
  });

  it('saves the good lines, converted to °C, when the user accepts skipping the bad ones', async () => {
    const res = await upload(grower, mixedCsv, { unit: 'F', skipBadLines: 'true' });
    expect(res.status).toBe(200);
    expect(res.body.result.saved).toBe(3);
    expect(res.body.result.skipped.map((e: { line: number }) => e.line)).toEqual([4, 5, 6, 7, 8, 9]);
    const stored = (await grower.get(`/api/weather/stations/${station.id}/temperatures`).expect(200)).body.temperatures;
    expect(stored.map((d: { day: string }) => d.day)).toEqual(['2027-03-01', '2027-03-02', '2027-03-07']);
    // Source: NIST Handbook 44, Appendix C: °C = (°F - 32) x 5/9; 34 °F = 1.111 °C, 52 °F = 11.111 °C.
    expect(stored[0].tminC).toBeCloseTo(1.1111, 3);
    expect(stored[0].tmaxC).toBeCloseTo(11.1111, 3);
  });

  it('replaces stored days from a later upload and reports how many', async () => {
    const res = await upload(grower, 'Date,Minimum,Maximum\n2027-03-01,2,10\n2027-03-08,3,12\n', { unit: 'C' });
    expect(res.status).toBe(200);
    expect(res.body.result).toEqual({ saved: 2, replaced: 1, skipped: [] });
  });

  it('refuses a file without the needed columns, or no file, naming the file', async () => {
    const noColumns = await upload(grower, 'when,low\n2027-03-01,3\n', { unit: 'C' });
    expect(noColumns.status).toBe(400);
    expect(noColumns.body.error.fields.file).toMatch(/header lacks/);
    const noFile = await grower.agent.post(`/api/weather/stations/${station.id}/temperatures/upload`).set('X-CSRF-Token', grower.csrfToken).field('unit', 'C');
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.fields.file).toBe('is required');
    const badUnit = await upload(grower, 'date,tmin,tmax\n2027-03-01,1,2\n', { unit: 'K' });
    expect(badUnit.status).toBe(400);
    expect(badUnit.body.error.fields.unit).toBeTruthy();
  });

  it('takes a hand-entered day and refuses a minimum above the maximum', async () => {
    const ok = await grower.put(`/api/weather/stations/${station.id}/temperatures/2027-03-09`, { tmin: 40, tmax: 61, unit: 'F' });
    expect(ok.status).toBe(200);
    expect(ok.body.temperature.tminC).toBeCloseTo(4.444, 2);
    const bad = await grower.put(`/api/weather/stations/${station.id}/temperatures/2027-03-10`, { tmin: 20, tmax: 10, unit: 'C' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.tmin).toMatch(/above the maximum/);
    const badDay = await grower.put(`/api/weather/stations/${station.id}/temperatures/2027-13-01`, { tmin: 1, tmax: 10, unit: 'C' });
    expect(badDay.status).toBe(400);
    expect(badDay.body.error.fields.day).toBeTruthy();
  });

  it('counts Utah chill units from the daily temperatures', async () => {
    await grower.put(`/api/weather/stations/${station.id}/temperatures/2026-12-01`, { tmin: 40, tmax: 40, unit: 'F' }).expect(200);
    const res = await grower.get(`/api/weather/stations/${station.id}/chill?from=2026-11-01`).expect(200);
    // Source: Richardson et al. 1974 (Utah model): 37–48 °F earns 1 chill unit per hour, so 24 for a day held at 40 °F.
    expect(res.body.chill.series[0]).toMatchObject({ day: '2026-12-01', units: 24 });
    expect(res.body.chill.source).toMatch(/Utah model/);
  });

  it('starts Utah chill the day after the fall total is most negative, and says so', async () => {
    // Source: Richardson, Seeley & Walker 1974, HortScience 9:331–332 (Utah model): counting starts at the fall's most
    // negative running total (from memory of the paper). Above 65 °F an hour loses 1 unit (-24 a day at 70–90 °F);
    // 37–48 °F earns 1 (24 a day at 40 °F).
    const res0 = await grower.post('/api/weather/stations', { name: 'Wren hollow', location: { type: 'Point', coordinates: [-119.8, 44.8] }, timeZone: 'America/Los_Angeles' }).expect(201);
    const hollow = res0.body.station as StationDto;
    const local = new Date(new Date().toLocaleString('en-US', { timeZone: 'America/Los_Angeles' }));
    const fall = local.getMonth() >= 8 ? local.getFullYear() : local.getFullYear() - 1; // September 1 of this winter
    const day = (n: number) => `${fall}-09-${String(n).padStart(2, '0')}`;
    for (let n = 1; n <= 4; n += 1) await grower.put(`/api/weather/stations/${hollow.id}/temperatures/${day(n)}`, { tmin: 70, tmax: 90, unit: 'F' }).expect(200);
    for (let n = 5; n <= 7; n += 1) await grower.put(`/api/weather/stations/${hollow.id}/temperatures/${day(n)}`, { tmin: 40, tmax: 40, unit: 'F' }).expect(200);
    const chill = (await grower.get(`/api/weather/stations/${hollow.id}/chill`).expect(200)).body.chill;
    expect(chill).toMatchObject({ from: day(5), searchedFrom: day(1), total: 72 });
    expect(chill.startRule).toMatch(/most negative.*Richardson/);
  });

  it('takes forecast lows from a CSV, reporting bad lines the same way', async () => {
    const csv = 'date,low\n2027-03-20,28\n2027-03-21,cold\n2027-03-20,30\n2027-03-22,31\n';
    const post = (fields: Record<string, string>) => {
      let req = grower.agent.post(`/api/weather/stations/${station.id}/forecast-lows/upload`).set('X-CSRF-Token', grower.csrfToken);
      for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
      return req.attach('file', Buffer.from(csv), { filename: 'lows.csv', contentType: 'text/csv' });
    };
    const refused = await post({ unit: 'F' });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error.fields).sort()).toEqual(['lines.3.low', 'lines.4.date']);
    expect((await grower.get(`/api/weather/stations/${station.id}/forecast-lows`).expect(200)).body.forecastLows).toEqual([]);
    const saved = await post({ unit: 'F', skipBadLines: 'true' });
    expect(saved.status).toBe(200);
    expect(saved.body.result.saved).toBe(2);
    const lows = (await grower.get(`/api/weather/stations/${station.id}/forecast-lows`).expect(200)).body.forecastLows;
    // Source: NIST Handbook 44, Appendix C: 28 °F = -2.22 °C.
    expect(lows[0]).toMatchObject({ day: '2027-03-20' });
    expect(lows[0].lowC).toBeCloseTo(-2.222, 2);
  });

  it('keeps another farm out of the station (404)', async () => {
    expect((await otherGrower.get(`/api/weather/stations/${station.id}`)).status).toBe(404);
    expect((await otherGrower.put(`/api/weather/stations/${station.id}/temperatures/2027-03-11`, { tmin: 1, tmax: 2, unit: 'C' })).status).toBe(404);
    expect((await upload(otherGrower, 'date,tmin,tmax\n2027-03-12,1,2\n', { unit: 'C' })).status).toBe(404);
    expect((await otherGrower.get('/api/weather/stations')).body.stations).toEqual([]);
  });
});
