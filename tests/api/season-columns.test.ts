// The season tables' PostGIS and tstzrange columns through the app's own models on a real
// PostgreSQL + PostGIS: points go in as GeoJSON and come back as the same plain GeoJSON,
// half-open time windows (an open end included) come back as Dates with their bounds.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { buildOrganization } from '../support/builders/accounts.js';
import { rangeBounds, timeRange } from '../../server/src/db/time-range.js';
import { plainGeoJson } from '../../server/src/db/geojson.js';

describe('season columns through the models', () => {
  let t: TestApp;
  beforeAll(async () => { t = await startTestApp(); });
  afterAll(async () => { await t?.stop(); });

  it('keeps a yard point exactly, read back without a crs member', async () => {
    const apiary = await buildOrganization({ kind: 'apiary' });
    const location = { type: 'Point' as const, coordinates: [-120.512345678, 46.6012345] as [number, number] };
    const yard = await t.context.models.Yard.create({ apiaryId: apiary.id, name: 'East bench', location, colonies: 200, notes: null });
    const read = await t.context.models.Yard.findByPk(yard.id, { rejectOnEmpty: true });
    expect(plainGeoJson(read.location)).toEqual(location);
    // The database holds it as SRID 4326 (WGS 84), as the GiST-indexed distance search expects.
    const [row] = (await t.context.sequelize.query('SELECT ST_SRID(location) AS srid FROM yards WHERE id = $1', { bind: [yard.id], plain: false }))[0] as Array<{ srid: number }>;
    expect(row.srid).toBe(4326);
  });

  it('writes a window [from, to) and an open-ended one [from, ) and reads both back as Dates', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    const from = '2027-04-10T07:00:00.000Z';
    const to = '2027-05-01T07:00:00.000Z';
    const request = await t.context.models.HiveRequest.create({
      farmId: farm.id, title: 'Window check', coloniesRequested: 10, minFramesOfBees: 6, minFramesOfBrood: null, arriveRule: 'date', arriveBloomPercent: null,
      arriveOn: '2027-04-10', departRule: 'date', departOn: '2027-04-30', expectedOnSite: timeRange(from, to), pricePerColonyCents: 18_500, respondBy: null, notes: null, createdBy: null,
    });
    const read = await t.context.models.HiveRequest.findByPk(request.id, { rejectOnEmpty: true });
    expect(read.expectedOnSite![0].value).toBeInstanceOf(Date);
    expect(read.expectedOnSite!.map((b) => b.inclusive)).toEqual([true, false]);
    expect(rangeBounds(read.expectedOnSite)).toEqual({ from, to });
    // PostgreSQL itself sees the half-open range: the upper bound is not in it.
    const [inside] = (await t.context.sequelize.query('SELECT $2::timestamptz <@ expected_on_site AS upper_in, $3::timestamptz <@ expected_on_site AS lower_in FROM hive_requests WHERE id = $1', { bind: [request.id, to, from] }))[0] as Array<{ upper_in: boolean; lower_in: boolean }>;
    expect(inside).toEqual({ upper_in: false, lower_in: true });

    await read.update({ expectedOnSite: timeRange(from, null) });
    const open = await t.context.models.HiveRequest.findByPk(request.id, { rejectOnEmpty: true });
    expect(rangeBounds(open.expectedOnSite)).toEqual({ from, to: null });
  });
});
