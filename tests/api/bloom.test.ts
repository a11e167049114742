// Bloom forecasts and windows: degree days from a station's temperatures give predicted
// stages and a suggested window; a forecast low at or below the critical temperature of
// the stage predicted for its day raises a frost warning; every window revision is kept
// in order, sent live to the farm and to apiaries following the block (not to others),
// and gathered into an e-mail digest.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import request from 'supertest';
import { io as connect, type Socket } from 'socket.io-client';
import { startTestApp, eventually, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildOrganization, buildUser, defaultTestPassword } from '../support/builders/accounts.js';
import { buildRequest, buildCommitment } from '../support/builders/season.js';
import { buildDailyTemperatures, buildForecastLow, buildStation } from '../support/builders/weather.js';
import { sendBloomDigest } from '../../server/src/modules/bloom/bloom-digest.job.js';
import type { ClientToServerEvents, ServerToClientEvents } from '../../shared/events.js';
import type { BlockForecastDto, BloomRevisedEvent, BloomWindowDto } from '../../shared/schemas/blocks.js';
import type { FrostCriticalDto, StageThresholdDto } from '../../shared/schemas/weather.js';

type AppSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

async function socketFor(t: TestApp, email: string): Promise<{ socket: AppSocket; events: BloomRevisedEvent[] }> {
  const agent = request.agent(t.baseUrl);
  const csrf = (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken;
  const res = await agent.post('/api/auth/login').set('X-CSRF-Token', csrf).send({ email, password: defaultTestPassword }).expect(200);
  const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]).join('; ');
  const socket: AppSocket = connect(t.baseUrl, { transports: ['websocket'], extraHeaders: { Cookie: cookie }, reconnection: false, forceNew: true });
  const events: BloomRevisedEvent[] = [];
  socket.on('bloom:revised', (e) => events.push(e));
  await new Promise<void>((resolve, reject) => { socket.once('session:ready', () => resolve()); socket.once('connect_error', reject); });
  return { socket, events };
}

// 20 days at 10–20 °C (50–68 °F): the average method over 43 °F gives exactly 16 DD°F a day.
const march = Array.from({ length: 20 }, (_, i) => ({ day: `2027-03-${String(i + 1).padStart(2, '0')}`, tminC: 10, tmaxC: 20 }));

