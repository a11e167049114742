// Hive requests: a grower asks, beekeepers see the open ones; every state change and refusal.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildMarket, requestPayload } from '../support/builders/requests.js';
import { buildBlock } from '../support/builders/season.js';

/** Great-circle distance by the haversine formula, mean Earth radius 6371.0088 km (IUGG); PostGIS measures on the WGS 84 ellipsoid, so within about 0.5%. */
function haversineKm(lon1: number, lat1: number, lon2: number, lat2: number) {
  const rad = Math.PI / 180;
  const a = Math.sin(((lat2 - lat1) * rad) / 2) ** 2 + Math.cos(lat1 * rad) * Math.cos(lat2 * rad) * Math.sin(((lon2 - lon1) * rad) / 2) ** 2;
  return 2 * 6371.0088 * Math.asin(Math.sqrt(a));
}

describe('/api/requests', () => {
  let t: TestApp;
  let m: Awaited<ReturnType<typeof buildMarket>>;
  let grower: ApiClient, keeper: ApiClient, viewer: ApiClient, otherGrower: ApiClient, crew: ApiClient;

  beforeAll(async () => {
    t = await startTestApp();
    m = await buildMarket();
    grower = await signedInClient(t.app, m.people.grower.email);
    keeper = await signedInClient(t.app, m.people.keeper.email);
    viewer = await signedInClient(t.app, m.people.farmViewer.email);
    otherGrower = await signedInClient(t.app, m.people.otherGrower.email);
    crew = await signedInClient(t.app, m.people.crew.email);
  });
  afterAll(async () => { await t?.stop(); });

  const create = async (overrides = {}) => {
    const res = await grower.post('/api/requests', requestPayload(m.block.id, overrides, m));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body.request;
  };

  describe('POST /api/requests', () => {
    it('creates a draft whose on-site window follows the bloom stage, with an audit entry', async () => {
      const r = await create();
      expect(r.state).toBe('draft');
      expect(r.coloniesRequested).toBe(60);
      // 5% of the way from 10 April to full bloom on 20 April is still 10 April; petal fall 30 April;
      // the orchard's zone is America/Los_Angeles (PDT, UTC-7).
      expect(r.expectedOnSite).toEqual({ from: '2027-04-10T07:00:00.000Z', to: '2027-05-01T07:00:00.000Z' });
      expect(r.dropSites).toHaveLength(2);
      expect(r.dropSites[0].gateCode).toBe('4471');
      expect(r.events.map((e: { action: string }) => e.action)).toEqual(['created']);
      expect(r.events[0].actorName).toBe('Gale Orrin');
    });

    it('refuses bad input with 400 naming the field', async () => {
      const bad = await grower.post('/api/requests', requestPayload(m.block.id, { blocks: [{ blockId: m.block.id, colonies: 0 }] }, m));
      expect(bad.status).toBe(400);
      expect(bad.body.error.fields).toHaveProperty(['blocks.0.colonies']);
      const price = await grower.post('/api/requests', { ...requestPayload(m.block.id, {}, m), pricePerColonyCents: 12.5 });
      expect(price.status).toBe(400);
      expect(price.body.error.fields).toHaveProperty('pricePerColonyCents');
      // Shares are stored in basis points but said as the percentages the form takes.
      const deposit = await grower.post('/api/requests', { ...requestPayload(m.block.id, {}, m), depositShareBp: 10_001, lateInterestBpPerMonth: 12.5 });
      expect(deposit.status).toBe(400);
      expect(deposit.body.error.fields).toMatchObject({ depositShareBp: 'is at most 100%', lateInterestBpPerMonth: 'must be a percentage with at most two decimals' });
    });

    it('refuses a block of another farm with 400 on blocks.0.blockId', async () => {
      const foreign = await buildBlock({ farm: m.otherFarm });
      const res = await grower.post('/api/requests', requestPayload(foreign.id, {}, m));
      expect(res.status).toBe(400);
      expect(res.body.error.fields['blocks.0.blockId']).toMatch(/not one of your blocks/);
    });

    it('asks for dates when a block has no bloom window yet', async () => {
      const bare = await buildBlock({ farm: m.farm, name: 'Young pears', crop: 'pear' });
      const res = await grower.post('/api/requests', requestPayload(bare.id, { dropSites: [] }, m));
      expect(res.status).toBe(400);
      expect(res.body.error.fields.arrive).toMatch(/no bloom window/);
      const dated = await grower.post('/api/requests', requestPayload(bare.id, { dropSites: [], arrive: { rule: 'date', on: '2027-04-01' }, depart: { rule: 'date', on: '2027-04-20' } }, m));
      expect(dated.status).toBe(201);
    });

    it('refuses a farm viewer (403), a beekeeper (403) and the signed out (401)', async () => {
      expect((await viewer.post('/api/requests', requestPayload(m.block.id, {}, m))).status).toBe(403);
      expect((await keeper.post('/api/requests', requestPayload(m.block.id, {}, m))).status).toBe(403);
      const anonymous = await (await import('../support/api-client.js')).apiClient(t.app);
      expect((await anonymous.post('/api/requests', requestPayload(m.block.id, {}, m))).status).toBe(401);
    });
  });

  describe('state changes', () => {
    it('opens a draft only with a drop site, then shows it to beekeepers with the distance from their nearest yard', async () => {
      const noSites = await create({ dropSites: [] });
      const refused = await grower.post(`/api/requests/${noSites.id}/publish`);
      expect(refused.status).toBe(400);
      expect(refused.body.error.fields).toHaveProperty('dropSites');

      const r = await create({ title: 'Open galas' });
      expect((await keeper.get(`/api/requests/${r.id}`)).status).toBe(404); // drafts stay with the farm
      const opened = await grower.post(`/api/requests/${r.id}/publish`);
      expect(opened.status).toBe(200);
      expect(opened.body.request.state).toBe('listed');
      expect((await grower.post(`/api/requests/${r.id}/publish`)).status).toBe(409);

      const list = await keeper.get('/api/requests');
      const seen = list.body.requests.find((x: { id: string }) => x.id === r.id);
      expect(seen.coloniesOpen).toBe(60);
      // Nearest point of the request is the North lane drop site at the block centre; the yard is 0.1° east.
      expect(seen.distanceKm).toBeCloseTo(haversineKm(m.lon, m.lat, m.lon + 0.1, m.lat), 0);
      expect(Math.abs(seen.distanceKm - haversineKm(m.lon, m.lat, m.lon + 0.1, m.lat)) / seen.distanceKm).toBeLessThan(0.01);

      const detail = (await keeper.get(`/api/requests/${r.id}`)).body.request;
      expect(detail.dropSites[0].gateCode).toBeNull();
      expect(detail.dropSites[0].gateCodeHidden).toBe(true);
      expect(detail.events).toEqual([]);

      const audit = (await grower.get(`/api/requests/${r.id}`)).body.request.events.map((e: { action: string }) => e.action);
      expect(audit).toEqual(['created', 'opened']);
      const mail = t.sink.messages.filter((msg) => msg.subject.includes('Open galas'));
      await expect.poll(() => t.sink.messages.some((msg) => msg.subject === 'New hive request: Open galas' && msg.to.includes(m.people.keeper.email)), { timeout: 10_000 }).toBe(true);
      expect(mail.every((msg) => !msg.text.includes('4471'))).toBe(true);
    });

    it('filters open requests by crop, distance and dates', async () => {
      const r = await create({ title: 'Filter me' });
      await grower.post(`/api/requests/${r.id}/publish`).expect(200);
      const ids = async (query: string) => (await keeper.get(`/api/requests${query}`)).body.requests.map((x: { id: string }) => x.id);
      expect(await ids('?crop=apple')).toContain(r.id);
      expect(await ids('?crop=pear')).not.toContain(r.id);
      expect(await ids('?maxDistanceKm=20')).toContain(r.id);
      expect(await ids('?maxDistanceKm=2')).not.toContain(r.id);
      expect(await ids('?from=2027-04-15&to=2027-04-16')).toContain(r.id);
      expect(await ids('?from=2027-06-01')).not.toContain(r.id);
      const bad = await keeper.get('/api/requests?maxDistanceKm=far');
      expect(bad.status).toBe(400);
      expect(bad.body.error.fields).toHaveProperty('maxDistanceKm');
    });

    it('answers 404 to another farm and to a bad id 400', async () => {
      const r = await create();
      expect((await otherGrower.get(`/api/requests/${r.id}`)).status).toBe(404);
      expect((await otherGrower.post(`/api/requests/${r.id}/publish`)).status).toBe(404);
      expect((await grower.get('/api/requests/not-an-id')).status).toBe(400);
      expect((await otherGrower.get('/api/requests')).body.requests.map((x: { id: string }) => x.id)).not.toContain(r.id);
    });

    it('edits an open request without commitments, and refuses once colonies are committed', async () => {
      const r = await create();
      await grower.post(`/api/requests/${r.id}/publish`).expect(200);
      const edited = await grower.put(`/api/requests/${r.id}`, requestPayload(m.block.id, { title: 'Galas, renamed', pricePerColonyCents: 7500 }, m));
      expect(edited.status).toBe(200);
      expect(edited.body.request.title).toBe('Galas, renamed');
      expect(edited.body.request.state).toBe('listed');
      await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 10 }).expect(201);
      const refused = await grower.put(`/api/requests/${r.id}`, requestPayload(m.block.id, {}, m));
      expect(refused.status).toBe(409);
      expect(refused.body.error.code).toBe('wrong_state');
      const stored = (await grower.get(`/api/requests/${r.id}`)).body.request;
      expect(stored.title).toBe('Galas, renamed'); // nothing stored was lost
    });

    it('withdraws a request, releasing commitments and cancelling unconfirmed agreements', async () => {
      const r = await create();
      await grower.post(`/api/requests/${r.id}/publish`).expect(200);
      const c = (await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 20 })).body.commitment;
      const withdrawn = await grower.post(`/api/requests/${r.id}/withdraw`);
      expect(withdrawn.status).toBe(200);
      expect(withdrawn.body.request.state).toBe('withdrawn');
      expect(withdrawn.body.request.commitments[0].state).toBe('withdrawn');
      const agreement = await keeper.get(`/api/agreements/${c.agreementId}`);
      expect(agreement.body.agreement.state).toBe('cancelled');
      expect((await grower.post(`/api/requests/${r.id}/withdraw`)).status).toBe(409);
      expect((await grower.post(`/api/requests/${r.id}/close`)).status).toBe(409);
    });

    it('closes an open request so it takes no more commitments; crew may not close it', async () => {
      const r = await create();
      await grower.post(`/api/requests/${r.id}/publish`).expect(200);
      expect((await crew.post(`/api/requests/${r.id}/close`)).status).toBe(403);
      const closed = await grower.post(`/api/requests/${r.id}/close`);
      expect(closed.body.request.state).toBe('closed');
      // A beekeeper who took no part sees a closed request no more: it answers like a missing one.
      const late = await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 5 });
      expect(late.status).toBe(404);
      expect(late.body.error.code).toBe('not_found');
    });
  });
});
