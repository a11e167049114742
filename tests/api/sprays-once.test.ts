// A new spray plan sent under an Idempotency-Key is kept once: the spray form sends the same
// plan again when its answer was lost or the database was away, and two tabs may send it at
// once. The key is written in the plan's own transaction, so a repeat gets the first plan
// back (and the beekeeper one alert, one e-mail); a key used for a different plan is a 422
// naming the header, a malformed one a 400; without a key a plan is saved as before.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildAlertWorld, type AlertWorld } from '../support/alert-world.js';
import { queueNames } from '../../server/src/jobs/queue-names.js';

describe('a new spray plan sent again', () => {
  let t: TestApp;
  let world: AlertWorld;
  let grower: ApiClient;

  beforeAll(async () => {
    t = await startTestApp();
    world = await buildAlertWorld('sprays-once');
    grower = await signedInClient(t.app, world.growerEmail);
  });
  afterAll(async () => { await t?.stop(); });

  const count = async (sql: string, replacements: Record<string, unknown> = {}) =>
    Number((await t.context.sequelize.query<{ n: string }>(sql, { replacements, type: QueryTypes.SELECT }))[0].n);
  const plansNamed = (name: string) => count('SELECT count(*) AS n FROM spray_plans WHERE product_name = :name', { name });
  const alertsOf = (name: string) => count('SELECT count(*) AS n FROM alerts a JOIN spray_plans s ON s.id = a.spray_plan_id WHERE s.product_name = :name', { name });
  /** E-mail jobs ever queued (sent or not: pg-boss keeps a sent job's row). */
  const emailJobs = () => count('SELECT count(*) AS n FROM pgboss.job WHERE name = :name', { name: queueNames.sendEmail });
  const send = (body: object, key: string) => grower.post('/api/sprays', body).set('Idempotency-Key', key);

  it('keeps one plan, one alert and one e-mail per person when the same plan is sent again, and answers the repeat with the first plan', async () => {
    const body = world.conflictingSpray(0, 'Resent Guard 4F');
    const key = randomUUID();
    const mailsBefore = await emailJobs();
    const first = await send(body, key).expect(201);
    const mailsAfterFirst = await emailJobs();
    expect(mailsAfterFirst).toBeGreaterThan(mailsBefore);

    const again = await send(body, key).expect(201);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body.spray.id).toBe(first.body.spray.id);
    expect(again.body.check.conflicts.map((c: { apiaryId: string }) => c.apiaryId)).toEqual([world.apiaryId]);
    expect(await plansNamed('Resent Guard 4F')).toBe(1);
    expect(await alertsOf('Resent Guard 4F')).toBe(1);
    expect(await emailJobs()).toBe(mailsAfterFirst);
  });

  it('keeps one plan when two tabs send it at the same moment', async () => {
    const body = world.conflictingSpray(1, 'Twin Tab 50WP');
    const key = randomUUID();
    const answers = await Promise.all([send(body, key), send(body, key)]);
    expect(answers.map((a) => a.status)).toEqual([201, 201]);
    expect(new Set(answers.map((a) => a.body.spray.id)).size).toBe(1);
    expect(answers.filter((a) => a.headers['idempotent-replayed'] === 'true')).toHaveLength(1);
    expect(await plansNamed('Twin Tab 50WP')).toBe(1);
    expect(await alertsOf('Twin Tab 50WP')).toBe(1);
  });

  it('refuses a key already used for a different plan (422) and a malformed one (400), naming the header and saving nothing', async () => {
    const key = randomUUID();
    await send(world.conflictingSpray(2, 'First Use 2EC'), key).expect(201);
    const other = await send(world.conflictingSpray(3, 'Other Use 2EC'), key).expect(422);
    expect(other.body.error.fields).toEqual({ 'Idempotency-Key': 'was already used for a different request' });
    const bad = await send(world.conflictingSpray(3, 'Other Use 2EC'), 'short').expect(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['Idempotency-Key']);
    expect(await plansNamed('Other Use 2EC')).toBe(0);
  });

  it('saves a plan sent without a key as before, every time it is sent', async () => {
    const body = world.conflictingSpray(4, 'Keyless 75DF');
    await grower.post('/api/sprays', body).expect(201);
    await grower.post('/api/sprays', body).expect(201);
    expect(await plansNamed('Keyless 75DF')).toBe(2);
  });
});
