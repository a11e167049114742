// Blocks: outlines checked by PostGIS, acreage computed on the sphere (checked against
// @turf/area), stocking and colonies needed, and farm scoping (another farm gets 404).
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import turfArea from '@turf/area';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildStation } from '../support/builders/weather.js';
import type { BlockDto } from '../../shared/schemas/blocks.js';
import type { GeoPolygon } from '../../shared/schemas/common.js';

// An irregular five-sided orchard block in an invented valley (about 30 acres).
const orchardOutline: GeoPolygon = {
  type: 'Polygon',
  coordinates: [[[-119.912, 44.901], [-119.905, 44.9008], [-119.9042, 44.9045], [-119.909, 44.906], [-119.9125, 44.9041], [-119.912, 44.901]]],
};
const bowTie: GeoPolygon = {
  type: 'Polygon',
  coordinates: [[[-119.9, 44.9], [-119.89, 44.91], [-119.89, 44.9], [-119.9, 44.91], [-119.9, 44.9]]],
};

describe('/api/blocks', () => {
  let t: TestApp;
  let grower: ApiClient;
  let otherGrower: ApiClient;
  let viewer: ApiClient;
  let keeper: ApiClient;
  let stationId: string;

  beforeAll(async () => {
    t = await startTestApp();
    const farm = await buildOrganization({ kind: 'farm', name: 'Quillfeather Orchards' });
    const other = await buildOrganization({ kind: 'farm', name: 'Bramblecote Fruit' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Ambergate Apiaries' });
    await buildUser({ organization: farm, role: 'owner', email: 'owner@quill.test' });
    await buildUser({ organization: farm, role: 'viewer', email: 'viewer@quill.test' });
    await buildUser({ organization: other, role: 'owner', email: 'owner@bramble.test' });
    await buildUser({ organization: apiary, role: 'owner', email: 'owner@amber.test' });
    stationId = (await buildStation({ farm, name: 'Quill north mast' })).id;
    grower = await signedInClient(t.app, 'owner@quill.test');
    otherGrower = await signedInClient(t.app, 'owner@bramble.test');
    viewer = await signedInClient(t.app, 'viewer@quill.test');
    keeper = await signedInClient(t.app, 'owner@amber.test');
  });
  afterAll(async () => { await t?.stop(); });

  it('computes the acreage of an outline within 0.5% of an independent geodesic computation', async () => {
    const res = await grower.post('/api/blocks', { name: 'Five-sided Gala', crop: 'apple', variety: 'Gala', outline: orchardOutline, weatherStationId: stationId });
    expect(res.status).toBe(201);
    const block: BlockDto = res.body.block;
    // Source: @turf/area 7 (Turf.js, a general-purpose geospatial library): geodesic area on a sphere, m².
    const expectedM2 = turfArea({ type: 'Feature', properties: {}, geometry: orchardOutline });
    expect(Math.abs(block.areaM2 - expectedM2) / expectedM2).toBeLessThan(0.005);
    // Source: NIST Handbook 44, Appendix C: 1 acre = 4,046.8564224 m².
    expect(block.acres).toBeCloseTo(block.areaM2 / 4046.8564224, 9);
    expect(block.areaSource).toBe('outline');
    expect(block.location?.type).toBe('Point');
    expect(block.weatherStationName).toBe('Quill north mast');
    // Apple default rate 1.5 colonies/acre (middle of 1–2, Project Apis m.); needed = ceil(acres x rate).
    expect(block.coloniesPerAcre).toBe(1.5);
    expect(block.coloniesNeeded).toBe(Math.ceil(block.acres * 1.5));
    expect(block.stocking).toMatchObject({ min: 1, max: 2, advice: 'within-range' });
    expect(block.stocking.source).toMatch(/Project Apis m\./);
  });

  it('lists each block as it reads alone, its outline to the last digit the map drew', async () => {
    // Coordinates as a web map gives them, with every digit of a double.
    const drawn: GeoPolygon = {
      type: 'Polygon',
      coordinates: [[[-119.93173217773439, 44.91234567890123], [-119.92481231689453, 44.911785125732422], [-119.92576599121094, 44.916954040527344],
        [-119.93173217773439, 44.91234567890123]]],
    };
    const created = await grower.post('/api/blocks', { name: 'Drawn Honeycrisp', crop: 'apple', outline: drawn, weatherStationId: stationId }).expect(201);
    const alone = (await grower.get(`/api/blocks/${created.body.block.id}`).expect(200)).body.block as BlockDto;
    expect(alone.outline).toEqual(drawn);
    const listed = ((await grower.get('/api/blocks').expect(200)).body.blocks as BlockDto[]).find((b) => b.id === alone.id);
    expect(listed).toEqual(alone);
  });

  it('refuses a self-intersecting outline with a 400 naming the outline, and stores nothing', async () => {
    const res = await grower.post('/api/blocks', { name: 'Bow tie', crop: 'pear', outline: bowTie });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.outline).toMatch(/not a valid polygon: .*cross itself/);
    const list = await grower.get('/api/blocks').expect(200);
    expect(list.body.blocks.map((b: BlockDto) => b.name)).not.toContain('Bow tie');
  });

  it('refuses a ring that does not close, and a block with neither outline nor acreage', async () => {
    const open = await grower.post('/api/blocks', { name: 'Open ring', crop: 'pear', outline: { type: 'Polygon', coordinates: [[[-119.9, 44.9], [-119.89, 44.9], [-119.89, 44.91], [-119.9, 44.91]]] } });
    expect(open.status).toBe(400);
    expect(Object.keys(open.body.error.fields)[0]).toMatch(/^outline/);
    const none = await grower.post('/api/blocks', { name: 'Nothing', crop: 'pear' });
    expect(none.status).toBe(400);
    expect(none.body.error.fields.enteredAcres).toMatch(/outline|acreage/);
  });

  it('takes an entered acreage without an outline and warns when the rate is outside the crop range', async () => {
    const res = await grower.post('/api/blocks', { name: 'River pears', crop: 'pear', enteredAcres: 12.5, coloniesPerAcre: 5 });
    expect(res.status).toBe(201);
    const block: BlockDto = res.body.block;
    expect(block.areaSource).toBe('entered');
    expect(block.acres).toBeCloseTo(12.5, 9);
    // Source: Project Apis m. best-practice summary: pear 2–4 colonies per acre.
    expect(block.stocking).toMatchObject({ min: 2, max: 4, advice: 'above-range' });
    expect(block.coloniesNeeded).toBe(63); // ceil(12.5 x 5 = 62.5)
  });

  it('gives the same colonies needed on the block page and the season overview (12.3333334 acres at 3 per acre)', async () => {
    const res = await grower.post('/api/blocks', { name: 'Third bench', crop: 'apple', enteredAcres: 12.3333334, coloniesPerAcre: 3 }).expect(201);
    // 12.3333334 x 3 = 37.0000002: 37 colonies, the product rounded to a millionth of a colony before rounding up
    // (acres x rate, rounded up, and the tolerance: common practice, no source).
    expect(res.body.block.coloniesNeeded).toBe(37);
    const overview = (await grower.get('/api/dashboard/grower').expect(200)).body;
    const row = overview.blocks.find((b: { id: string }) => b.id === res.body.block.id);
    expect(row.coloniesNeeded).toBe(37);
    await grower.delete(`/api/blocks/${res.body.block.id}`).expect(204);
  });

  it('changes a block, recomputing acreage from a new outline', async () => {
    const created = (await grower.post('/api/blocks', { name: 'Changing block', crop: 'apple', enteredAcres: 3 }).expect(201)).body.block as BlockDto;
    const patched = await grower.patch(`/api/blocks/${created.id}`, { outline: orchardOutline, coloniesPerAcre: 2 });
    expect(patched.status).toBe(200);
    expect(patched.body.block.areaSource).toBe('outline');
    expect(patched.body.block.acres).toBeGreaterThan(20);
    expect(patched.body.block.enteredAcres).toBeNull();
    const bad = await grower.patch(`/api/blocks/${created.id}`, { outline: bowTie });
    expect(bad.status).toBe(400);
    const after = await grower.get(`/api/blocks/${created.id}`).expect(200);
    expect(after.body.block.acres).toBeCloseTo(patched.body.block.acres, 9); // nothing stored was lost
  });

  it('refuses a duplicate name with 409 naming the field, and another farm\'s station with 400', async () => {
    const dup = await grower.post('/api/blocks', { name: 'River pears', crop: 'pear', enteredAcres: 1 });
    expect(dup.status).toBe(409);
    expect(dup.body.error.fields.name).toBeTruthy();
    const foreign = await otherGrower.post('/api/blocks', { name: 'Borrowed station', crop: 'apple', enteredAcres: 2, weatherStationId: stationId });
    expect(foreign.status).toBe(400);
    expect(foreign.body.error.fields.weatherStationId).toBeTruthy();
  });

  it('lets another farm neither read nor change nor remove the block (404)', async () => {
    const block = (await grower.get('/api/blocks').expect(200)).body.blocks[0] as BlockDto;
    expect((await otherGrower.get(`/api/blocks/${block.id}`)).status).toBe(404);
    expect((await otherGrower.patch(`/api/blocks/${block.id}`, { name: 'Taken' })).status).toBe(404);
    expect((await otherGrower.delete(`/api/blocks/${block.id}`)).status).toBe(404);
    expect((await otherGrower.get(`/api/blocks/${block.id}/forecast`)).status).toBe(404);
    expect((await otherGrower.post(`/api/blocks/${block.id}/bloom-windows`, { bloomStart: '2027-04-10', petalFall: '2027-04-25' })).status).toBe(404);
    expect((await otherGrower.get('/api/blocks')).body.blocks).toEqual([]);
    const still = await grower.get(`/api/blocks/${block.id}`).expect(200);
    expect(still.body.block.name).toBe(block.name);
  });

  it('lets a farm viewer read but not change blocks, and keeps beekeepers out (403)', async () => {
    expect((await viewer.get('/api/blocks')).status).toBe(200);
    expect((await viewer.post('/api/blocks', { name: 'Viewer block', crop: 'apple', enteredAcres: 1 })).status).toBe(403);
    expect((await keeper.get('/api/blocks')).status).toBe(403);
  });

  it('removes a block', async () => {
    const created = (await grower.post('/api/blocks', { name: 'Short-lived', crop: 'cranberry', enteredAcres: 4 }).expect(201)).body.block as BlockDto;
    expect((await grower.delete(`/api/blocks/${created.id}`)).status).toBe(204);
    expect((await grower.get(`/api/blocks/${created.id}`)).status).toBe(404);
  });
});

describe('GET /api/meta', () => {
  let t: TestApp;
  beforeAll(async () => { t = await startTestApp({ config: { mapTileUrl: '' } }); });
  afterAll(async () => { await t?.stop(); });

  it('gives the map tile URL (empty: no base layer) without signing in', async () => {
    const { default: request } = await import('supertest');
    const res = await request(t.app).get('/api/meta');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ mapTileUrl: '', mapAttribution: '' });
  });
});
