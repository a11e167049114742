// Placements in the field: delivered, strength checked, picked up, disputed; photos; each
// step told to the other side live (socket) and by e-mail; refusals.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { io, type Socket } from 'socket.io-client';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { signedInClient, type ApiClient } from '../support/api-client.js';
import { defaultTestPassword } from '../support/builders/accounts.js';
import { agreementMadeAt, buildMarket, requestPayload } from '../support/builders/requests.js';
import { recheckRanSince } from '../support/recheck-jobs.js';

/** A socket signed in as the user, as the browser's is (session cookie). */
async function socketFor(t: TestApp, email: string): Promise<Socket> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => { for (const c of res.headers.getSetCookie()) { const [pair] = c.split(';'); const [k, v] = pair.split('='); jar.set(k, v); } };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
  const csrf = await fetch(`${t.baseUrl}/api/auth/csrf`);
  keep(csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const login = await fetch(`${t.baseUrl}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': csrfToken, cookie: cookie() }, body: JSON.stringify({ email, password: defaultTestPassword }) });
  keep(login);
  const socket = io(t.baseUrl, { transports: ['websocket'], extraHeaders: { cookie: cookie() }, reconnection: false });
  await new Promise<void>((resolve, reject) => { socket.once('session:ready', () => resolve()); socket.once('connect_error', reject); });
  return socket;
}

const png = Buffer.from('89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d4944415478da63f8cfc0f01f0005000201a5f3c1a30000000049454e44ae426082', 'hex');

describe('placements', () => {
  let t: TestApp;
  let m: Awaited<ReturnType<typeof buildMarket>>;
  let grower: ApiClient, keeper: ApiClient, crew: ApiClient, apiaryViewer: ApiClient, keeper2: ApiClient;
  let growerSocket: Socket;

  beforeAll(async () => {
    t = await startTestApp();
    m = await buildMarket();
    grower = await signedInClient(t.app, m.people.grower.email);
    keeper = await signedInClient(t.app, m.people.keeper.email);
    crew = await signedInClient(t.app, m.people.crew.email);
    apiaryViewer = await signedInClient(t.app, m.people.apiaryViewer.email);
    keeper2 = await signedInClient(t.app, m.people.keeper2.email);
    growerSocket = await socketFor(t, m.people.grower.email);
  });
  afterAll(async () => { growerSocket?.disconnect(); await t?.stop(); });

  /** An agreement in force for `colonies` on the first drop site; returns its first placement. */
  async function scheduledPlacement(colonies = 30) {
    const r = (await grower.post('/api/requests', requestPayload(m.block.id, {}, m)).expect(201)).body.request;
    await grower.post(`/api/requests/${r.id}/publish`).expect(200);
    const c = (await keeper.post(`/api/requests/${r.id}/commitments`, { colonies }).expect(201)).body.commitment;
    await grower.post(`/api/agreements/${c.agreementId}/confirm`).expect(200);
    await keeper.post(`/api/agreements/${c.agreementId}/confirm`).expect(200);
    // Made a week ago, so drop-offs recorded days ago are not before the agreement.
    await agreementMadeAt({ id: c.agreementId }, new Date(Date.now() - 7 * 86_400_000));
    const placements = (await crew.get(`/api/placements?agreementId=${c.agreementId}`)).body.placements;
    return { placement: placements[0], agreementId: c.agreementId as string };
  }

  it('marks colonies delivered with the phone position; the grower hears it live and by e-mail', async () => {
    const { placement } = await scheduledPlacement(30);
    const heard = new Promise<{ placementId: string; state: string; step: string }>((resolve) => growerSocket.once('placement:updated', resolve));
    const deliveredAt = new Date(Date.now() - 60_000).toISOString();
    const stepAt = new Date();
    const res = await crew.post(`/api/placements/${placement.id}/delivery`, { coloniesDelivered: 30, deliveredAt, location: { type: 'Point', coordinates: [m.lon + 0.0004, m.lat] } });
    expect(res.status).toBe(201);
    const p = res.body.placement;
    expect(p.state).toBe('delivered');
    expect(p.coloniesDelivered).toBe(30);
    expect(p.deliveredByName).toBe('Nell Ashby');
    expect(p.deliveredLocation.coordinates[0]).toBeCloseTo(m.lon + 0.0004, 6);
    // On site from delivery, open-ended until pickup (what the conflict search reads).
    expect(p.onSite).toEqual({ from: deliveredAt, to: null });
    expect(await heard).toMatchObject({ placementId: placement.id, state: 'delivered', step: 'delivered' });
    // The spray conflict check re-runs for the placement's agreement.
    await expect.poll(() => recheckRanSince(t, `agreement:${placement.agreementId}`, stepAt), { timeout: 10_000 }).toBe(true);
    await expect.poll(() => t.sink.messages.some((msg) => msg.to.includes(m.people.grower.email) && /North lane .*dropped off/.test(msg.subject)), { timeout: 10_000 }).toBe(true);
    const again = await crew.post(`/api/placements/${placement.id}/delivery`, { coloniesDelivered: 30 });
    expect(again.status).toBe(409);
  });

  it('refuses bad delivery input (400), a viewer (403), another apiary (404)', async () => {
    const { placement } = await scheduledPlacement(10);
    const zero = await crew.post(`/api/placements/${placement.id}/delivery`, { coloniesDelivered: 0 });
    expect(zero.status).toBe(400);
    expect(zero.body.error.fields).toHaveProperty('coloniesDelivered');
    const future = await crew.post(`/api/placements/${placement.id}/delivery`, { coloniesDelivered: 10, deliveredAt: new Date(Date.now() + 86_400_000).toISOString() });
    expect(future.status).toBe(400);
    expect(future.body.error.fields.deliveredAt).toMatch(/future/);
    const badPoint = await crew.post(`/api/placements/${placement.id}/delivery`, { coloniesDelivered: 10, location: { type: 'Point', coordinates: [200, 0] } });
    expect(badPoint.status).toBe(400);
    expect((await apiaryViewer.post(`/api/placements/${placement.id}/delivery`, { coloniesDelivered: 10 })).status).toBe(403);
    expect((await grower.post(`/api/placements/${placement.id}/delivery`, { coloniesDelivered: 10 })).status).toBe(403);
    expect((await keeper2.post(`/api/placements/${placement.id}/delivery`, { coloniesDelivered: 10 })).status).toBe(404);
    expect((await keeper2.get(`/api/placements/${placement.id}`)).status).toBe(404);
    expect((await crew.get(`/api/placements/${placement.id}`)).body.placement.state).toBe('scheduled'); // nothing changed
  });

  it('records a strength check of at least 10% of the colonies and says whether the group meets the agreement', async () => {
    const { placement } = await scheduledPlacement(30);
    expect((await crew.post(`/api/placements/${placement.id}/strength-checks`, { framesOfBees: [8, 7, 6] })).status).toBe(409); // not delivered yet
    await crew.post(`/api/placements/${placement.id}/delivery`, { coloniesDelivered: 30 }).expect(201);
    // 30 colonies: open at least 3 (10%, PDA program / Rutgers).
    const small = await crew.post(`/api/placements/${placement.id}/strength-checks`, { framesOfBees: [8, 7] });
    expect(small.status).toBe(400);
    expect(small.body.error.fields.framesOfBees).toMatch(/at least 3 colonies/);
    const mismatched = await crew.post(`/api/placements/${placement.id}/strength-checks`, { framesOfBees: [8, 7, 5], framesOfBrood: [5] });
    expect(mismatched.status).toBe(400);
    expect(mismatched.body.error.fields).toHaveProperty('framesOfBrood');
    // 8 + 7 + 5 = 20 frames over 3 colonies, average 6.67; one below 6 (1 short), 3 over: passes.
    const res = await crew.post(`/api/placements/${placement.id}/strength-checks`, { framesOfBees: [8, 7, 5], inspectorName: 'Field check' });
    expect(res.status).toBe(201);
    const summary = res.body.placement.strengthChecks[0].summary;
    expect(summary).toMatchObject({ sampled: 3, requiredSample: 3, averageFramesOfBees: 6.67, belowMinimumCount: 1, framesShort: 1, framesOver: 3, meetsAgreement: true });
    expect(summary.belowMinimumShare).toBeCloseTo(1 / 3, 10);
    // The grower's own inspector may record one too: 4, 5, 6 fails (3 short, none over).
    const inspector = await grower.post(`/api/placements/${placement.id}/strength-checks`, { framesOfBees: [4, 5, 6] });
    expect(inspector.status).toBe(201);
    expect(inspector.body.placement.strengthChecks[1].summary.meetsAgreement).toBe(false);
    expect((await apiaryViewer.post(`/api/placements/${placement.id}/strength-checks`, { framesOfBees: [8, 8, 8] })).status).toBe(403);
  });

  it('takes photos that really are JPEG, PNG or WebP, up to 8 MB', async () => {
    const { placement } = await scheduledPlacement(5);
    const ok = await crew.agent.post(`/api/placements/${placement.id}/photos`).set('X-CSRF-Token', crew.csrfToken).field('step', 'delivery').attach('photo', png, { filename: 'drop.png', contentType: 'image/png' });
    expect(ok.status).toBe(201);
    const photo = ok.body.placement.photos[0];
    expect(photo.step).toBe('delivery');
    const fetched = await grower.get(photo.url);
    expect(fetched.status).toBe(200);
    expect(fetched.headers['content-type']).toBe('image/png');
    expect(Buffer.compare(fetched.body as Buffer, png)).toBe(0);

    const fake = await crew.agent.post(`/api/placements/${placement.id}/photos`).set('X-CSRF-Token', crew.csrfToken).attach('photo', Buffer.from('not an image at all'), { filename: 'x.png', contentType: 'image/png' });
    expect(fake.status).toBe(400);
    expect(fake.body.error.fields).toHaveProperty('photo');
    const pdf = await crew.agent.post(`/api/placements/${placement.id}/photos`).set('X-CSRF-Token', crew.csrfToken).attach('photo', Buffer.from('%PDF-1.4'), { filename: 'x.pdf', contentType: 'application/pdf' });
    expect(pdf.status).toBe(400);
    const big = Buffer.concat([png, Buffer.alloc(8 * 1024 * 1024)]);
    const tooBig = await crew.agent.post(`/api/placements/${placement.id}/photos`).set('X-CSRF-Token', crew.csrfToken).attach('photo', big, { filename: 'big.png', contentType: 'image/png' });
    expect(tooBig.status).toBe(413);
    const missing = await crew.post(`/api/placements/${placement.id}/photos`, {});
    expect(missing.status).toBe(400);
    expect((await keeper2.get(photo.url)).status).toBe(404);
  });

  it('picks colonies up, closes the on-site window and completes the agreement when every site is done', async () => {
    const { placement, agreementId } = await scheduledPlacement(20);
    expect((await crew.post(`/api/placements/${placement.id}/pickup`, { coloniesPickedUp: 20 })).status).toBe(409);
    const deliveredAt = new Date(Date.now() - 3 * 86_400_000).toISOString();
    await crew.post(`/api/placements/${placement.id}/delivery`, { coloniesDelivered: 20, deliveredAt }).expect(201);
    const tooMany = await crew.post(`/api/placements/${placement.id}/pickup`, { coloniesPickedUp: 21 });
    expect(tooMany.status).toBe(400);
    expect(tooMany.body.error.fields.coloniesPickedUp).toMatch(/20 dropped off/);
    const early = await crew.post(`/api/placements/${placement.id}/pickup`, { coloniesPickedUp: 20, pickedUpAt: new Date(Date.parse(deliveredAt) - 1000).toISOString() });
    expect(early.status).toBe(400);
    const pickedUpAt = new Date(Date.now() - 60_000).toISOString();
    const pickupAt = new Date();
    const res = await crew.post(`/api/placements/${placement.id}/pickup`, { coloniesPickedUp: 19, pickedUpAt });
    expect(res.status).toBe(201);
    expect(res.body.placement.state).toBe('picked-up');
    expect(res.body.placement.onSite).toEqual({ from: deliveredAt, to: pickedUpAt });
    expect((await grower.get(`/api/agreements/${agreementId}`)).body.agreement.state).toBe('completed');
    await expect.poll(() => recheckRanSince(t, `agreement:${agreementId}`, pickupAt), { timeout: 10_000 }).toBe(true);

    // The grower disputes the count, with a note; crew may not dispute.
    expect((await crew.post(`/api/placements/${placement.id}/dispute`, { step: 'pickup', note: 'x' })).status).toBe(403);
    const empty = await grower.post(`/api/placements/${placement.id}/dispute`, { step: 'pickup', note: '' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields).toHaveProperty('note');
    const disputed = await grower.post(`/api/placements/${placement.id}/dispute`, { step: 'delivery', countedColonies: 18, note: 'We counted 18 pallets at the lane' });
    expect(disputed.status).toBe(200);
    expect(disputed.body.placement.dispute).toMatchObject({ step: 'delivery', countedColonies: 18, note: 'We counted 18 pallets at the lane', byName: 'Gale Orrin' });
    await expect.poll(() => t.sink.messages.some((msg) => msg.to.includes(m.people.crew.email) && /disputed/.test(msg.subject)), { timeout: 10_000 }).toBe(true);
  });
});
