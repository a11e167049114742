// The time a phone sends for a field step (drop-off, strength check, pickup, photo) is
// bounded when it is written: not in the future beyond the clock tolerance, and not before
// the agreement was made. Either is a 400 that names the field and changes nothing; a good
// past time is kept as the step's time, beside the time the server received it. A strength
// check (and a strength-check or pickup photo) is not before its drop-off, as a pickup is after it.
// The five-minute tolerance and "not before the agreement" are common practice, no source.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildMarket } from '../support/builders/requests.js';
import { scheduledPlacementThroughApi } from '../support/field-placement-api.js';

const HOUR = 3_600_000;
const DAY = 24 * HOUR;
const png = Buffer.from('89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d4944415478da63f8cfc0f01f0005000201a5f3c1a30000000049454e44ae426082', 'hex');

describe('recorded times on the field steps', () => {
  let t: TestApp;
  let m: Awaited<ReturnType<typeof buildMarket>>;
  let grower: ApiClient, keeper: ApiClient, crew: ApiClient;

  beforeAll(async () => {
    t = await startTestApp();
    m = await buildMarket();
    grower = await signedInClient(t.app, m.people.grower.email);
    keeper = await signedInClient(t.app, m.people.keeper.email);
    crew = await signedInClient(t.app, m.people.crew.email);
  });
  afterAll(async () => { await t?.stop(); });

  /** A scheduled placement whose agreement was made two days ago. */
  const placementAgreedTwoDaysAgo = (colonies = 10) => scheduledPlacementThroughApi({ grower, keeper, crew }, m, colonies, new Date(Date.now() - 2 * DAY));

  const photo = (id: string, recordedAt: string, step = 'delivery') => crew.agent.post(`/api/placements/${id}/photos`).set('X-CSRF-Token', crew.csrfToken).set('Idempotency-Key', randomUUID())
    .field('step', step).field('recordedAt', recordedAt).attach('photo', png, { filename: 'drop.png', contentType: 'image/png' });

  const count = async (sql: string, id: string) =>
    Number((await t.context.sequelize.query<{ n: string }>(sql, { replacements: { id }, type: QueryTypes.SELECT }))[0].n);

  it('refuses a drop-off recorded before the agreement was made with a 400 naming deliveredAt, and records nothing', async () => {
    const id = await placementAgreedTwoDaysAgo();
    const res = await crew.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 10, deliveredAt: new Date(Date.now() - 3 * DAY).toISOString() })
      .set('Idempotency-Key', randomUUID());
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation_failed');
    expect(res.body.error.fields.deliveredAt).toMatch(/before the agreement was made/);
    // The outbox shows the message alone, so it says what is wrong and what to do.
    expect(res.body.error.message).toMatch(/^The time recorded for this drop-off \(.+\) is before the agreement was made \(.+\)\. Check the date and time on the phone/);
    const p = (await crew.get(`/api/placements/${id}`).expect(200)).body.placement;
    expect(p.state).toBe('scheduled');
    expect(p.deliveredAt).toBeNull();
  });

  it('refuses a strength check, a pickup and a photo recorded before the agreement, each naming its field', async () => {
    const id = await placementAgreedTwoDaysAgo();
    await crew.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 10, deliveredAt: new Date(Date.now() - DAY).toISOString() }).expect(201);
    const early = new Date(Date.now() - 3 * DAY).toISOString();

    const check = await crew.post(`/api/placements/${id}/strength-checks`, { framesOfBees: [8], checkedAt: early });
    expect(check.status).toBe(400);
    expect(check.body.error.fields.checkedAt).toMatch(/before the agreement was made/);
    expect(check.body.error.message).toMatch(/this strength check/);

    const pickup = await crew.post(`/api/placements/${id}/pickup`, { coloniesPickedUp: 10, pickedUpAt: early });
    expect(pickup.status).toBe(400);
    expect(pickup.body.error.fields.pickedUpAt).toMatch(/before the agreement was made/);
    expect(pickup.body.error.message).toMatch(/this pickup/);

    const picture = await photo(id, early);
    expect(picture.status).toBe(400);
    expect(picture.body.error.fields.recordedAt).toMatch(/before the agreement was made/);
    expect(picture.body.error.message).toMatch(/this photo/);

    expect(await count('SELECT count(*) AS n FROM strength_checks WHERE placement_id = :id', id)).toBe(0);
    expect(await count('SELECT count(*) AS n FROM placement_photos WHERE placement_id = :id', id)).toBe(0);
    expect((await crew.get(`/api/placements/${id}`).expect(200)).body.placement.state).toBe('delivered');
  });

  it('refuses a strength check recorded before the drop-off with a 400 naming checkedAt, and records nothing', async () => {
    const id = await placementAgreedTwoDaysAgo();
    const droppedOff = new Date(Date.now() - DAY);
    await crew.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 10, deliveredAt: droppedOff.toISOString() }).expect(201);
    const before = await crew.post(`/api/placements/${id}/strength-checks`, { framesOfBees: [8], checkedAt: new Date(droppedOff.getTime() - HOUR).toISOString() });
    expect(before.status).toBe(400);
    expect(before.body.error.fields).toEqual({ checkedAt: 'cannot be before the drop-off' });
    expect(await count('SELECT count(*) AS n FROM strength_checks WHERE placement_id = :id', id)).toBe(0);
    // At the drop-off itself is fine: the crew checks the colonies as it sets them down.
    await crew.post(`/api/placements/${id}/strength-checks`, { framesOfBees: [8], checkedAt: droppedOff.toISOString() }).expect(201);
  });

  it('refuses a strength-check or pickup photo recorded before the drop-off (400 naming recordedAt); a drop-off photo may be taken as colonies are set down', async () => {
    const id = await placementAgreedTwoDaysAgo();
    const droppedOff = new Date(Date.now() - DAY);
    const hourBefore = new Date(droppedOff.getTime() - HOUR).toISOString();
    await crew.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 10, deliveredAt: droppedOff.toISOString() }).expect(201);
    for (const step of ['strength-check', 'pickup']) {
      const res = await photo(id, hourBefore, step);
      expect(res.status, step).toBe(400);
      expect(res.body.error.fields, step).toEqual({ recordedAt: 'cannot be before the drop-off' });
    }
    expect(await count('SELECT count(*) AS n FROM placement_photos WHERE placement_id = :id', id)).toBe(0);
    expect((await photo(id, hourBefore, 'delivery')).status).toBe(201);
    expect((await photo(id, droppedOff.toISOString(), 'strength-check')).status).toBe(201);
    expect(await count('SELECT count(*) AS n FROM placement_photos WHERE placement_id = :id', id)).toBe(2);
  });

  it('refuses a time more than five minutes ahead (400 naming the field) and takes a small lead as the time received', async () => {
    const id = await placementAgreedTwoDaysAgo();
    const ahead = new Date(Date.now() + HOUR).toISOString();
    const future = await crew.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 10, deliveredAt: ahead });
    expect(future.status).toBe(400);
    expect(future.body.error.fields).toEqual({ deliveredAt: 'cannot be in the future' });
    const futurePhoto = await photo(id, ahead);
    expect(futurePhoto.status).toBe(400);
    expect(futurePhoto.body.error.fields).toEqual({ recordedAt: 'cannot be in the future' });

    const fast = new Date(Date.now() + 2 * 60_000).toISOString(); // a phone clock two minutes fast
    const res = await crew.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 10, deliveredAt: fast }).expect(201);
    const p = res.body.placement;
    expect(p.deliveredRecordedAt).toBe(fast);
    expect(p.deliveredAt).toBe(p.deliveredReceivedAt);
  });

  it('keeps a good past time as the step time, beside the time the server received it', async () => {
    const id = await placementAgreedTwoDaysAgo();
    const droppedOff = new Date(Date.now() - DAY).toISOString();
    const delivered = (await crew.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 10, deliveredAt: droppedOff }).set('Idempotency-Key', randomUUID()).expect(201)).body.placement;
    expect(delivered.deliveredAt).toBe(droppedOff);
    expect(delivered.deliveredRecordedAt).toBe(droppedOff);
    expect(Date.parse(delivered.deliveredReceivedAt)).toBeGreaterThan(Date.parse(droppedOff) + 23 * HOUR);

    const checked = new Date(Date.now() - 12 * HOUR).toISOString();
    const withCheck = (await crew.post(`/api/placements/${id}/strength-checks`, { framesOfBees: [8], checkedAt: checked }).expect(201)).body.placement;
    expect(withCheck.strengthChecks[0].checkedAt).toBe(checked);
    expect(Date.parse(withCheck.strengthChecks[0].receivedAt)).toBeGreaterThan(Date.parse(checked) + 11 * HOUR);

    const pictured = new Date(Date.now() - 6 * HOUR).toISOString();
    const withPhoto = (await photo(id, pictured).expect(201)).body.placement;
    expect(withPhoto.photos[0].recordedAt).toBe(pictured);
    expect(Date.parse(withPhoto.photos[0].at)).toBeGreaterThan(Date.parse(pictured) + 5 * HOUR);

    const pickedUp = new Date(Date.now() - HOUR).toISOString();
    const done = (await crew.post(`/api/placements/${id}/pickup`, { coloniesPickedUp: 10, pickedUpAt: pickedUp }).expect(201)).body.placement;
    expect(done.pickedUpAt).toBe(pickedUp);
    expect(done.pickedUpRecordedAt).toBe(pickedUp);
    expect(Date.parse(done.pickedUpReceivedAt)).toBeGreaterThan(Date.parse(pickedUp) + 50 * 60_000);
    expect(done.onSite).toEqual({ from: droppedOff, to: pickedUp });
  });
});
