// The demo's spray part: a planned spray near bloom raises an alert for the farm and the
// apiary, one spray is applied and one cancelled, and the trap counts set a biofix.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient } from '../support/api-client.js';
import { seedAccounts } from '../../seed/parts/accounts.seed.js';
import { seedBlocks, type SeedBlocks } from '../../seed/parts/blocks.seed.js';
import { seedSprays } from '../../seed/parts/sprays.seed.js';
import type { SeedWorld } from '../../seed/seed-world.js';

describe('demo sprays seed', () => {
  let t: TestApp;
  let world: SeedWorld;
  beforeAll(async () => {
    t = await startTestApp();
    world = { today: new Date(), extra: {} } as SeedWorld;
    await seedAccounts(world);
    await seedBlocks(world);
    await seedSprays(world);
  });
  afterAll(async () => { await t?.stop(); });

  it('stores one planned, one applied and one cancelled spray', async () => {
    const rows = await t.context.sequelize.query<{ state: string }>('SELECT state FROM spray_plans ORDER BY state', { type: QueryTypes.SELECT });
    expect(rows.map((r) => r.state)).toEqual(['applied', 'cancelled', 'planned']);
  });

  it('raises an alert on the planned spray that the demo beekeeper sees', async () => {
    const keeper = await signedInClient(t.app, world.users.keeper.email);
    const { alerts } = (await keeper.get('/api/alerts?state=open').expect(200)).body;
    const ids = world.extra.sprays as { plannedId: string };
    const alert = alerts.find((a: { spray: { id: string } }) => a.spray.id === ids.plannedId);
    expect(alert).toBeTruthy();
    expect(['label-bar', 'colonies-exposed']).toContain(alert.grade);
    expect(alert.findings.duringBloom).toBe(true);
  });

  it('sets the codling moth biofix at the first of two successive catches', async () => {
    const grower = await signedInClient(t.app, world.users.grower.email);
    const gala = (world.extra.blocks as SeedBlocks).blocks.benchGala;
    const { timing } = (await grower.get(`/api/pests/timing?blockId=${gala.id}`).expect(200)).body;
    const day = (daysAgo: number) => new Date(Date.UTC(world.today.getUTCFullYear(), world.today.getUTCMonth(), world.today.getUTCDate()) - daysAgo * 86_400_000).toISOString().slice(0, 10);
    // Checks every 3 days: 0, 0, 1, 0, 2, 5, 7 moths; the 2 and 5 are the first successive catches (9 days ago).
    expect(timing.biofix).toBe(day(9));
    expect(timing.hasWeather).toBe(true);
    expect(timing.degreeDaysF).toBeGreaterThanOrEqual(0);
  });
});