describe('bloom forecasts and windows', () => {
  let t: TestApp;
  let grower: ApiClient;
  let admin: ApiClient;
  let blockId: string;
  let stationId: string;
  let apiaryId: string;
  let farmId: string;
  const sockets: AppSocket[] = [];

  beforeAll(async () => {
    // The clock is moved to a day in March 2027; sign-ins stamp real time, so the absolute session limit is lifted.
    t = await startTestApp({
      now: () => new Date('2027-03-20T20:00:00Z'),
      config: { bloomDigestDelaySeconds: 0, session: { secret: 'bloom-test-session-secret-0123', idleMinutes: 720, absoluteHours: 24 * 365 * 5, cookieSecure: false } },
    });
    const farm = await buildOrganization({ kind: 'farm', name: 'Marrowdene Orchards' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Goldthistle Apiaries' });
    const bystander = await buildOrganization({ kind: 'apiary', name: 'Far Meadow Bees' });
    apiaryId = apiary.id;
    farmId = farm.id;
    await buildUser({ organization: farm, role: 'owner', email: 'owner@marrowdene.test', name: 'Wren Oakhurst' });
    await buildUser({ organization: apiary, role: 'owner', email: 'owner@goldthistle.test' });
    await buildUser({ organization: bystander, role: 'owner', email: 'owner@farmeadow.test' });
    await buildUser({ organization: null, role: 'admin', email: 'admin@bloomtest.test' });
    grower = await signedInClient(t.app, 'owner@marrowdene.test');
    admin = await signedInClient(t.app, 'admin@bloomtest.test');
    stationId = (await buildStation({ farm, name: 'Marrowdene mast' })).id;
    await buildDailyTemperatures({ station: { id: stationId }, days: march });
    const block = await grower.post('/api/blocks', { name: 'Hilltop apples', crop: 'apple', enteredAcres: 20, weatherStationId: stationId, degreeDayStart: '2027-03-01' });
    expect(block.status).toBe(201);
    blockId = block.body.block.id;
    const req = await buildRequest({ farm, blocks: [{ block: { id: blockId }, colonies: 30 }], onSite: { from: new Date('2027-03-25T00:00:00Z'), to: new Date('2027-04-10T00:00:00Z') } });
    await buildCommitment({ request: req, apiary, colonies: 30, state: 'offered' });
  });
  afterAll(async () => {
    for (const s of sockets) s.disconnect();
    await t?.stop();
  });

  it('seeds the published apple stage thresholds with their source', async () => {
    const res = await grower.get('/api/bloom/stage-thresholds?crop=apple').expect(200);
    const rows = res.body.thresholds as StageThresholdDto[];
    // Source: Cornell / UMass fruit newsletters: base 43 °F from March 1; green tip 100–120,
    // pink 267–316, petal fall 439–523 DD°F. Bloom 330–400 is our interpolation; silver tip, half-inch green
    // and tight cluster (one stage per WSU critical-temperature row) are from memory, each labelled as such.
    expect(rows.map((r) => [r.stage, r.ddLowF, r.ddHighF, r.baseF, r.startMonthDay])).toEqual([
      ['silver-tip', 50, 90, 43, '03-01'], ['green-tip', 100, 120, 43, '03-01'], ['half-inch-green', 140, 190, 43, '03-01'],
      ['tight-cluster', 200, 260, 43, '03-01'], ['pink', 267, 316, 43, '03-01'], ['bloom', 330, 400, 43, '03-01'], ['petal-fall', 439, 523, 43, '03-01'],
    ]);
    expect(rows[1].source).toMatch(/Cornell/);
    expect(rows[0].source).toMatch(/from memory/);
    expect(rows[3].source).toMatch(/from memory/);
    expect(rows[5].source).toMatch(/Interpolated/);
  });

  it('seeds the published frost critical temperatures (10% / 90% kill)', async () => {
    const res = await grower.get('/api/bloom/frost-critical?crop=apple').expect(200);
    const rows = res.body.critical as FrostCriticalDto[];
    // Source: WSU Extension EB0913 (apple, Red Delicious), as republished by Penn State Extension
    // "Orchard Frost – Critical Temperatures for Various Fruits".
    expect(rows.map((r) => [r.stageLabel, r.kill10F, r.kill90F])).toEqual([
      ['Silver tip', 15, 2], ['Green tip', 18, 10], ['Half-inch green', 23, 15], ['Tight cluster', 27, 21],
      ['First pink', 28, 24], ['Full pink to full bloom', 28, 25], ['Post bloom', 28, 25],
    ]);
    const cherry = (await grower.get('/api/bloom/frost-critical?crop=sweet-cherry').expect(200)).body.critical as FrostCriticalDto[];
    // Source: WSU Extension EB1128 (sweet cherry), via Penn State Extension: first swelling 17/5, full bloom 28/25.
    expect(cherry[0]).toMatchObject({ stageLabel: 'First swelling', kill10F: 17, kill90F: 5 });
    expect(cherry.find((r) => r.stageLabel === 'Full bloom')).toMatchObject({ kill10F: 28, kill90F: 25 });
  });

  it('predicts each stage from degree days, extending the season with a stated normal', async () => {
    const res = await grower.get(`/api/blocks/${blockId}/forecast`).expect(200);
    const f = res.body.forecast as BlockForecastDto;
    expect(f).toMatchObject({ method: 'average', lowerF: 43, upperF: null, from: '2027-03-01', unit: 'F' });
    expect(f.series[0]).toMatchObject({ day: '2027-03-01', degreeDays: 16, cumulative: 16, estimated: false });
    expect(f.series[19]).toMatchObject({ day: '2027-03-20', cumulative: 320, estimated: false });
    expect(f.series[20].estimated).toBe(true);
    expect(f.extension).toMatchObject({ kind: 'simple-normal', fromDay: '2027-03-21' });
    expect(f.extension!.description).toMatch(/last 14 observed days/);
    const byStage = Object.fromEntries(f.predictions.map((p) => [p.stage, p]));
    expect(byStage['green-tip']).toMatchObject({ earliest: '2027-03-07', expected: '2027-03-07', latest: '2027-03-08', estimated: false });
    expect(byStage.pink).toMatchObject({ earliest: '2027-03-17', latest: '2027-03-20' });
    expect(byStage.bloom).toMatchObject({ earliest: '2027-03-21', latest: '2027-03-25', estimated: true });
    expect(byStage['petal-fall']).toMatchObject({ earliest: '2027-03-28', expected: '2027-03-31', latest: '2027-04-02' });
    expect(f.suggestedWindow).toEqual({ bloomStart: '2027-03-21', fullBloom: '2027-03-25', petalFall: '2027-03-31' });
    expect(f.cumulativeToDate).toBe(320);
    expect(f.currentStage).toEqual({ stage: 'pink', label: 'Pink' });
    expect(f.frost).toBeNull();
  });

  it('uses the method and thresholds asked for (single sine, upper cutoff)', async () => {
    const res = await grower.get(`/api/blocks/${blockId}/forecast?method=sine&lowerF=50&upperF=60`).expect(200);
    const f = res.body.forecast as BlockForecastDto;
    // 50–68 °F over TL 50 with TU 60, single sine (Baskerville & Emin 1969): above(50) = 9, minus above(60).
    expect(f.method).toBe('sine');
    expect(f.series[0].degreeDays).toBeGreaterThan(0);
    expect(f.series[0].degreeDays).toBeLessThan(9);
    const bad = await grower.get(`/api/blocks/${blockId}/forecast?lowerF=50&upperF=40`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.upperF).toBeTruthy();
  });

  it('warns of frost when a forecast low is at or below the critical temperature of the stage predicted for its day', async () => {
    // 320 DD°F by 20 March, then 16 a day (estimated): bloom (330) from 21 March. Apple full pink to full bloom:
    // 10% kill 28 °F (-2.2 °C), 90% kill 25 °F (-3.9 °C) — WSU EB0913 via Penn State Extension.
    await buildForecastLow({ station: { id: stationId }, day: '2027-03-22', lowC: -2.0 });
    expect((await grower.get(`/api/blocks/${blockId}/forecast`).expect(200)).body.forecast.frost).toBeNull();
    const entered = await grower.put(`/api/weather/stations/${stationId}/forecast-lows/2027-03-23`, { low: 27, unit: 'F' });
    expect(entered.status).toBe(200);
    const warned = (await grower.get(`/api/blocks/${blockId}/forecast`).expect(200)).body.forecast as BlockForecastDto;
    expect(warned.frost).toMatchObject({ risk: 'damage', day: '2027-03-23', stage: 'bloom', stageLabel: 'Full pink to full bloom' });
    expect(warned.frost!.kill10C).toBeCloseTo(-2.222, 2);
    await grower.put(`/api/weather/stations/${stationId}/forecast-lows/2027-03-24`, { low: -5, unit: 'C' }).expect(200);
    const severe = (await grower.get(`/api/blocks/${blockId}/forecast`).expect(200)).body.forecast as BlockForecastDto;
    expect(severe.frost).toMatchObject({ risk: 'severe', day: '2027-03-24' });
  });

  it('warns of a low a few days ahead that spares today\'s tight cluster but hurts the pink stage reached by then', async () => {
    const station = (await buildStation({ farm: { id: farmId }, name: 'Marrowdene east slope' })).id;
    await buildDailyTemperatures({ station: { id: station }, days: march });
    // Counted from 6 March at 16 DD°F a day: 240 by 20 March (tight cluster, 200–260, from memory), 256 on the
    // 21st, 272 on the 22nd (pink, from 267 — Cornell / UMass fruit newsletters).
    const block = await grower.post('/api/blocks', { name: 'East slope apples', crop: 'apple', enteredAcres: 5, weatherStationId: station, degreeDayStart: '2027-03-06' }).expect(201);
    await grower.put(`/api/weather/stations/${station}/forecast-lows/2027-03-21`, { low: 28, unit: 'F' }).expect(200);
    await grower.put(`/api/weather/stations/${station}/forecast-lows/2027-03-22`, { low: 28, unit: 'F' }).expect(200);
    const f = (await grower.get(`/api/blocks/${block.body.block.id}/forecast`).expect(200)).body.forecast as BlockForecastDto;
    // Source: WSU Extension EB0913 (apple, Red Delicious) via Penn State Extension "Orchard Frost – Critical
    // Temperatures for Various Fruits": tight cluster 10% kill 27 °F, first pink 10% kill 28 °F.
    expect(f.frostCritical).toMatchObject({ stage: 'tight-cluster', stageLabel: 'Tight cluster' });
    expect(f.frost).toMatchObject({ risk: 'damage', day: '2027-03-22', stage: 'pink', stageName: 'Pink', stageLabel: 'First pink' });
    expect(f.frost!.kill10C).toBeCloseTo(-2.222, 2);
    expect(f.frost!.source).toMatch(/WSU Extension/);
    expect(f.frost!.stageSource).toMatch(/Cornell/);
  });

  it('gives apple, pear and sweet cherry blocks frost risk at their own stage, a low at the critical value counting', async () => {
    const station = (await buildStation({ farm: { id: farmId }, name: 'Marrowdene low field' })).id;
    await buildDailyTemperatures({ station: { id: station }, days: march });
    let made = 0;
    const forecastOf = async (crop: string) => {
      made += 1;
      const block = await grower.post('/api/blocks', { name: `Low field ${crop} ${made}`, crop, enteredAcres: 5, weatherStationId: station, degreeDayStart: '2027-03-01' }).expect(201);
      return (await grower.get(`/api/blocks/${block.body.block.id}/forecast`).expect(200)).body.forecast as BlockForecastDto;
    };
    // 320 DD°F by 20 March (16 a day). Without forecast lows each block still shows its stage's row.
    const calm = await forecastOf('pear');
    expect(calm.frost).toBeNull();
    // Source: WSU Extension EB0978 (pear, Bartlett) via Penn State Extension: first bloom 27 °F / 23 °F.
    expect(calm.frostCritical).toMatchObject({ stage: 'bloom', stageName: 'First bloom', stageLabel: 'First bloom' });
    expect(calm.frostCritical!.kill90C).toBeCloseTo(-5, 6);
    // 28 °F exactly, tonight (20 March, so each block's stage today applies): WSU lists 28 °F as the 10% kill
    // temperature of apple first pink and sweet cherry full bloom.
    await grower.put(`/api/weather/stations/${station}/forecast-lows/2027-03-20`, { low: 28, unit: 'F' }).expect(200);
    const apple = await forecastOf('apple');
    expect(apple.frost).toMatchObject({ risk: 'damage', stage: 'pink', stageName: 'Pink', stageLabel: 'First pink', day: '2027-03-20' });
    expect(apple.frost!.source).toMatch(/WSU Extension/);
    expect(apple.frost!.stageSource).toMatch(/Cornell/);
    const cherry = await forecastOf('sweet-cherry');
    // Source: WSU Extension EB1128 (sweet cherry) via Penn State Extension: full bloom 28 °F / 25 °F.
    expect(cherry.frost).toMatchObject({ risk: 'damage', stage: 'full-bloom', stageLabel: 'Full bloom' });
    expect(cherry.frost!.stageSource).toMatch(/from memory/);
    expect((await forecastOf('pear')).frost).toBeNull(); // 28 °F is above pear first bloom's 27 °F
  });

  it('keeps every bloom window revision in order, sends it live to the farm and following apiaries only, and e-mails a digest', async () => {
    const farmSide = await socketFor(t, 'owner@marrowdene.test');
    const keeperSide = await socketFor(t, 'owner@goldthistle.test');
    const bystanderSide = await socketFor(t, 'owner@farmeadow.test');
    sockets.push(farmSide.socket, keeperSide.socket, bystanderSide.socket);

    const windows = [
      { bloomStart: '2027-03-21', fullBloom: '2027-03-25', petalFall: '2027-03-31', confidenceNote: 'From the degree-day forecast' },
      { bloomStart: '2027-03-23', fullBloom: '2027-03-27', petalFall: '2027-04-02', confidenceNote: 'Cool week ahead' },
      { bloomStart: '2027-03-24', petalFall: '2027-04-03' },
    ];
    for (const w of windows) expect((await grower.post(`/api/blocks/${blockId}/bloom-windows`, w)).status).toBe(201);

    const revisions = (await grower.get(`/api/blocks/${blockId}/bloom-windows`).expect(200)).body.revisions as BloomWindowDto[];
    expect(revisions.map((r) => r.bloomStart)).toEqual(['2027-03-21', '2027-03-23', '2027-03-24']);
    expect(revisions.map((r) => r.revisedBy?.name)).toEqual(['Wren Oakhurst', 'Wren Oakhurst', 'Wren Oakhurst']);
    expect(new Set(revisions.map((r) => r.createdAt)).size).toBe(3);
    const block = (await grower.get(`/api/blocks/${blockId}`).expect(200)).body.block;
    expect(block.bloomWindow).toMatchObject({ bloomStart: '2027-03-24', fullBloom: null, petalFall: '2027-04-03', season: 2027 });

    await eventually(() => farmSide.events.length === 3 && keeperSide.events.length === 3);
    expect(keeperSide.events[1]).toMatchObject({ blockName: 'Hilltop apples', farmName: 'Marrowdene Orchards', previous: { bloomStart: '2027-03-21' } });
    expect(keeperSide.events[2].window.bloomStart).toBe('2027-03-24');
    await new Promise((r) => setTimeout(r, 300));
    expect(bystanderSide.events).toEqual([]);

    const digests = await eventually(() => {
      const found = t.sink.messages.filter((m) => m.to.includes('owner@goldthistle.test') && /Bloom windows revised/.test(m.subject));
      const mentioned = found.map((m) => m.text).join('\n');
      return mentioned.includes('bloom from Wed 24 Mar 2027') ? found : null; // 2027-03-24, shown as a person reads it
    }, 15_000);
    expect(digests[0].text).toMatch(/Marrowdene Orchards, Hilltop apples \(Apple\)/);
    expect(t.sink.messages.some((m) => m.to.includes('owner@farmeadow.test'))).toBe(false);
    // Everything is reported: the next digest has nothing to send.
    await eventually(async () => (await sendBloomDigest(t.context, apiaryId)) === 0);
  });

  it('refuses a window whose petal fall comes before bloom, naming the field', async () => {
    const res = await grower.post(`/api/blocks/${blockId}/bloom-windows`, { bloomStart: '2027-04-10', petalFall: '2027-04-01' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.petalFall).toMatch(/on or after/);
    const outside = await grower.post(`/api/blocks/${blockId}/bloom-windows`, { bloomStart: '2027-04-10', fullBloom: '2027-04-30', petalFall: '2027-04-20' });
    expect(outside.body.error.fields.fullBloom).toMatch(/between/);
  });

  it('lets a farm keep its own thresholds for a variety, leaving the published ones to the admin', async () => {
    const published = ((await grower.get('/api/bloom/stage-thresholds?crop=apple').expect(200)).body.thresholds as StageThresholdDto[]).find((r) => r.stage === 'green-tip')!;
    expect((await grower.patch(`/api/bloom/stage-thresholds/${published.id}`, { ddLowF: 90 })).status).toBe(403);
    const own = await grower.post('/api/bloom/stage-thresholds', {
      crop: 'apple', variety: 'Honeycrisp', stage: 'bloom', label: 'Bloom (our records)', baseF: 43, ddLowF: 200, ddHighF: 260, source: 'Own observation, 2024–2026',
    });
    expect(own.status).toBe(201);
    const hc = await grower.post('/api/blocks', { name: 'Honeycrisp row', crop: 'apple', variety: 'Honeycrisp', enteredAcres: 5, weatherStationId: stationId, degreeDayStart: '2027-03-01' });
    const f = (await grower.get(`/api/blocks/${hc.body.block.id}/forecast`).expect(200)).body.forecast as BlockForecastDto;
    expect(f.thresholds).toEqual([expect.objectContaining({ stage: 'bloom', ddLow: 200, farmOwn: true })]);
    expect(f.predictions[0].earliest).toBe('2027-03-13'); // 16 x 13 = 208 >= 200
    const edited = await admin.patch(`/api/bloom/stage-thresholds/${published.id}`, { ddLowF: 95, source: published.source });
    expect(edited.status).toBe(200);
    expect(edited.body.threshold.ddLowF).toBe(95);
    const inverted = await admin.patch(`/api/bloom/stage-thresholds/${published.id}`, { ddHighF: 50 });
    expect(inverted.status).toBe(400);
    expect(inverted.body.error.fields.ddHighF).toBeTruthy();
  });

  it('shows an apiary the current windows of blocks it follows', async () => {
    const keeper = await signedInClient(t.app, 'owner@goldthistle.test');
    const res = await keeper.get('/api/bloom/held-windows').expect(200);
    expect(res.body.windows).toEqual([expect.objectContaining({ blockName: 'Hilltop apples', bloomStart: '2027-03-24' })]);
    const bystander = await signedInClient(t.app, 'owner@farmeadow.test');
    expect((await bystander.get('/api/bloom/held-windows').expect(200)).body.windows).toEqual([]);
  });
});
