// The overview's parts read from the spray, alert and invoice tables: open alerts on both
// sides, the grower's upcoming sprays with their residual tail and latest trap checks,
// money owed and due, spray windows on the timeline and spray buffers on the map.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { buildSignedSeason } from '../support/builders/season.js';
import type { BeekeeperDashboard, GrowerDashboard, SeasonMap, SeasonTimeline } from '../../shared/schemas/dashboard.js';

const NOW = new Date('2027-04-12T17:00:00Z');

describe('season overview with sprays, alerts and invoices', () => {
  let t: TestApp;
  let grower: ApiClient;
  let keeper: ApiClient;
  let otherKeeper: ApiClient;
  const ids: Record<string, string> = {};
  const sql = (query: string, replacements: Record<string, unknown>) =>
    t.context.sequelize.query<{ id: string }>(query, { replacements, type: QueryTypes.SELECT });

  beforeAll(async () => {
    t = await startTestApp({ now: () => NOW, env: { SESSION_ABSOLUTE_HOURS: '100000' } });
    const farm = await buildOrganization({ kind: 'farm', name: 'Hollin Terrace Fruit' });
    const apiary = await buildOrganization({ kind: 'apiary', name: 'Larchmere Bees' });
    const apiary2 = await buildOrganization({ kind: 'apiary', name: 'Pennywhistle Hives' });
    await buildUser({ organization: farm, role: 'owner', email: 'extras-grower@example.test' });
    await buildUser({ organization: apiary, role: 'owner', email: 'extras-keeper@example.test' });
    await buildUser({ organization: apiary2, role: 'owner', email: 'extras-keeper2@example.test' });
    const season = await buildSignedSeason({
      farm, apiary, colonies: 30, lon: -120.5, lat: 46.6,
      onSite: { from: new Date('2027-04-05T15:00:00Z'), to: new Date('2027-04-25T07:00:00Z') },
      bloom: { bloomStart: '2027-04-06', petalFall: '2027-04-22' },
    });
    ids.block = season.block.id;

    // A spray tomorrow, 06:00–08:00 local, with an 8-hour residual time (RT25) on the block.
    const [spray] = await sql(
      `INSERT INTO spray_plans (farm_id, planned_window, exposure_window, product_name, rt25_hours, noticed_at)
       VALUES (:farm, tstzrange('2027-04-13T13:00:00Z', '2027-04-13T15:00:00Z', '[)'), tstzrange('2027-04-13T13:00:00Z', '2027-04-13T23:00:00Z', '[)'),
         'Example insecticide 50WP', 8, :now) RETURNING id`,
      { farm: farm.id, now: NOW.toISOString() },
    );
    ids.spray = spray.id;
    await sql(`INSERT INTO spray_plan_blocks (spray_plan_id, block_id) VALUES (:spray, :block) RETURNING spray_plan_id AS id`, { spray: spray.id, block: season.block.id });
    // A cancelled spray is left out everywhere.
    const [cancelled] = await sql(
      `INSERT INTO spray_plans (farm_id, state, planned_window, exposure_window, product_name, noticed_at)
       VALUES (:farm, 'cancelled', tstzrange('2027-04-14T13:00:00Z', '2027-04-14T15:00:00Z', '[)'), tstzrange('2027-04-14T13:00:00Z', '2027-04-14T15:00:00Z', '[)'),
         'Withdrawn product', :now) RETURNING id`,
      { farm: farm.id, now: NOW.toISOString() },
    );
    await sql(`INSERT INTO spray_plan_blocks (spray_plan_id, block_id) VALUES (:spray, :block) RETURNING spray_plan_id AS id`, { spray: cancelled.id, block: season.block.id });

    const [alert] = await sql(
      `INSERT INTO alerts (spray_plan_id, farm_id, apiary_id, grade, grades, reasons, findings, raised_at)
       VALUES (:spray, :farm, :apiary, 'high', '{high}', '[]', '[]', '2027-04-12T16:00:00Z') RETURNING id`,
      { spray: spray.id, farm: farm.id, apiary: apiary.id },
    );
    ids.alert = alert.id;
    await sql(
      `INSERT INTO alerts (spray_plan_id, farm_id, apiary_id, state, grade, grades, reasons, findings, raised_at, resolved_at)
       VALUES (:spray, :farm, NULL, 'resolved', 'low', '{low}', '[]', '[]', '2027-04-10T16:00:00Z', '2027-04-11T16:00:00Z') RETURNING id`,
      { spray: spray.id, farm: farm.id },
    );

    await sql(
      `INSERT INTO pest_trap_counts (block_id, pest_model_id, checked_on, moths) VALUES (:block, 'codling-moth', '2027-04-08', 2), (:block, 'codling-moth', '2027-04-11', 5) RETURNING id`,
      { block: season.block.id },
    );

    // Invoice of 30 colonies x $65 = $1,950.00; $900 paid, a $50 credit note, a $20 refund: $1,020.00 still open.
    const [invoice] = await sql(
      `INSERT INTO invoices (agreement_id, apiary_id, farm_id, lifecycle, number, currency, time_zone, subtotal_cents, tax_rate_bp, tax_cents,
         total_cents, deposit_cents, late_interest_bp_per_month, reminder_interval_days)
       VALUES (:agreement, :apiary, :farm, 'issued', 1, 'USD', 'America/Los_Angeles', 195000, 0, 0, 195000, 97500, 100, 7) RETURNING id`,
      { agreement: season.agreement.id, apiary: apiary.id, farm: farm.id },
    );
    await sql(`INSERT INTO payments (invoice_id, method, state, amount_cents, currency) VALUES (:i, 'cheque', 'succeeded', 90000, 'USD'), (:i, 'online', 'failed', 50000, 'USD') RETURNING id`, { i: invoice.id });
    await sql(`INSERT INTO credit_notes (invoice_id, apiary_id, number, amount_cents, reason) VALUES (:i, :apiary, 1, 5000, 'Two colonies below strength') RETURNING id`, { i: invoice.id, apiary: apiary.id });
    await sql(`INSERT INTO refunds (invoice_id, provider_refund_id, provider_payment_id, state, amount_cents) VALUES (:i, 're_1', 'pi_1', 'succeeded', 2000) RETURNING id`, { i: invoice.id });

    grower = await signedInClient(t.app, 'extras-grower@example.test');
    keeper = await signedInClient(t.app, 'extras-keeper@example.test');
    otherKeeper = await signedInClient(t.app, 'extras-keeper2@example.test');
  });
  afterAll(async () => {
    await t?.stop();
  });

  it("gives the grower open alerts, the coming spray with its residual tail, the latest trap check and money owed", async () => {
    const body = (await grower.get('/api/dashboard/grower').expect(200)).body as GrowerDashboard;
    expect(body.openAlerts).toEqual([expect.objectContaining({ id: ids.alert, severity: 'high', state: 'raised', raisedAt: '2027-04-12T16:00:00.000Z' })]);
    expect(body.upcomingSprays).toEqual([
      expect.objectContaining({ id: ids.spray, product: 'Example insecticide 50WP', residualHours: 8, plannedEnd: '2027-04-13T15:00:00.000Z', residualEnd: '2027-04-13T23:00:00.000Z' }),
    ]);
    expect(body.pestTraps).toEqual([expect.objectContaining({ pest: 'Codling moth', checkedOn: '2027-04-11', moths: 5 })]);
    // Open balance = total - succeeded payments - credit notes + succeeded refunds (common practice, no source).
    expect(body.moneyOwed).toEqual([{ currency: 'USD', cents: 195000 - 90000 - 5000 + 2000, count: 1 }]);
  });

  it('gives the beekeeper its alert and the money due to it; another business sees neither', async () => {
    const body = (await keeper.get('/api/dashboard/beekeeper').expect(200)).body as BeekeeperDashboard;
    expect(body.openAlerts?.map((a) => a.id)).toEqual([ids.alert]);
    expect(body.openAlerts?.[0].title).toContain('Hollin Terrace Fruit');
    expect(body.moneyDue).toEqual([{ currency: 'USD', cents: 102000, count: 1 }]);
    const other = (await otherKeeper.get('/api/dashboard/beekeeper').expect(200)).body as BeekeeperDashboard;
    expect(other.openAlerts).toEqual([]);
    expect(other.moneyDue).toEqual([]);
  });

  it('puts the spray window with its residual tail and the alert mark on the block row', async () => {
    const body = (await keeper.get('/api/dashboard/timeline').expect(200)).body as SeasonTimeline;
    const row = body.rows.find((r) => r.blockId === ids.block)!;
    const sprays = row.items.filter((i) => i.kind === 'spray');
    expect(sprays).toEqual([expect.objectContaining({ id: ids.spray, start: '2027-04-13T13:00:00.000Z', end: '2027-04-13T15:00:00.000Z', residualEnd: '2027-04-13T23:00:00.000Z' })]);
    const marks = row.items.filter((i) => i.kind === 'alert');
    expect(marks).toEqual([expect.objectContaining({ id: ids.alert, start: '2027-04-12T16:00:00.000Z', end: null })]);
  });

  it("draws the spray's buffer around the block at the farm's buffer distance", async () => {
    const body = (await grower.get('/api/dashboard/map').expect(200)).body as SeasonMap;
    const buffers = body.features.filter((f) => f.properties.kind === 'spray-buffer');
    expect(buffers).toHaveLength(1);
    expect(buffers[0].properties.state).toBe('spray-planned');
    expect(buffers[0].geometry.type).toBe('Polygon');
    // The default buffer is one mile, 1,609.344 m (NIST Handbook 44, Appendix C): the buffer reaches
    // about that far beyond the block's edge, so its north edge lies about 0.0145° of latitude past it.
    const ring = (buffers[0].geometry.coordinates as number[][][])[0];
    const northmost = Math.max(...ring.map((p) => p[1]));
    const blockRes = await t.context.sequelize.query<{ north: number }>(
      'SELECT ST_YMax(outline) AS north FROM blocks WHERE id = :id', { replacements: { id: ids.block }, type: QueryTypes.SELECT },
    );
    expect(northmost - blockRes[0].north).toBeCloseTo(1609.344 / 111_320, 3);
  });
});
