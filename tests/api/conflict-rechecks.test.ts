// Durable re-checks: a change writes its re-check job in its own transaction (a rolled-back
// change leaves none), and repeated changes waiting for one agreement collapse into one job,
// while another agreement gets its own. The queue's worker is stopped so the jobs stay waiting.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { agreementChanged } from '../../server/src/modules/alerts/conflict-rechecks.js';

describe('conflict re-check jobs', () => {
  let t: TestApp;

  beforeAll(async () => {
    t = await startTestApp();
    await t.context.jobs.boss!.offWork('conflict-recheck');
  });
  afterAll(async () => { await t?.stop(); });

  const waiting = async (key: string) => (await t.context.sequelize.query<{ n: number }>(
    `SELECT count(*)::int AS n FROM pgboss.job WHERE name = 'conflict-recheck' AND singleton_key = $key AND state = 'created'`,
    { bind: { key }, type: QueryTypes.SELECT },
  ))[0].n;

  it('writes one waiting job per agreement however many changes ask for it, and none for a rolled-back change', async () => {
    const [a, b, c] = [randomUUID(), randomUUID(), randomUUID()];
    for (let i = 0; i < 3; i++) await t.context.sequelize.transaction((tx) => agreementChanged(t.context, tx, a));
    await t.context.sequelize.transaction((tx) => agreementChanged(t.context, tx, b));
    await expect(t.context.sequelize.transaction(async (tx) => {
      await agreementChanged(t.context, tx, c);
      throw new Error('the change fails after asking for its re-check');
    })).rejects.toThrow(/change fails/);
    expect(await waiting(`agreement:${a}`)).toBe(1);
    expect(await waiting(`agreement:${b}`)).toBe(1);
    expect(await waiting(`agreement:${c}`)).toBe(0);
  });
});
