// The defects found from outside and by the fuzz test, each pinned: a foreign closed
// request answers like a missing one; dates outside 1900-2200 and windows longer than the
// trade knows are refused with the field named (query, body, path and CSV line); uploads
// without a boundary or cut short are 400s; a whole-world or self-crossing outline is
// refused; a NUL character is refused with its field named and never stored.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildMarket, requestPayload } from '../support/builders/requests.js';
import { buildCommitment, buildRequest, buildBlock, buildAgreement, buildDropSite, buildPlacement, squareOutline } from '../support/builders/season.js';
import { buildStation } from '../support/builders/weather.js';
import { sprayInput } from '../support/builders/sprays.js';

describe('hostile input that once reached the database', () => {
  let t: TestApp;
  let m: Awaited<ReturnType<typeof buildMarket>>;
  let grower: ApiClient;
  let keeper: ApiClient;
  let keeper2: ApiClient;
  let stationId: string;
  let placementId: string;
  const fieldsOf = (res: { body: { error?: { fields?: Record<string, string> } } }) => Object.keys(res.body.error?.fields ?? {});

  beforeAll(async () => {
    t = await startTestApp({ now: () => new Date('2027-04-15T12:00:00Z') });
    m = await buildMarket();
    grower = await signedInClient(t.app, m.people.grower.email);
    keeper = await signedInClient(t.app, m.people.keeper.email);
    keeper2 = await signedInClient(t.app, m.people.keeper2.email);
    stationId = (await buildStation({ farm: m.farm })).id;
    const onSite = { from: new Date('2027-04-10T07:00:00Z'), to: new Date('2027-05-01T07:00:00Z') };
    const request = await buildRequest({ farm: m.farm, blocks: [{ block: m.block, colonies: 20 }], state: 'listed', onSite });
    const dropSite = await buildDropSite({ request, block: m.block, lon: m.lon, lat: m.lat, coloniesPlanned: 20 });
    const agreement = await buildAgreement({ commitment: await buildCommitment({ request, apiary: m.apiary, colonies: 10, state: 'accepted' }), state: 'in-force' });
    placementId = (await buildPlacement({ agreement, dropSite, coloniesPlanned: 10, deliveredAt: new Date('2027-04-11T08:00:00Z') })).id;
  }, 120_000);
  afterAll(async () => { await t?.stop(); });

  describe('a closed request of another farm', () => {
    it('answers a commitment offer with 404, exactly like a random id; the apiary that took part still hears it is closed', async () => {
      const block = await buildBlock({ farm: m.otherFarm });
      const closed = await buildRequest({ farm: m.otherFarm, blocks: [{ block, colonies: 30 }], state: 'closed', title: 'Secret cherries', onSite: { from: new Date('2027-04-10T07:00:00Z'), to: new Date('2027-05-01T07:00:00Z') } });
      await buildCommitment({ request: closed, apiary: m.apiary, colonies: 5, state: 'withdrawn' });
      const onForeign = await keeper2.post(`/api/requests/${closed.id}/commitments`, { colonies: 5 });
      const onMissing = await keeper2.post(`/api/requests/${randomUUID()}/commitments`, { colonies: 5 });
      expect(onForeign.status).toBe(404);
      expect(onForeign.body).toEqual(onMissing.body);
      expect(JSON.stringify(onForeign.body)).not.toContain('closed');
      expect((await keeper2.get(`/api/requests/${closed.id}`)).status).toBe(404);
      // The apiary that committed before may see the request, so it is told why it cannot commit again.
      const known = await keeper.post(`/api/requests/${closed.id}/commitments`, { colonies: 5 });
      expect(known.status).toBe(409);
      expect(known.body.error.message).toMatch(/closed/);
    });
  });

  describe('dates outside what the trade and PostgreSQL hold', () => {
    it('refuses year 0000 in a query, naming it', async () => {
      for (const q of ['from=0000-01-01', 'to=0000-01-01', 'from=9999-12-31']) {
        const res = await keeper.get(`/api/requests?${q}`);
        expect(res.status, q).toBe(400);
        expect(fieldsOf(res)).toEqual([q.split('=')[0]]);
      }
      const temps = await grower.get(`/api/weather/stations/${stationId}/temperatures?from=0000-01-01`);
      expect(temps.status).toBe(400);
      expect(fieldsOf(temps)).toEqual(['from']);
    });

    it('refuses year 0000 in a body and in a path segment, naming it', async () => {
      const spray = await grower.post('/api/sprays', { ...sprayInput({ blockIds: [m.block.id], startsAt: new Date('2027-04-20T05:00:00Z') }), startsAt: '0000-01-01T00:00:00Z' });
      expect(spray.status).toBe(400);
      expect(fieldsOf(spray)).toContain('startsAt');
      const day = await grower.put(`/api/weather/stations/${stationId}/temperatures/0000-01-01`, { tminC: 1, tmaxC: 10 });
      expect(day.status).toBe(400);
      expect(fieldsOf(day)).toEqual(['day']);
      const bloom = await grower.post(`/api/blocks/${m.block.id}/bloom-windows`, { bloomStart: '0000-04-01', petalFall: '0000-04-20' });
      expect(bloom.status).toBe(400);
      expect(fieldsOf(bloom)).toEqual(expect.arrayContaining(['bloomStart', 'petalFall']));
    });

    it('refuses a CSV line in year 0000 by its line, and stores nothing', async () => {
      const res = await grower.agent.post(`/api/weather/stations/${stationId}/temperatures/upload`).set('X-CSRF-Token', grower.csrfToken)
        .field('unit', 'C').attach('file', Buffer.from('date,min,max\n2027-03-01,1,10\n0000-03-02,2,11\n'), { filename: 't.csv', contentType: 'text/csv' });
      expect(res.status).toBe(400);
      expect(res.body.error.fields['lines.3.date']).toMatch(/1900 and 2200/);
      const [{ n }] = await t.context.sequelize.query<{ n: string }>('SELECT count(*) AS n FROM daily_temperatures WHERE station_id = :stationId', { replacements: { stationId }, type: QueryTypes.SELECT });
      expect(Number(n)).toBe(0);
    });

    it('refuses windows longer than the trade knows (a spray of 300 years, a request over a year, an on-site window over a year)', async () => {
      const spray = await grower.post('/api/sprays', { ...sprayInput({ blockIds: [m.block.id], startsAt: new Date('1900-01-01T00:00:00Z') }), endsAt: '2200-12-31T00:00:00Z' });
      expect(spray.status).toBe(400);
      expect(spray.body.error.fields.endsAt).toMatch(/at most 31 days/);
      const request = await grower.post('/api/requests', requestPayload(m.block.id, { arrive: { rule: 'date', on: '1901-04-01' }, depart: { rule: 'date', on: '2199-05-01' } }, m));
      expect(request.status).toBe(400);
      expect(fieldsOf(request)).toEqual(['depart.on']);
    });
  });

  describe('uploads that cannot be read', () => {
    const url = () => `/api/weather/stations/${stationId}/temperatures/upload`;
    it('answers a multipart body without a boundary with 400 naming the file', async () => {
      const res = await grower.agent.post(url()).set('X-CSRF-Token', grower.csrfToken).set('Content-Type', 'multipart/form-data').send('--x\r\nContent-Disposition: form-data; name="file"\r\n\r\nabc\r\n--x--');
      expect(res.status).toBe(400);
      expect(fieldsOf(res)).toEqual(['file']);
    });
    it('answers a multipart body cut short with 400 naming the file', async () => {
      const res = await grower.agent.post(url()).set('X-CSRF-Token', grower.csrfToken).set('Content-Type', 'multipart/form-data; boundary=cut')
        .send('--cut\r\nContent-Disposition: form-data; name="file"; filename="t.csv"\r\nContent-Type: text/csv\r\n\r\ndate,min,max\r\n2027-03-01,1,');
      expect(res.status).toBe(400);
      expect(fieldsOf(res)).toEqual(['file']);
    });
    it('answers a photo sent without a boundary with 400 naming the photo', async () => {
      const crew = await signedInClient(t.app, m.people.crew.email);
      const res = await crew.agent.post(`/api/placements/${placementId}/photos`).set('X-CSRF-Token', crew.csrfToken).set('Content-Type', 'multipart/form-data').send('abc');
      expect(res.status).toBe(400);
      expect(fieldsOf(res)).toEqual(['photo']);
    });
  });

  describe('block outlines', () => {
    const body = (outline: unknown) => ({ name: `Outline ${randomUUID().slice(0, 6)}`, crop: 'apple', outline, coloniesPerAcre: 2 });
    it('refuses a whole-world outline and one larger than a block, naming the outline', async () => {
      for (const coordinates of [[[[-180, -90], [180, -90], [180, 90], [-180, 90], [-180, -90]]], squareOutline(m.lon, m.lat, 100_000).coordinates]) {
        const res = await grower.post('/api/blocks', body({ type: 'Polygon', coordinates }));
        expect(res.status).toBe(400);
        expect(res.body.error.fields.outline).toMatch(/at most 10 km across/);
      }
    });
    it('refuses an outline that crosses itself, or has one corner', async () => {
      const d = 0.001;
      const bowTie = [[m.lon, m.lat], [m.lon + d, m.lat + d], [m.lon + d, m.lat], [m.lon, m.lat + d], [m.lon, m.lat]];
      const crossing = await grower.post('/api/blocks', body({ type: 'Polygon', coordinates: [bowTie] }));
      expect(crossing.status).toBe(400);
      expect(crossing.body.error.fields.outline).toMatch(/must not cross itself/);
      const onePoint = await grower.post('/api/blocks', body({ type: 'Polygon', coordinates: [[[m.lon, m.lat]]] }));
      expect(onePoint.status).toBe(400);
      expect(fieldsOf(onePoint).some((f) => f.startsWith('outline.coordinates'))).toBe(true);
      const ring = squareOutline(m.lon, m.lat, 40);
      expect((await grower.post('/api/blocks', body(ring))).status).toBe(201);
    });
  });

  describe('NUL characters', () => {
    it('refuses a NUL in a block name with 400 naming the name, and stores nothing', async () => {
      const before = await t.context.sequelize.query<{ n: string }>('SELECT count(*) AS n FROM blocks', { type: QueryTypes.SELECT });
      const res = await grower.post('/api/blocks', { name: 'North\u0000Galas', crop: 'apple', coloniesPerAcre: 2 });
      expect(res.status).toBe(400);
      expect(fieldsOf(res)).toEqual(['name']);
      const after = await t.context.sequelize.query<{ n: string }>('SELECT count(*) AS n FROM blocks', { type: QueryTypes.SELECT });
      expect(after[0].n).toBe(before[0].n);
      const stored = await t.context.sequelize.query<{ n: string }>("SELECT count(*) AS n FROM blocks WHERE name LIKE '%\\\\0%' OR name LIKE 'North%Galas'", { type: QueryTypes.SELECT });
      expect(Number(stored[0].n)).toBe(0);
    });
    it('refuses a NUL in a note, a nested field and a query, naming each', async () => {
      const dispute = await grower.post(`/api/placements/${placementId}/dispute`, { step: 'delivery', countedColonies: 9, note: 'one\u0000short' });
      expect(dispute.status).toBe(400);
      expect(fieldsOf(dispute)).toEqual(['note']);
      const nested = await grower.post('/api/requests', requestPayload(m.block.id, { dropSites: [{ blockId: m.block.id, name: 'Lane\u0000end', location: { type: 'Point', coordinates: [m.lon, m.lat] }, coloniesPlanned: 5 }] }, m));
      expect(nested.status).toBe(400);
      expect(fieldsOf(nested)).toEqual(['dropSites.0.name']);
      const query = await keeper.get('/api/requests?crop=app%00le');
      expect(query.status).toBe(400);
      expect(fieldsOf(query)).toEqual(['crop']);
    });
  });

  describe('other inputs the fuzz test found', () => {
    it('answers a forecast whose upper threshold is at or below the lower one with 400 naming upperF', async () => {
      const res = await grower.get(`/api/blocks/${m.block.id}/forecast?upperF=-1`);
      expect(res.status).toBe(400);
      expect(fieldsOf(res)).toEqual(['upperF']);
    });
    it('answers a body nested 100,000 levels deep with 400, not a server error', async () => {
      const res = await grower.agent.post('/api/blocks').set('X-CSRF-Token', grower.csrfToken).set('Content-Type', 'application/json').send('['.repeat(100_000) + ']'.repeat(100_000));
      expect(res.status).toBe(400);
      expect(fieldsOf(res).length).toBeGreaterThan(0);
    });
    it('names the body when it is not JSON at all', async () => {
      const res = await grower.agent.post('/api/blocks').set('X-CSRF-Token', grower.csrfToken).set('Content-Type', 'application/json').send('{"name":');
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toEqual({ body: 'is not valid JSON' });
    });
  });
});
