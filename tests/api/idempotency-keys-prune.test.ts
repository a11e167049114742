// The daily job that clears old Idempotency-Key rows of the field steps: keys claimed more
// than 30 days ago go, newer ones stay (the retention is common practice, no source; the
// reasons are in server/src/modules/placements/idempotency-keys-prune.job.ts).
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { buildOrganization, buildUser } from '../support/builders/accounts.js';
import { idempotencyKeyPruneCron, idempotencyKeyRetentionDays, pruneIdempotencyKeys } from '../../server/src/modules/placements/idempotency-keys-prune.job.js';
import { queueNames } from '../../server/src/jobs/queue-names.js';

const DAY = 86_400_000;
const clock = new Date('2027-04-20T03:17:00Z');

describe('pruning old Idempotency-Key rows', () => {
  let t: TestApp;

  beforeAll(async () => { t = await startTestApp({ now: () => clock }); });
  afterAll(async () => { await t?.stop(); });

  it('is scheduled once a day', async () => {
    const [row] = await t.context.sequelize.query<{ cron: string }>('SELECT cron FROM pgboss.schedule WHERE name = :name', {
      replacements: { name: queueNames.idempotencyKeyPrune }, type: QueryTypes.SELECT,
    });
    expect(row?.cron).toBe(idempotencyKeyPruneCron);
  });

  it('removes a key claimed more than 30 days ago and keeps a recent one', async () => {
    expect(idempotencyKeyRetentionDays).toBe(30);
    const apiary = await buildOrganization({ kind: 'apiary' });
    const crew = await buildUser({ organization: apiary, role: 'crew' });
    const claim = (key: string, startedAt: Date) => t.context.models.IdempotencyKey.create({
      userId: crew.id, key, method: 'POST', path: `/api/placements/${randomUUID()}/delivery`, requestHash: 'h'.repeat(64),
      responseStatus: 201, responseBody: null, startedAt, completedAt: startedAt,
    });
    const old = await claim(`old-${randomUUID()}`, new Date(clock.getTime() - 31 * DAY));
    const recent = await claim(`recent-${randomUUID()}`, new Date(clock.getTime() - 29 * DAY));

    expect(await pruneIdempotencyKeys(t.context)).toBe(1);
    const left = await t.context.models.IdempotencyKey.findAll({ where: { userId: crew.id }, attributes: ['id'] });
    expect(left.map((k) => k.id)).toEqual([recent.id]);
    expect(left.map((k) => k.id)).not.toContain(old.id);
  });
});
