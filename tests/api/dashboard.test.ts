// The season overviews: the grower's blocks and colonies, the beekeeper's colonies by
// week and moves due, the timeline and the map, each scoped to the user's organization.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import {
  buildAgreement, buildBlock, buildBloomWindow, buildCommitment, buildDropSite, buildPlacement, buildRequest, buildYard,
} from '../support/builders/season.js';
import type { BeekeeperDashboard, GrowerDashboard, SeasonMap, SeasonTimeline } from '../../shared/schemas/dashboard.js';

// 10 March 2027, 10:00 in the Pacific time zone (PST until 14 March).
const NOW = new Date('2027-03-10T18:00:00Z');
const at = (iso: string) => new Date(iso);

describe('season overview API', () => {
  let t: TestApp;
  let grower: ApiClient;
  let growerViewer: ApiClient;
  let otherGrower: ApiClient;
  let keeper: ApiClient;
  let keeperCrew: ApiClient;
  let strangerKeeper: ApiClient;
  let admin: ApiClient;
  const ids: Record<string, string> = {};

  beforeAll(async () => {
    // The app's clock is set in a coming season; sign-ins are stamped with the real time, so the
    // absolute session limit is lifted for this file.
    t = await startTestApp({ now: () => NOW, env: { SESSION_ABSOLUTE_HOURS: '100000' } });
    const farm = await buildOrganization({ kind: 'farm', name: 'Quillon Flats Orchard' });
    const farm2 = await buildOrganization({ kind: 'farm', name: 'Marrow Creek Seed' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Thimbleby Apiaries', coloniesOwned: 80 });
    const apiary2 = await buildOrganization({ kind: 'apiary', name: 'Oxbow Hive Co' });
    await buildUser({ organization: farm, role: 'owner', email: 'dash-grower@example.test' });
    await buildUser({ organization: farm, role: 'viewer', email: 'dash-grower-viewer@example.test' });
    await buildUser({ organization: farm2, role: 'owner', email: 'dash-grower2@example.test' });
    await buildUser({ organization: apiary, role: 'owner', email: 'dash-keeper@example.test' });
    await buildUser({ organization: apiary, role: 'crew', email: 'dash-crew@example.test' });
    await buildUser({ organization: apiary2, role: 'owner', email: 'dash-keeper2@example.test' });
    await buildUser({ organization: null, role: 'admin', email: 'dash-admin@example.test' });

    // Entered acreage (no outline) so the area is exact: 20 acres and 12.5 acres.
    const north = await buildBlock({ farm, name: 'North Almonds', crop: 'almond', acres: 20, withOutline: false, coloniesPerAcre: 2, lon: -120.1, lat: 36.8 });
    const south = await buildBlock({ farm, name: 'South Cherries', crop: 'sweet cherry', acres: 12.5, withOutline: false, coloniesPerAcre: 2.5, lon: -120.12, lat: 36.79 });
    const east = await buildBlock({ farm, name: 'East Pears', crop: 'pear', acres: 10, coloniesPerAcre: 3, lon: -120.08, lat: 36.81 });
    const other = await buildBlock({ farm: farm2, name: 'Other Farm Block', crop: 'apple', acres: 8, lon: -120.3, lat: 36.7 });
    ids.north = north.id; ids.south = south.id; ids.east = east.id; ids.other = other.id;
    await buildBloomWindow({ block: north, bloomStart: '2027-02-20', fullBloom: '2027-03-01', petalFall: '2027-03-14' });
    // An older revision of the south window is superseded by the newer one.
    await buildBloomWindow({ block: south, bloomStart: '2027-03-20', petalFall: '2027-04-02' });
    await buildBloomWindow({ block: south, bloomStart: '2027-03-25', petalFall: '2027-04-08' });
    await buildBloomWindow({ block: east, bloomStart: '2027-02-01', petalFall: '2027-02-20' });

    // Request 1 on North: 40 colonies, committed by Thimbleby, delivered 1 March, out by 15 March (PDT midnight).
    const r1 = await buildRequest({ farm, blocks: [{ block: north, colonies: 40 }], state: 'filled', onSite: { from: at('2027-03-01T08:00:00Z'), to: at('2027-03-15T07:00:00Z') } });
    const site1 = await buildDropSite({ request: r1, block: north, name: 'Pump house lane', lon: -120.1, lat: 36.801, coloniesPlanned: 40 });
    const c1 = await buildCommitment({ request: r1, apiary, colonies: 40 });
    const a1 = await buildAgreement({ commitment: c1 });
    const p1 = await buildPlacement({ agreement: a1, dropSite: site1, coloniesPlanned: 40, deliveredAt: at('2027-03-01T16:00:00Z'), coloniesDelivered: 38 });
    ids.a1 = a1.id; ids.p1 = p1.id; ids.site1 = site1.id;

    // Request 2 on South: 32 colonies asked, 20 committed by Thimbleby from 8 to 22 March, not yet dropped off (overdue);
    // 12 more offered by Oxbow but not accepted (not counted).
    const r2 = await buildRequest({ farm, blocks: [{ block: south, colonies: 32 }], state: 'listed', onSite: { from: at('2027-03-08T08:00:00Z'), to: at('2027-03-22T07:00:00Z') } });
    const site2 = await buildDropSite({ request: r2, block: south, name: 'Cherry gate', lon: -120.12, lat: 36.791, coloniesPlanned: 20 });
    const c2 = await buildCommitment({ request: r2, apiary, colonies: 20 });
    await buildCommitment({ request: r2, apiary: apiary2, colonies: 12, state: 'offered' });
    const a2 = await buildAgreement({ commitment: c2 });
    const p2 = await buildPlacement({ agreement: a2, dropSite: site2, coloniesPlanned: 20 });
    ids.p2 = p2.id;

    // A draft request is not counted as requested.
    await buildRequest({ farm, blocks: [{ block: east, colonies: 30 }], state: 'draft', onSite: { from: at('2027-02-01T08:00:00Z'), to: at('2027-02-20T08:00:00Z') } });

    // Another farm's season with Thimbleby: 10 colonies over 15–22 March.
    const r3 = await buildRequest({ farm: farm2, blocks: [{ block: other, colonies: 10 }], state: 'filled', onSite: { from: at('2027-03-15T07:00:00Z'), to: at('2027-03-22T07:00:00Z') } });
    const c3 = await buildCommitment({ request: r3, apiary, colonies: 10 });
    await buildAgreement({ commitment: c3 });

    await buildYard({ apiary, name: 'Willowbank yard', lon: -120.2, lat: 36.9, colonies: 60 });
    await buildYard({ apiary: apiary2, name: 'Oxbow home yard', lon: -121, lat: 37 });

    grower = await signedInClient(t.app, 'dash-grower@example.test');
    growerViewer = await signedInClient(t.app, 'dash-grower-viewer@example.test');
    otherGrower = await signedInClient(t.app, 'dash-grower2@example.test');
    keeper = await signedInClient(t.app, 'dash-keeper@example.test');
    keeperCrew = await signedInClient(t.app, 'dash-crew@example.test');
    strangerKeeper = await signedInClient(t.app, 'dash-keeper2@example.test');
    admin = await signedInClient(t.app, 'dash-admin@example.test');
  });
  afterAll(async () => {
    await t?.stop();
  });

  describe('GET /api/dashboard/grower', () => {
    it("lists this season's blocks with colonies needed, planned and on site, and the bloom state of today", async () => {
      const res = await grower.get('/api/dashboard/grower').expect(200);
      const body = res.body as GrowerDashboard;
      expect(body.season).toBe(2027);
      expect(body.today).toBe('2027-03-10');
      expect(body.blocks.map((b) => b.name)).toEqual(['East Pears', 'North Almonds', 'South Cherries']);
      const north = body.blocks.find((b) => b.name === 'North Almonds')!;
      // Colonies needed = acres x colonies per acre, rounded up to whole colonies.
      // Source: Almond Board of California, Honey Bee Best Management Practices (2 colonies/acre): 20 acres -> 40.
      expect(north.coloniesNeeded).toBe(40);
      expect(north.acres).toBeCloseTo(20, 9);
      expect(north.coloniesPlanned).toBe(40);
      expect(north.coloniesOnSite).toBe(38);
      expect(north.bloomWindow).toEqual({ bloomStart: '2027-02-20', fullBloom: '2027-03-01', petalFall: '2027-03-14' });
      expect(north.bloomState).toBe('in-bloom');
      const south = body.blocks.find((b) => b.name === 'South Cherries')!;
      // 12.5 acres x 2.5 colonies/acre = 31.25 -> 32 whole colonies (rounded up; Project Apis m. range 2–5 for sweet cherry).
      expect(south.coloniesNeeded).toBe(32);
      expect(south.coloniesPlanned).toBe(20);
      expect(south.coloniesOnSite).toBe(0);
      expect(south.bloomWindow?.bloomStart).toBe('2027-03-25');
      expect(south.bloomState).toBe('before-bloom');
      expect(body.blocks.find((b) => b.name === 'East Pears')!.bloomState).toBe('after-bloom');
      // Requested: 40 (filled) + 32 (listed), the draft not counted; committed: accepted only (40 + 20).
      expect(body.totals.coloniesRequested).toBe(72);
      expect(body.totals.coloniesCommitted).toBe(60);
      expect(body.totals.coloniesOnSite).toBe(38);
      expect(body.totals.coloniesNeeded).toBe(body.blocks.reduce((s, b) => s + b.coloniesNeeded, 0));
    });

    it('shows another season empty of bloom windows and colonies', async () => {
      const res = await grower.get('/api/dashboard/grower?season=2026').expect(200);
      expect(res.body.season).toBe(2026);
      expect(res.body.blocks.every((b: { bloomWindow: unknown; coloniesPlanned: number }) => b.bloomWindow === null && b.coloniesPlanned === 0)).toBe(true);
      expect(res.body.totals.coloniesCommitted).toBe(0);
    });

    it("shows another farm only its own blocks", async () => {
      const res = await otherGrower.get('/api/dashboard/grower').expect(200);
      expect(res.body.blocks.map((b: { name: string }) => b.name)).toEqual(['Other Farm Block']);
      expect(res.body.totals.coloniesCommitted).toBe(10);
    });

    it('answers 400 naming the season when it is not a year', async () => {
      const res = await grower.get('/api/dashboard/grower?season=spring').expect(400);
      expect(res.body.error.code).toBe('validation_failed');
      expect(res.body.error.fields).toHaveProperty('season');
    });

    it('refuses a beekeeper and the admin with 403, and a signed-out visitor with 401', async () => {
      await keeper.get('/api/dashboard/grower').expect(403);
      await admin.get('/api/dashboard/grower').expect(403);
      const res = await (await import('supertest')).default(t.app).get('/api/dashboard/grower');
      expect(res.status).toBe(401);
    });
  });

  describe('GET /api/dashboard/beekeeper', () => {
    it('sums colonies committed per week across growers against the colonies the business has', async () => {
      const res = await keeper.get('/api/dashboard/beekeeper').expect(200);
      const body = res.body as BeekeeperDashboard;
      expect(body.coloniesOwned).toBe(80);
      expect(body.canEditColoniesOwned).toBe(true);
      // Weeks start on Monday (ISO 8601): 1, 8 and 15 March 2027.
      expect(body.weeks.map((w) => w.weekStart)).toEqual(['2027-03-01', '2027-03-08', '2027-03-15']);
      expect(body.weeks.map((w) => w.committed)).toEqual([40, 60, 30]);
      expect(body.peakCommitted).toBe(60);
      expect(body.weeks[2].byFarm).toEqual([
        { farmId: expect.any(String), farmName: 'Marrow Creek Seed', colonies: 10 },
        { farmId: expect.any(String), farmName: 'Quillon Flats Orchard', colonies: 20 },
      ]);
    });

    it('lists the drop-off that is overdue and the pickup due within the next days', async () => {
      const res = await keeperCrew.get('/api/dashboard/beekeeper?days=7').expect(200);
      const body = res.body as BeekeeperDashboard;
      expect(body.canEditColoniesOwned).toBe(false);
      expect(body.dropOffsDue).toEqual([
        expect.objectContaining({ placementId: ids.p2, dropSiteName: 'Cherry gate', blockName: 'South Cherries', colonies: 20, overdue: true, dueAt: '2027-03-08T08:00:00.000Z' }),
      ]);
      expect(body.pickupsDue).toEqual([
        expect.objectContaining({ placementId: ids.p1, agreementId: ids.a1, farmName: 'Quillon Flats Orchard', colonies: 38, overdue: false, dueAt: '2027-03-15T07:00:00.000Z' }),
      ]);
    });

    it('leaves out a pickup beyond the days asked for', async () => {
      const res = await keeper.get('/api/dashboard/beekeeper?days=2').expect(200);
      expect(res.body.pickupsDue).toEqual([]);
      expect(res.body.dropOffsDue).toHaveLength(1);
    });

    it("shows a beekeeper with no commitments empty weeks from this week on", async () => {
      const res = await strangerKeeper.get('/api/dashboard/beekeeper').expect(200);
      expect(res.body.weeks[0]).toEqual({ weekStart: '2027-03-08', committed: 0, byFarm: [] });
      expect(res.body.weeks).toHaveLength(8);
      expect(res.body.dropOffsDue).toEqual([]);
      expect(res.body.coloniesOwned).toBeNull();
    });

    it('answers 400 naming days out of range', async () => {
      const res = await keeper.get('/api/dashboard/beekeeper?days=0').expect(400);
      expect(res.body.error.fields).toHaveProperty('days');
    });

    it('refuses a grower with 403', async () => {
      await grower.get('/api/dashboard/beekeeper').expect(403);
    });
  });

  describe('PUT /api/dashboard/colonies-owned', () => {
    it('lets the owner enter the colonies the business has', async () => {
      const res = await keeper.put('/api/dashboard/colonies-owned', { coloniesOwned: 95 }).expect(200);
      expect(res.body).toEqual({ coloniesOwned: 95 });
      const dash = await keeper.get('/api/dashboard/beekeeper').expect(200);
      expect(dash.body.coloniesOwned).toBe(95);
    });

    it('answers 400 naming coloniesOwned for a negative or fractional number, keeping the stored total', async () => {
      const neg = await keeper.put('/api/dashboard/colonies-owned', { coloniesOwned: -3 }).expect(400);
      expect(neg.body.error.fields).toHaveProperty('coloniesOwned');
      const frac = await keeper.put('/api/dashboard/colonies-owned', { coloniesOwned: 2.5 }).expect(400);
      expect(frac.body.error.fields).toHaveProperty('coloniesOwned');
      const dash = await keeper.get('/api/dashboard/beekeeper').expect(200);
      expect(dash.body.coloniesOwned).toBe(95);
    });

    it('refuses field crew and growers with 403', async () => {
      await keeperCrew.put('/api/dashboard/colonies-owned', { coloniesOwned: 1 }).expect(403);
      await grower.put('/api/dashboard/colonies-owned', { coloniesOwned: 1 }).expect(403);
    });
  });

  describe('GET /api/dashboard/timeline', () => {
    it('gives the grower one row per block with its bloom band and placement periods', async () => {
      const res = await growerViewer.get('/api/dashboard/timeline').expect(200);
      const body = res.body as SeasonTimeline;
      expect(body.rows.map((r) => r.blockName)).toEqual(['East Pears', 'North Almonds', 'South Cherries']);
      const north = body.rows.find((r) => r.blockId === ids.north)!;
      const bloom = north.items.find((i) => i.kind === 'bloom')!;
      // Bloom from 20 February to the end of petal-fall day (14 March), midnight in the farm's zone.
      expect(bloom.start).toBe('2027-02-20T08:00:00.000Z');
      expect(bloom.end).toBe('2027-03-15T07:00:00.000Z');
      const placement = north.items.find((i) => i.kind === 'placement')!;
      expect(placement).toMatchObject({ id: ids.p1, state: 'delivered', start: '2027-03-01T16:00:00.000Z', end: '2027-03-15T07:00:00.000Z', openId: ids.a1 });
      expect(placement.label).toContain('38 colonies');
    });

    it('gives a beekeeper only the blocks it has committed to, across farms', async () => {
      const res = await keeper.get('/api/dashboard/timeline').expect(200);
      const names = (res.body as SeasonTimeline).rows.map((r) => r.blockName).sort();
      expect(names).toEqual(['North Almonds', 'Other Farm Block', 'South Cherries']);
      const stranger = await strangerKeeper.get('/api/dashboard/timeline').expect(200);
      expect(stranger.body.rows).toEqual([]);
    });
  });

  describe('GET /api/dashboard/map', () => {
    it("maps the farm's blocks coloured by bloom state and its drop sites by colonies on site, without anyone's yards", async () => {
      const res = await grower.get('/api/dashboard/map').expect(200);
      const body = res.body as SeasonMap;
      expect(body.type).toBe('FeatureCollection');
      const byName = new Map(body.features.map((f) => [f.properties.name, f]));
      expect(byName.get('North Almonds')!.properties).toMatchObject({ kind: 'block', state: 'in-bloom' });
      expect(byName.get('North Almonds')!.geometry.type).toBe('Point');
      expect(byName.get('East Pears')!.geometry.type).toBe('Polygon');
      expect(byName.get('Pump house lane')!.properties).toMatchObject({ kind: 'drop-site', state: 'colonies-on-site' });
      expect(byName.get('Cherry gate')!.properties).toMatchObject({ kind: 'drop-site', state: 'scheduled' });
      expect(body.features.some((f) => f.properties.kind === 'yard')).toBe(false);
      expect(byName.has('Other Farm Block')).toBe(false);
    });

    it("maps the beekeeper's own yards and the drop sites it serves, not another business's yard", async () => {
      const res = await keeper.get('/api/dashboard/map').expect(200);
      const names = (res.body as SeasonMap).features.map((f) => f.properties.name);
      expect(names).toContain('Willowbank yard');
      expect(names).toContain('Pump house lane');
      expect(names).not.toContain('Oxbow home yard');
      const yard = (res.body as SeasonMap).features.find((f) => f.properties.name === 'Willowbank yard')!;
      expect(yard.geometry).toEqual({ type: 'Point', coordinates: [-120.2, 36.9] });
    });
  });
});
