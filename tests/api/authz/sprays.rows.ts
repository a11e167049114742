// Authorization rows for /api/sprays, /api/alerts and /api/pests: farm members see their
// farm's sprays and trap counts, owners, managers and applicators plan and record; every
// member of the farm and of the affected apiary business reads an alert, all but viewers
// answer; another organization gets 404 for these rows (or 400 naming a block not its own).
import { QueryTypes } from 'sequelize';
import { buildBlock } from '../../support/builders/season.js';
import { each, statuses, farmMembers, type AuthzRow, type AuthzRowFile } from './authz-row.js';
import { builderSequelize } from '../../support/builders/builder-database.js';

interface Fixtures { blockId: string; sprayId: string; alertId: string }

const farmPlanners = ['farm:owner', 'farm:manager', 'farm:applicator'] as const;
const answerers = ['farm:owner', 'farm:manager', 'farm:applicator', 'apiary:owner', 'apiary:manager', 'apiary:crew'] as const;
const start = new Date(Date.now() + 5 * 86_400_000);
const end = new Date(start.getTime() + 2 * 3_600_000);

async function insertSpray(farmId: string, blockId: string): Promise<string> {
  const sequelize = builderSequelize();
  const [row] = await sequelize.query<{ id: string }>(
    `INSERT INTO spray_plans (farm_id, planned_window, exposure_window, product_name, noticed_at)
     VALUES (:farmId, tstzrange(:from, :to, '[)'), tstzrange(:from, :to, '[)'), 'Row test product', now()) RETURNING id`,
    { replacements: { farmId, from: start.toISOString(), to: end.toISOString() }, type: QueryTypes.SELECT },
  );
  await sequelize.query('INSERT INTO spray_plan_blocks (spray_plan_id, block_id) VALUES (:id, :blockId)', { replacements: { id: row.id, blockId } });
  return row.id;
}

const sprayBody = (blockId: string) => ({ blockIds: [blockId], startsAt: start.toISOString(), endsAt: end.toISOString(), productName: 'Row test product', epaRegNo: '1234-56' });

const file: AuthzRowFile<Fixtures> = {
  async setup(world) {
    const block = await buildBlock({ farm: world.own.farm, lon: -121.5, lat: 45.6 });
    const sprayId = await insertSpray(world.own.farm.id, block.id);
    // The alert rows read a spray of their own, which the spray rows' re-checks leave alone.
    const alertSprayId = await insertSpray(world.own.farm.id, block.id);
    return { blockId: block.id, sprayId, alertId: await insertAlert(alertSprayId, world.own.farm.id, world.own.apiary.id) };
  },
  rows: [],
};

async function insertAlert(sprayId: string, farmId: string, apiaryId: string): Promise<string> {
  const [alert] = await builderSequelize().query<{ id: string }>(
    `INSERT INTO alerts (spray_plan_id, farm_id, apiary_id, grade, grades, reasons, findings, raised_at)
     VALUES (:sprayId, :farmId, :apiaryId, 'colonies-exposed', '{colonies-exposed}', '["row test"]', '{"colonies": null, "duringBloom": false, "residualHours": 24, "bufferM": 1609.344}', now())
     RETURNING id`,
    { replacements: { sprayId, farmId, apiaryId }, type: QueryTypes.SELECT },
  );
  return alert.id;
}

const freshAlert = async ({ world, fixtures }: { world: { own: { farm: { id: string }; apiary: { id: string } } }; fixtures: Fixtures }) => ({
  id: await insertAlert(await insertSpray(world.own.farm.id, fixtures.blockId), world.own.farm.id, world.own.apiary.id),
});

const freshSpray = async ({ world, fixtures }: { world: { own: { farm: { id: string } } }; fixtures: Fixtures }) => ({ id: await insertSpray(world.own.farm.id, fixtures.blockId) });

