// Spray plans and the conflict check over HTTP against the real app and database.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildBlock, buildSignedSeason, buildDropSite, buildRequest, buildCommitment, buildAgreement, buildPlacement } from '../support/builders/season.js';
import { sprayInput } from '../support/builders/sprays.js';
import type { Organization } from '../../server/src/db/models/organization.model.js';

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const isoDay = (d: Date) => d.toISOString().slice(0, 10);
// Metres east per degree of longitude at latitude 44.9 (spherical approximation, enough for test distances).
const degLonFor = (metres: number, lat = 44.9) => metres / (111_320 * Math.cos((lat * Math.PI) / 180));

describe('spray plans API', () => {
  let t: TestApp;
  let farm: Organization;
  let apiary: Organization;
  let grower: ApiClient;
  let applicator: ApiClient;
  let keeper: ApiClient;
  let otherGrower: ApiClient;
  let season: Awaited<ReturnType<typeof buildSignedSeason>>;
  const now = new Date();
  // A night spray four days out: outside the bees' flying hours at the block (UTC 08:00 = 00:00 local at -119.9 E).
  const nightStart = new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() + 4, 8));

  beforeAll(async () => {
    t = await startTestApp();
    farm = await buildOrganization({ kind: 'farm', name: 'Marrowfield Orchards' });
    apiary = await buildOrganization({ kind: 'apiary', name: 'Quillback Apiaries' });
    const otherFarm = await buildOrganization({ kind: 'farm' });
    await buildUser({ organization: farm, role: 'owner', email: 'grower@sprays-api.test' });
    await buildUser({ organization: farm, role: 'applicator', email: 'applicator@sprays-api.test' });
    await buildUser({ organization: apiary, role: 'owner', email: 'keeper@sprays-api.test' });
    await buildUser({ organization: otherFarm, role: 'owner', email: 'other@sprays-api.test' });
    season = await buildSignedSeason({
      farm, apiary, colonies: 40, onSite: { from: new Date(now.getTime() - 2 * DAY), to: new Date(now.getTime() + 20 * DAY) },
      bloom: { bloomStart: isoDay(new Date(now.getTime() - 3 * DAY)), petalFall: isoDay(new Date(now.getTime() + 12 * DAY)) },
    });
    grower = await signedInClient(t.app, 'grower@sprays-api.test');
    applicator = await signedInClient(t.app, 'applicator@sprays-api.test');
    keeper = await signedInClient(t.app, 'keeper@sprays-api.test');
    otherGrower = await signedInClient(t.app, 'other@sprays-api.test');
  });
  afterAll(async () => { await t?.stop(); });

  const count = async (sql: string, replacements: Record<string, unknown> = {}) =>
    Number((await t.context.sequelize.query<{ n: string }>(sql, { replacements, type: QueryTypes.SELECT }))[0].n);

  it('dry-runs the check: a product without label data during bloom with colonies on the block is barred, nothing is stored', async () => {
    const res = await applicator.post('/api/sprays/check', sprayInput({ blockIds: [season.block.id], startsAt: nightStart })).expect(200);
    expect(res.body.check.hazard).toMatchObject({ toxicityClass: 'highly-toxic', extendedResidual: true, assumed: { ld50: true, rt25: true } });
    expect(res.body.check.duringBloom).toBe(true);
    expect(res.body.check.conflicts).toHaveLength(1);
    expect(res.body.check.conflicts[0]).toMatchObject({ apiaryId: apiary.id, apiaryName: 'Quillback Apiaries', grade: 'label-bar' });
    expect(res.body.check.conflicts[0].colonies).toMatchObject({ colonies: 40, distanceM: 0 });
    expect(res.body.check.cautions.join(' ')).toMatch(/label is the law/);
    expect(await count('SELECT count(*) AS n FROM spray_plans')).toBe(0);
    expect(await count('SELECT count(*) AS n FROM alerts')).toBe(0);
  });

  it('refuses bad input with 400 naming the field', async () => {
    const bad = await applicator.post('/api/sprays', sprayInput({ blockIds: [season.block.id], startsAt: nightStart, epaRegNo: '12-ab' })).expect(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['epaRegNo']);
    const backwards = { ...sprayInput({ blockIds: [season.block.id], startsAt: nightStart }), endsAt: new Date(nightStart.getTime() - HOUR).toISOString() };
    expect((await applicator.post('/api/sprays', backwards).expect(400)).body.error.fields).toHaveProperty('endsAt');
    const negative = await applicator.post('/api/sprays', sprayInput({ blockIds: [season.block.id], startsAt: nightStart, ld50UgPerBee: -1 })).expect(400);
    expect(negative.body.error.fields).toHaveProperty('ld50UgPerBee');
    const foreignBlock = await buildBlock({ farm: await buildOrganization({ kind: 'farm' }) });
    const foreign = await applicator.post('/api/sprays', sprayInput({ blockIds: [foreignBlock.id], startsAt: nightStart })).expect(400);
    expect(foreign.body.error.fields).toHaveProperty('blockIds');
    expect(await count('SELECT count(*) AS n FROM spray_plans')).toBe(0);
  });

  it('accepts the EPA registration number forms 1234-56 and 1234-56-7890', async () => {
    for (const epaRegNo of ['1234-56', '1234-56-7890']) {
      const res = await applicator.post('/api/sprays/check', sprayInput({ blockIds: [season.block.id], startsAt: nightStart, epaRegNo })).expect(200);
      expect(res.body.check.conflicts.length).toBeGreaterThan(0);
    }
  });

  it('stores a plan, raises one alert for the apiary, lets the keeper see it and hides it from another farm', async () => {
    const res = await applicator.post('/api/sprays', sprayInput({ blockIds: [season.block.id], startsAt: nightStart })).expect(201);
    expect(res.body.spray).toMatchObject({ state: 'planned', epaRegNo: '1234-56', openAlerts: 1 });
    expect(res.body.check.conflicts[0].grade).toBe('label-bar');
    const alerts = (await keeper.get('/api/alerts').expect(200)).body;
    expect(alerts.alerts).toHaveLength(1);
    expect(alerts.alerts[0]).toMatchObject({ state: 'raised', grade: 'label-bar', apiary: { id: apiary.id }, seenByMe: false });
    expect(alerts.unseen).toBe(1);
    expect(alerts.alerts[0].history.map((e: { action: string }) => e.action)).toEqual(['raised']);
    await otherGrower.get(`/api/sprays/${res.body.spray.id}`).expect(404);
    await otherGrower.get(`/api/alerts/${alerts.alerts[0].id}`).expect(404);
    expect((await otherGrower.get('/api/alerts').expect(200)).body.alerts).toEqual([]);
    await keeper.get('/api/sprays').expect(403);
  });

  it('records seen and answered in the history; the beekeeper may not give a grower\'s answer', async () => {
    const [alert] = (await keeper.get('/api/alerts').expect(200)).body.alerts;
    const seen = (await keeper.post(`/api/alerts/${alert.id}/seen`).expect(200)).body.alert;
    expect(seen).toMatchObject({ state: 'seen', seenByMe: true });
    const wrong = await keeper.post(`/api/alerts/${alert.id}/answer`, { response: 'will-reschedule' }).expect(400);
    expect(wrong.body.error.fields).toHaveProperty('response');
    const answered = (await keeper.post(`/api/alerts/${alert.id}/answer`, { response: 'will-close-colonies', note: 'Closing them at dusk' }).expect(200)).body.alert;
    expect(answered.state).toBe('answered');
    expect(answered.history.map((e: { action: string }) => e.action)).toEqual(['raised', 'seen', 'answered']);
    const growerView = (await grower.get(`/api/alerts/${alert.id}`).expect(200)).body.alert;
    expect(growerView.history.at(-1)).toMatchObject({ action: 'answered', response: 'will-close-colonies', note: 'Closing them at dusk', organizationName: 'Quillback Apiaries' });
  });

  it('records the applied time, then refuses to cancel an applied spray', async () => {
    const created = (await applicator.post('/api/sprays', sprayInput({ blockIds: [season.block.id], startsAt: new Date(now.getTime() - 5 * HOUR), hours: 1 })).expect(201)).body;
    const appliedAt = new Date(now.getTime() - 4 * HOUR).toISOString();
    const applied = (await applicator.post(`/api/sprays/${created.spray.id}/apply`, { appliedAt }).expect(200)).body;
    expect(applied.spray).toMatchObject({ state: 'applied', appliedAt });
    expect(applied.check.conflicts.length).toBeGreaterThan(0);
    const refused = await applicator.post(`/api/sprays/${created.spray.id}/cancel`).expect(409);
    expect(refused.body.error.code).toBe('wrong_state');
    await applicator.post(`/api/sprays/${created.spray.id}/apply`, { appliedAt: new Date(now.getTime() + 10 * DAY).toISOString() }).expect(409);
  });

  it('resolves the alerts of a cancelled spray', async () => {
    const created = (await applicator.post('/api/sprays', sprayInput({ blockIds: [season.block.id], startsAt: new Date(nightStart.getTime() + DAY) })).expect(201)).body;
    await applicator.post(`/api/sprays/${created.spray.id}/cancel`).expect(200);
    const states = await t.context.sequelize.query<{ state: string }>('SELECT state FROM alerts WHERE spray_plan_id = :id', { replacements: { id: created.spray.id }, type: QueryTypes.SELECT });
    expect(states).toEqual([{ state: 'resolved' }]);
  });

  describe('distance and time', () => {
    let far: { block: { id: string } };
    beforeAll(async () => {
      // A second block 1.2 km west of colonies that arrive in 3 days; bloom not entered.
      const block = await buildBlock({ farm, lon: -119.9 - degLonFor(1200), lat: 44.9, name: 'West Terrace' });
      far = { block };
    });

    it('finds colonies 1.2 km away within the 1-mile buffer, during the residual window only', async () => {
      const sameDay = await applicator.post('/api/sprays/check', sprayInput({ blockIds: [far.block.id], startsAt: nightStart, ld50UgPerBee: 1.5, rt25Hours: 12 })).expect(200);
      expect(sameDay.body.check.duringBloom).toBe(false);
      expect(sameDay.body.check.conflicts[0]).toMatchObject({ grade: 'colonies-exposed', apiaryId: apiary.id });
      // Measured to the block's edge: 1,200 m to its centre less half the side of a 20-acre square
      // (sqrt(20 x 4,046.86 m²) / 2 = 142 m; acre from NIST Handbook 44, Appendix C) = about 1,058 m.
      expect(sameDay.body.check.conflicts[0].colonies.distanceM).toBeGreaterThan(1040);
      expect(sameDay.body.check.conflicts[0].colonies.distanceM).toBeLessThan(1080);
    });

    it('does not find colonies beyond a smaller buffer set by the farm', async () => {
      await t.context.sequelize.query('UPDATE organizations SET spray_buffer_m = 1000 WHERE id = :id', { replacements: { id: farm.id } });
      try {
        const res = await applicator.post('/api/sprays/check', sprayInput({ blockIds: [far.block.id], startsAt: nightStart, ld50UgPerBee: 1.5, rt25Hours: 12 })).expect(200);
        expect(res.body.check.conflicts).toEqual([]);
      } finally {
        await t.context.sequelize.query('UPDATE organizations SET spray_buffer_m = 1609.344 WHERE id = :id', { replacements: { id: farm.id } });
      }
    });

    it('extends the spray window by the RT25: colonies arriving 10 h after the spray count with RT25 12 h, not with 2 h', async () => {
      const arrive = new Date(nightStart.getTime() + 12 * HOUR); // spray ends at +2 h; arrival 10 h later
      const request = await buildRequest({ farm, blocks: [{ block: far.block, colonies: 12 }], onSite: { from: arrive, to: new Date(arrive.getTime() + 10 * DAY) } });
      const site = await buildDropSite({ request, block: far.block, lon: -119.9 - degLonFor(1200), lat: 44.9, coloniesPlanned: 12 });
      const other = await buildOrganization({ kind: 'apiary', name: 'Latecomer Hives' });
      const agreement = await buildAgreement({ commitment: await buildCommitment({ request, apiary: other, colonies: 12 }) });
      await buildPlacement({ agreement, dropSite: site, coloniesPlanned: 12 });
      const long = (await applicator.post('/api/sprays/check', sprayInput({ blockIds: [far.block.id], startsAt: nightStart, ld50UgPerBee: 5, rt25Hours: 12 })).expect(200)).body.check;
      const short = (await applicator.post('/api/sprays/check', sprayInput({ blockIds: [far.block.id], startsAt: nightStart, ld50UgPerBee: 5, rt25Hours: 2 })).expect(200)).body.check;
      expect(long.conflicts.map((c: { apiaryName: string }) => c.apiaryName)).toContain('Latecomer Hives');
      expect(short.conflicts.map((c: { apiaryName: string }) => c.apiaryName)).not.toContain('Latecomer Hives');
    });

    it('grades short notice when the spray starts sooner than the agreed 48 h', async () => {
      const soon = new Date(now.getTime() + 20 * HOUR);
      const res = await applicator.post('/api/sprays/check', sprayInput({ blockIds: [far.block.id], startsAt: soon, ld50UgPerBee: 50, rt25Hours: 1 })).expect(200);
      const quillback = res.body.check.conflicts.find((c: { apiaryId: string }) => c.apiaryId === apiary.id);
      expect(quillback.grades).toContain('short-notice');
    });
  });

  describe('re-checks when what it reads changes', () => {
    it('resolves the alert when the colonies are picked up, and reopens it when they come back', async () => {
      const blockOnly = await buildBlock({ farm, lon: -119.95, lat: 44.95, name: 'Creek Corner' });
      const keeperApiary = await buildOrganization({ kind: 'apiary', name: 'Saltmarsh Hives' });
      const request = await buildRequest({ farm, blocks: [{ block: blockOnly, colonies: 8 }], onSite: { from: new Date(now.getTime() - DAY), to: new Date(now.getTime() + 9 * DAY) } });
      const site = await buildDropSite({ request, block: blockOnly, lon: -119.95, lat: 44.95, coloniesPlanned: 8 });
      const agreement = await buildAgreement({ commitment: await buildCommitment({ request, apiary: keeperApiary, colonies: 8 }) });
      const placement = await buildPlacement({ agreement, dropSite: site, coloniesPlanned: 8, deliveredAt: new Date(now.getTime() - DAY) });
      const created = (await applicator.post('/api/sprays', sprayInput({ blockIds: [blockOnly.id], startsAt: nightStart, ld50UgPerBee: 1, rt25Hours: 3 })).expect(201)).body;
      const stateOf = async () => (await t.context.sequelize.query<{ state: string }>(
        'SELECT state FROM alerts WHERE spray_plan_id = :id AND apiary_id = :apiaryId', { replacements: { id: created.spray.id, apiaryId: keeperApiary.id }, type: QueryTypes.SELECT },
      ))[0]?.state;
      expect(await stateOf()).toBe('raised');
      const { placementChanged } = await import('../../server/src/modules/placements/placement-events.js');
      await t.context.sequelize.query(`UPDATE placements SET state = 'picked-up', picked_up_at = now(), on_site = tstzrange(lower(on_site), now(), '[)') WHERE id = :id`, { replacements: { id: placement.id } });
      await t.context.sequelize.transaction((tx) => placementChanged(t.context, tx, placement.id, 'picked-up'));
      expect(await eventually(async () => (await stateOf()) === 'resolved')).toBe(true);
      await t.context.sequelize.query(`UPDATE placements SET state = 'delivered', picked_up_at = NULL, on_site = tstzrange(lower(on_site), NULL, '[)') WHERE id = :id`, { replacements: { id: placement.id } });
      await t.context.sequelize.transaction((tx) => placementChanged(t.context, tx, placement.id, 'delivered'));
      expect(await eventually(async () => (await stateOf()) === 'raised')).toBe(true);
      const history = (await keeperApiaryHistory(created.spray.id, keeperApiary.id)).map((e) => e.action);
      expect(history).toEqual(['raised', 'resolved', 'reopened']);
    });

    it('re-grades when a bloom window is entered for the sprayed block', async () => {
      const { bloomWindowChanged } = await import('../../server/src/modules/alerts/conflict-rechecks.js');
      const { buildBloomWindow } = await import('../support/builders/season.js');
      const lone = await buildBlock({ farm, lon: -118.5, lat: 44.9, name: 'Lone Pine' });
      const created = (await applicator.post('/api/sprays', sprayInput({ blockIds: [lone.id], startsAt: nightStart, ld50UgPerBee: 1, rt25Hours: 3 })).expect(201)).body;
      expect(created.check.conflicts).toEqual([]);
      await buildBloomWindow({ block: lone, bloomStart: isoDay(now), petalFall: isoDay(new Date(now.getTime() + 10 * DAY)) });
      await t.context.sequelize.transaction((tx) => bloomWindowChanged(t.context, tx, lone.id));
      // The re-check job runs after the commit.
      await eventually(async () => (await grower.get(`/api/sprays/${created.spray.id}`).expect(200)).body.spray.openAlerts === 1);
      const after = (await grower.get(`/api/sprays/${created.spray.id}`).expect(200)).body;
      expect(after.check.conflicts.map((c: { grade: string }) => c.grade)).toEqual(['bloom-spray']);
      expect(after.spray.openAlerts).toBe(1);
    });
  });

  const keeperApiaryHistory = (sprayId: string, apiaryId: string) => t.context.sequelize.query<{ action: string }>(
    `SELECT e.action FROM alert_events e JOIN alerts a ON a.id = e.alert_id WHERE a.spray_plan_id = :sprayId AND a.apiary_id = :apiaryId ORDER BY e.id`,
    { replacements: { sprayId, apiaryId }, type: QueryTypes.SELECT },
  );

  describe('pest timing', () => {
    it('records trap counts and sets the biofix at the first of two successive catches', async () => {
      for (const [checkedOn, moths] of [['2027-05-01', 0], ['2027-05-04', 2], ['2027-05-07', 3]] as const) {
        await applicator.post('/api/pests/trap-counts', { blockId: season.block.id, pestModelId: 'codling-moth', checkedOn, moths }).expect(201);
      }
      const bad = await applicator.post('/api/pests/trap-counts', { blockId: season.block.id, pestModelId: 'codling-moth', checkedOn: '2027-05-10', moths: -2 }).expect(400);
      expect(bad.body.error.fields).toHaveProperty('moths');
      const timing = (await grower.get(`/api/pests/timing?blockId=${season.block.id}&pestModelId=codling-moth&season=2027`).expect(200)).body.timing;
      expect(timing).toMatchObject({ biofix: '2027-05-04', hasWeather: false });
      expect(timing.stages[0]).toMatchObject({ name: 'First egg hatch', degreeDaysF: 250, reachedOn: null });
      const models = (await grower.get('/api/pests/models').expect(200)).body.models;
      expect(models[0]).toMatchObject({ id: 'codling-moth', lowerThresholdF: 50, upperThresholdF: 88 });
      expect(models[0].source).toMatch(/Enviroweather/);
      await otherGrower.get(`/api/pests/timing?blockId=${season.block.id}`).expect(404);
    });
  });
});
