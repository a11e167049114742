// The demo's blocks part: bloom is happening around the day the demo is loaded, the
// stations' curves extend with their own earlier season, one window has been revised,
// the ridge farm sees a frost warning, and reloading keeps the published reference data.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient } from '../support/api-client.js';
import { seedAccounts } from '../../seed/parts/accounts.seed.js';
import { seedBlocks, type SeedBlocks } from '../../seed/parts/blocks.seed.js';
import { eraseAllData } from '../../seed/erase.js';
import type { SeedWorld } from '../../seed/seed-world.js';
import type { BlockDto, BlockForecastDto } from '../../shared/schemas/blocks.js';

const DAY = 86_400_000;

async function seed(today: Date): Promise<SeedWorld> {
  const world = { today, extra: {} } as SeedWorld;
  await seedAccounts(world);
  await seedBlocks(world);
  return world;
}

describe('demo seed: blocks, weather and bloom', () => {
  let t: TestApp;
  let world: SeedWorld;
  const today = new Date();
  beforeAll(async () => {
    t = await startTestApp();
    world = await seed(today);
  });
  afterAll(async () => { await t?.stop(); });

  it('hands blocks and stations on to later parts', () => {
    const handles = world.extra.blocks as SeedBlocks;
    expect(Object.keys(handles.blocks)).toHaveLength(6);
    expect(handles.stations.bench.id).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('has bloom happening around today on the first farm', async () => {
    const grower = await signedInClient(t.app, 'grower@orchard.test');
    const blocks = (await grower.get('/api/blocks').expect(200)).body.blocks as BlockDto[];
    expect(blocks.map((b) => b.name).sort()).toEqual(['Creekside Braeburn', 'Millrace Pears', 'South Slope Cherries', 'Upper Bench Gala']);
    const gala = blocks.find((b) => b.name === 'Upper Bench Gala')!;
    const window = gala.bloomWindow!;
    const start = Date.parse(`${window.bloomStart}T00:00:00Z`);
    const end = Date.parse(`${window.petalFall}T00:00:00Z`);
    expect(start).toBeLessThanOrEqual(today.getTime() + 7 * DAY);
    expect(end).toBeGreaterThanOrEqual(today.getTime() - DAY);
    expect((await grower.get(`/api/blocks/${gala.id}/bloom-windows`).expect(200)).body.revisions).toHaveLength(2);
    const forecast = (await grower.get(`/api/blocks/${gala.id}/forecast`).expect(200)).body.forecast as BlockForecastDto;
    expect(['pink', 'bloom']).toContain(forecast.currentStage?.stage);
    expect(forecast.extension?.kind).toBe('station-normals');
    expect(forecast.frost).toBeNull();
  });

  it('warns the ridge farm of frost on its apples', async () => {
    const grower2 = await signedInClient(t.app, 'grower2@ridge.test');
    const blocks = (await grower2.get('/api/blocks').expect(200)).body.blocks as BlockDto[];
    const fuji = blocks.find((b) => b.crop === 'apple')!;
    const forecast = (await grower2.get(`/api/blocks/${fuji.id}/forecast`).expect(200)).body.forecast as BlockForecastDto;
    expect(forecast.frost?.risk).toBe('damage');
  });

  it('reloads after erasing, the published thresholds included', async () => {
    await eraseAllData(t.context.sequelize);
    world = await seed(today);
    const grower = await signedInClient(t.app, 'grower@orchard.test');
    // Seven apple stages, one per WSU critical-temperature row (published-reference.ts).
    expect((await grower.get('/api/bloom/stage-thresholds?crop=apple').expect(200)).body.thresholds).toHaveLength(7);
    expect((await grower.get('/api/bloom/frost-critical').expect(200)).body.critical.length).toBeGreaterThanOrEqual(24);
  });
});
