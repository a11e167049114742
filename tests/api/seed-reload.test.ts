// `npm run seed` erases the demo and loads it again: the second load must find the
// reference data migrations inserted (e.g. the codling moth model) and give the same world.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { seedScenario } from '../../seed/scenario.js';
import { eraseAllData } from '../../seed/erase.js';

describe('reloading the demo scenario', () => {
  let t: TestApp;
  beforeAll(async () => { t = await startTestApp({ env: { JOBS_ENABLED: 'false' } }); });
  afterAll(async () => { await t?.stop(); });

  const counts = async () =>
    (await t.context.sequelize.query<Record<string, number>>(
      `SELECT (SELECT count(*)::int FROM organizations) AS organizations, (SELECT count(*)::int FROM users) AS users,
              (SELECT count(*)::int FROM placements) AS placements, (SELECT count(*)::int FROM pest_models) AS "pestModels"`,
      { type: QueryTypes.SELECT },
    ))[0];

  it('loads, erases and loads again to the same counts', async () => {
    const today = new Date('2026-12-02T15:00:00Z');
    await seedScenario(today);
    const first = await counts();
    expect(first.organizations).toBe(4);
    expect(first.users).toBe(7);
    await eraseAllData(t.context.sequelize);
    expect((await counts()).organizations).toBe(0);
    await seedScenario(today);
    expect(await counts()).toEqual(first);
    expect(first.pestModels).toBeGreaterThan(0);
  }, 120_000);
});
