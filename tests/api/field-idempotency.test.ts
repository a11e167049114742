// A phone's outbox may send one field record several times (a lost answer, a retry when
// the signal returns, two tabs): with the same Idempotency-Key the server keeps one record
// and answers every copy with the first answer; a different record for a step already
// taken is a 409 that says what is recorded. The phone's recorded time is kept beside the
// time the server received it.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { buildMarket } from '../support/builders/requests.js';
import { scheduledPlacementThroughApi } from '../support/field-placement-api.js';

describe('Idempotency-Key on the field steps', () => {
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

  // Made a week ago, so the phone's records from hours ago are not before the agreement.
  const scheduledPlacementId = (colonies = 20) => scheduledPlacementThroughApi({ grower, keeper, crew }, m, colonies, new Date(Date.now() - 7 * 86_400_000));

  const count = async (sql: string, id: string) =>
    Number((await t.context.sequelize.query<{ n: string }>(sql, { replacements: { id }, type: QueryTypes.SELECT }))[0].n);

  it('keeps one strength check when the same record is sent five times at once with one key', async () => {
    const id = await scheduledPlacementId(20);
    await crew.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 20, deliveredAt: new Date(Date.now() - 2 * 3_600_000).toISOString() }).set('Idempotency-Key', randomUUID()).expect(201);
    const key = randomUUID();
    const check = { framesOfBees: [7, 8], coloniesInGroup: 20, checkedAt: new Date(Date.now() - 3_600_000).toISOString() };
    const answers = await Promise.all(Array.from({ length: 5 }, () => crew.post(`/api/placements/${id}/strength-checks`, check).set('Idempotency-Key', key)));
    expect(answers.map((a) => a.status)).toEqual([201, 201, 201, 201, 201]);
    expect(await count('SELECT count(*) AS n FROM strength_checks WHERE placement_id = :id', id)).toBe(1);
    // Every copy gets the first answer: the same stored check.
    const checkIds = new Set(answers.map((a) => a.body.placement.strengthChecks.map((c: { id: string }) => c.id).join(',')));
    expect(checkIds.size).toBe(1);
    expect(answers.filter((a) => a.headers['idempotent-replayed'] === 'true')).toHaveLength(4);
    // A later repeat (the phone never saw the answer) is still the first answer, with no new row.
    const later = await crew.post(`/api/placements/${id}/strength-checks`, check).set('Idempotency-Key', key).expect(201);
    expect(later.body).toEqual(answers[0].body);
    expect(await count('SELECT count(*) AS n FROM strength_checks WHERE placement_id = :id', id)).toBe(1);
  });

  it('keeps one delivery for five copies with one key; a second key for the same step is a 409 with what is recorded', async () => {
    const id = await scheduledPlacementId(20);
    const recordedAt = new Date(Date.now() - 2 * 3_600_000).toISOString();
    const delivery = { coloniesDelivered: 20, deliveredAt: recordedAt, location: { type: 'Point', coordinates: [m.lon + 0.0003, m.lat] }, accuracyM: 12 };
    const key = randomUUID();
    const copies = await Promise.all(Array.from({ length: 5 }, () => crew.post(`/api/placements/${id}/delivery`, delivery).set('Idempotency-Key', key)));
    expect(copies.map((c) => c.status)).toEqual([201, 201, 201, 201, 201]);
    expect(await count("SELECT count(*) AS n FROM hive_request_events WHERE action = 'placement-delivered' AND detail->>'placementId' = :id", id)).toBe(1);

    // Two phones record the same delivery under their own keys: one stands, the other learns what is recorded.
    const other = await scheduledPlacementId(20);
    const [a, b] = await Promise.all([
      crew.post(`/api/placements/${other}/delivery`, { coloniesDelivered: 20 }).set('Idempotency-Key', randomUUID()),
      crew.post(`/api/placements/${other}/delivery`, { coloniesDelivered: 18 }).set('Idempotency-Key', randomUUID()),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    const [won, lost] = a.status === 201 ? [a, b] : [b, a];
    expect(lost.body.error.code).toBe('wrong_state');
    expect(lost.body.error.recorded.placement).toMatchObject({ id: other, state: 'delivered', coloniesDelivered: won.body.placement.coloniesDelivered });
    expect(await count("SELECT count(*) AS n FROM hive_request_events WHERE action = 'placement-delivered' AND detail->>'placementId' = :id", other)).toBe(1);
  });

  it('keeps one pickup for five copies with one key; a second key for the same pickup is a 409 with what is recorded', async () => {
    const pickedUpCount = (id: string) => count("SELECT count(*) AS n FROM hive_request_events WHERE action = 'placement-picked-up' AND detail->>'placementId' = :id", id);
    const id = await scheduledPlacementId(20);
    await crew.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 20, deliveredAt: new Date(Date.now() - 3 * 86_400_000).toISOString() }).set('Idempotency-Key', randomUUID()).expect(201);
    const pickup = { coloniesPickedUp: 19, pickedUpAt: new Date(Date.now() - 3_600_000).toISOString() };
    const key = randomUUID();
    const copies = await Promise.all(Array.from({ length: 5 }, () => crew.post(`/api/placements/${id}/pickup`, pickup).set('Idempotency-Key', key)));
    expect(copies.map((c) => c.status)).toEqual([201, 201, 201, 201, 201]);
    expect(copies.filter((c) => c.headers['idempotent-replayed'] === 'true')).toHaveLength(4);
    const first = copies.find((c) => c.headers['idempotent-replayed'] !== 'true')!;
    for (const copy of copies) expect(copy.body).toEqual(first.body);
    expect(first.body.placement).toMatchObject({ state: 'picked-up', coloniesPickedUp: 19, pickedUpAt: pickup.pickedUpAt });
    expect(await pickedUpCount(id)).toBe(1);

    // Two phones record the same pickup under their own keys: one stands, the other learns what is recorded.
    const other = await scheduledPlacementId(20);
    await crew.post(`/api/placements/${other}/delivery`, { coloniesDelivered: 20, deliveredAt: new Date(Date.now() - 3 * 86_400_000).toISOString() }).set('Idempotency-Key', randomUUID()).expect(201);
    const [a, b] = await Promise.all([
      crew.post(`/api/placements/${other}/pickup`, { coloniesPickedUp: 20 }).set('Idempotency-Key', randomUUID()),
      crew.post(`/api/placements/${other}/pickup`, { coloniesPickedUp: 17 }).set('Idempotency-Key', randomUUID()),
    ]);
    expect([a.status, b.status].sort()).toEqual([201, 409]);
    const [won, lost] = a.status === 201 ? [a, b] : [b, a];
    expect(lost.body.error.code).toBe('wrong_state');
    expect(lost.body.error.message).toBe('These colonies are already picked up.');
    expect(lost.body.error.recorded.placement).toMatchObject({ id: other, state: 'picked-up', coloniesPickedUp: won.body.placement.coloniesPickedUp, pickedUpAt: won.body.placement.pickedUpAt });
    expect(await pickedUpCount(other)).toBe(1);
  });

  it('keeps the phone recorded time beside the time received, and uses the recorded time for the step', async () => {
    const id = await scheduledPlacementId(10);
    const recordedAt = new Date(Date.now() - 90 * 60_000).toISOString();
    const res = await crew.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 10, deliveredAt: recordedAt, accuracyM: 8 }).set('Idempotency-Key', randomUUID()).expect(201);
    const p = res.body.placement;
    expect(p.deliveredAt).toBe(recordedAt);
    expect(p.deliveredRecordedAt).toBe(recordedAt);
    expect(new Date(p.deliveredReceivedAt).getTime()).toBeGreaterThan(new Date(recordedAt).getTime() + 80 * 60_000);
    expect(p.deliveredAccuracyM).toBe(8);
    expect(p.onSite.from).toBe(recordedAt);
  });

  it('refuses a key reused for a different record (422) and a malformed key (400 naming the header)', async () => {
    const id = await scheduledPlacementId(10);
    const key = randomUUID();
    await crew.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 10 }).set('Idempotency-Key', key).expect(201);
    const reused = await crew.post(`/api/placements/${id}/delivery`, { coloniesDelivered: 9 }).set('Idempotency-Key', key);
    expect(reused.status).toBe(422);
    expect(reused.body.error.fields).toHaveProperty('Idempotency-Key');
    const bad = await crew.post(`/api/placements/${id}/pickup`, { coloniesPickedUp: 10 }).set('Idempotency-Key', 'x y');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('Idempotency-Key');
  });

  it('keeps one photo for a repeated upload with one key, with the recorded time', async () => {
    const id = await scheduledPlacementId(10);
    const png = Buffer.from('89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d4944415478da63f8cfc0f01f0005000201a5f3c1a30000000049454e44ae426082', 'hex');
    const key = randomUUID();
    const recordedAt = new Date(Date.now() - 30 * 60_000).toISOString();
    const send = () => crew.agent.post(`/api/placements/${id}/photos`).set('X-CSRF-Token', crew.csrfToken).set('Idempotency-Key', key)
      .field('step', 'delivery').field('recordedAt', recordedAt).attach('photo', png, { filename: 'drop.png', contentType: 'image/png' });
    const [first, second] = [await send(), await send()];
    expect(first.status).toBe(201);
    expect(second.status).toBe(201);
    expect(second.body.placement.photos).toHaveLength(1);
    expect(second.body.placement.photos[0].recordedAt).toBe(recordedAt);
    expect(await count('SELECT count(*) AS n FROM placement_photos WHERE placement_id = :id', id)).toBe(1);
  });
});
