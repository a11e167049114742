// The core season builders write rows the schema accepts, with the derived columns right.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { buildOrganization } from '../support/builders/accounts.js';
import { buildSignedSeason, buildStrengthCheck } from '../support/builders/season.js';

describe('season builders', () => {
  let t: TestApp;
  beforeAll(async () => { t = await startTestApp(); });
  afterAll(async () => { await t?.stop(); });

  it('builds a signed, delivered season whose placement is on site from delivery', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    const apiary = await buildOrganization({ kind: 'apiary' });
    const from = new Date('2027-04-10T14:00:00Z');
    const to = new Date('2027-05-01T14:00:00Z');
    const season = await buildSignedSeason({ farm, apiary, colonies: 40, onSite: { from, to }, bloom: { bloomStart: '2027-04-12', petalFall: '2027-04-28' } });
    await buildStrengthCheck({ placement: season.placement, coloniesInGroup: 40, framesOfBees: [8, 7, 9, 6] });
    const [row] = await t.context.sequelize.query<{ acres: number; on_site_lower: Date; state: string }>(
      `SELECT b.area_m2 / 4046.8564224 AS acres, lower(p.on_site) AS on_site_lower, p.state
       FROM placements p JOIN drop_sites d ON d.id = p.drop_site_id JOIN blocks b ON b.id = d.block_id WHERE p.id = :id`,
      { replacements: { id: season.placement.id }, type: QueryTypes.SELECT },
    );
    expect(row.acres).toBeCloseTo(20, 1);
    expect(new Date(row.on_site_lower).toISOString()).toBe(from.toISOString());
    expect(row.state).toBe('delivered');
  });
});