const rows: AuthzRow<Fixtures>[] = [
  {
    title: "list the farm's spray plans", method: 'GET', path: '/api/sprays', policy: { table: 'sprays', action: 'list' },
    expect: statuses(403, { ...each(farmMembers, 200), 'other-farm': 200 }),
  },
  {
    title: 'dry-run the conflict check', method: 'POST', path: '/api/sprays/check', body: ({ fixtures }) => sprayBody(fixtures.blockId),
    policy: { table: 'sprays', action: 'plan' }, expect: statuses(403, { ...each(farmPlanners, 200), 'other-farm': 400 }),
  },
  {
    title: 'plan a spray', method: 'POST', path: '/api/sprays', body: ({ fixtures }) => sprayBody(fixtures.blockId),
    policy: { table: 'sprays', action: 'plan' }, expect: statuses(403, { ...each(farmPlanners, 201), 'other-farm': 400 }),
  },
  {
    title: 'open a spray plan', method: 'GET', path: ({ fixtures }) => `/api/sprays/${fixtures.sprayId}`,
    policy: { table: 'sprays', action: 'list' }, expect: statuses(403, { ...each(farmMembers, 200), 'other-farm': 404 }),
  },
  {
    title: 'change a spray plan', method: 'PATCH', path: ({ fixtures }) => `/api/sprays/${fixtures.sprayId}`, body: { notes: 'Row test note' },
    policy: { table: 'sprays', action: 'plan' }, expect: statuses(403, { ...each(farmPlanners, 200), 'other-farm': 404 }),
  },
  {
    title: 'record a spray as applied', method: 'POST', path: ({ fresh }) => `/api/sprays/${fresh.id}/apply`, body: { appliedAt: new Date(Date.now() - 3_600_000).toISOString() },
    fresh: freshSpray, policy: { table: 'sprays', action: 'plan' }, expect: statuses(403, { ...each(farmPlanners, 200), 'other-farm': 404 }),
  },
  {
    title: 'cancel a spray', method: 'POST', path: ({ fresh }) => `/api/sprays/${fresh.id}/cancel`,
    fresh: freshSpray, policy: { table: 'sprays', action: 'plan' }, expect: statuses(403, { ...each(farmPlanners, 200), 'other-farm': 404 }),
  },
  {
    title: "list the organization's alerts", method: 'GET', path: '/api/alerts', policy: { table: 'alerts', action: 'list' },
    expect: statuses(200, { admin: 403 }),
  },
  {
    title: 'open an alert', method: 'GET', path: ({ fixtures }) => `/api/alerts/${fixtures.alertId}`, policy: { table: 'alerts', action: 'list' },
    expect: statuses(200, { admin: 403, 'other-farm': 404, 'other-apiary': 404 }),
  },
  {
    title: 'mark an alert seen', method: 'POST', path: ({ fixtures }) => `/api/alerts/${fixtures.alertId}/seen`, policy: { table: 'alerts', action: 'list' },
    expect: statuses(200, { admin: 403, 'other-farm': 404, 'other-apiary': 404 }),
  },
  {
    title: 'answer an alert', method: 'POST', path: ({ fresh }) => `/api/alerts/${fresh.id}/answer`, body: { response: 'noted' }, fresh: freshAlert,
    policy: { table: 'alerts', action: 'answer' }, expect: statuses(403, { ...each(answerers, 200), 'other-farm': 404, 'other-apiary': 404 }),
  },
  {
    title: 'list the pest models', method: 'GET', path: '/api/pests/models', policy: { table: 'pests', action: 'list' },
    expect: statuses(403, { ...each(farmMembers, 200), 'other-farm': 200 }),
  },
  {
    title: "list a block's trap counts", method: 'GET', path: ({ fixtures }) => `/api/pests/trap-counts?blockId=${fixtures.blockId}`,
    policy: { table: 'pests', action: 'list' }, expect: statuses(403, { ...each(farmMembers, 200), 'other-farm': 404 }),
  },
  {
    title: "open a block's pest timing", method: 'GET', path: ({ fixtures }) => `/api/pests/timing?blockId=${fixtures.blockId}`,
    policy: { table: 'pests', action: 'list' }, expect: statuses(403, { ...each(farmMembers, 200), 'other-farm': 404 }),
  },
  {
    title: 'record a trap count', method: 'POST', path: '/api/pests/trap-counts',
    body: ({ fixtures }) => ({ blockId: fixtures.blockId, pestModelId: 'codling-moth', checkedOn: '2027-05-02', moths: 1 }),
    policy: { table: 'pests', action: 'record' }, expect: statuses(403, { ...each(farmPlanners, 201), 'other-farm': 400 }),
  },
];
file.rows = rows;

export const setup = file.setup;
export { rows };
