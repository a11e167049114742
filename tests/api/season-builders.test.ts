// The core season builders write rows the schema accepts, with the derived columns right.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { buildOrganization } from '../support/builders/accounts.js';
import { buildAgreement, buildCommitment, buildSignedSeason, buildStrengthCheck } from '../support/builders/season.js';

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

  it('builds an agreement with its own time on site, or the request\'s, and a strength check with its frame counts', async () => {
    const farm = await buildOrganization({ kind: 'farm' });
    const apiary = await buildOrganization({ kind: 'apiary' });
    const season = await buildSignedSeason({ farm, apiary, colonies: 20, onSite: { from: new Date('2027-03-01T16:00:00Z'), to: new Date('2027-03-22T16:00:00Z') } });
    const own = { from: new Date('2027-03-05T16:00:00Z'), to: new Date('2027-03-19T16:00:00Z') };
    const second = await buildOrganization({ kind: 'apiary' }); // one open commitment per apiary business and request
    const commitment = await buildCommitment({ request: season.request, apiary: second, colonies: 5 });
    const agreement = await buildAgreement({ commitment, onSite: own });
    const { Agreement, StrengthCheck } = t.context.models;
    const [stored, copied] = await Promise.all([Agreement.findByPk(agreement.id, { rejectOnEmpty: true }), Agreement.findByPk(season.agreement.id, { rejectOnEmpty: true })]);
    expect(stored.expectedOnSite.map((b) => [b.value?.toISOString(), b.inclusive])).toEqual([[own.from.toISOString(), true], [own.to.toISOString(), false]]);
    expect(copied.expectedOnSite[0].value?.toISOString()).toBe('2027-03-01T16:00:00.000Z');

    const check = await buildStrengthCheck({ placement: season.placement, coloniesInGroup: 20, framesOfBees: [8, 6.5, 7], framesOfBrood: [5, 4, 4.5] });
    const read = await StrengthCheck.findByPk(check.id, { rejectOnEmpty: true });
    expect([read.framesOfBees, read.framesOfBrood]).toEqual([[8, 6.5, 7], [5, 4, 4.5]]);
  });
});
