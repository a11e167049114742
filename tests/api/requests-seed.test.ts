// The demo season has open requests, one split between two beekeepers, signed agreements
// and placements in each state, and the beekeeper's crew sees its field list.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient } from '../support/api-client.js';
import { seedScenario } from '../../seed/scenario.js';

describe('demo season: requests, agreements and placements', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
    await seedScenario(new Date('2026-12-02T15:00:00Z'));
  }, 120_000);
  afterAll(async () => { await t?.stop(); });

  const count = async (sql: string) => Number((await t.context.sequelize.query<{ n: string }>(sql, { type: QueryTypes.SELECT }))[0].n);

  it('has open requests, a split request, signed agreements and placements in every state', async () => {
    expect(await count("SELECT count(*) AS n FROM hive_requests WHERE state = 'listed'")).toBeGreaterThanOrEqual(2);
    expect(await count("SELECT count(*) AS n FROM (SELECT request_id FROM commitments WHERE state = 'accepted' GROUP BY request_id HAVING count(DISTINCT apiary_id) >= 2) s")).toBeGreaterThanOrEqual(1);
    expect(await count("SELECT count(*) AS n FROM agreements WHERE state = 'in-force' AND farm_confirmed_at IS NOT NULL AND apiary_confirmed_at IS NOT NULL")).toBeGreaterThanOrEqual(2);
    for (const state of ['scheduled', 'delivered', 'picked-up']) expect(await count(`SELECT count(*) AS n FROM placements WHERE state = '${state}'`), state).toBeGreaterThanOrEqual(1);
  });

  it('dates every agreement before its colonies came, its confirmations after it was made, and its invoices after both', async () => {
    const rows = await t.context.sequelize.query<{ problem: string }>(
      `SELECT a.id || ': ' || p.problem AS problem FROM agreements a
       LEFT JOIN LATERAL (SELECT min(delivered_at) AS first_drop FROM placements WHERE agreement_id = a.id) d ON true
       CROSS JOIN LATERAL (VALUES
         (CASE WHEN a.created_at > coalesce(d.first_drop, 'infinity') THEN 'made after its first drop-off' END),
         (CASE WHEN greatest(a.farm_confirmed_at, a.apiary_confirmed_at) > coalesce(d.first_drop, 'infinity') THEN 'confirmed after its first drop-off' END),
         (CASE WHEN least(a.farm_confirmed_at, a.apiary_confirmed_at) < a.created_at THEN 'confirmed before it was made' END),
         (CASE WHEN EXISTS (SELECT 1 FROM invoices i WHERE i.agreement_id = a.id AND i.issued_at < greatest(a.farm_confirmed_at, a.apiary_confirmed_at)) THEN 'invoiced before it was confirmed' END)
       ) p(problem)
       WHERE p.problem IS NOT NULL`,
      { type: QueryTypes.SELECT },
    );
    expect(rows.map((r) => r.problem)).toEqual([]);
    expect(await count('SELECT count(*) AS n FROM agreements')).toBeGreaterThanOrEqual(5);
  });

  it('serves the demo to the beekeeper, the crew and the grower through the API', async () => {
    const keeper = await signedInClient(t.app, 'keeper@apiary.test');
    const open = (await keeper.get('/api/requests')).body.requests;
    expect(open.some((r: { distanceKm: number | null; coloniesOpen: number }) => r.distanceKm != null && r.coloniesOpen > 0)).toBe(true);
    const crew = await signedInClient(t.app, 'crew@apiary.test');
    const placements = (await crew.get('/api/placements')).body.placements;
    expect(placements.map((p: { state: string }) => p.state)).toEqual(expect.arrayContaining(['delivered', 'picked-up']));
    const grower = await signedInClient(t.app, 'grower@orchard.test');
    const agreements = (await grower.get('/api/agreements')).body.agreements;
    expect(agreements.some((a: { clauses: unknown[] }) => a.clauses.length >= 10)).toBe(true);
  });
});
