// The private iCalendar feed (RFC 5545) and the CSV exports.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { parse } from 'csv-parse/sync';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { apiClient, signedInClient, type ApiClient } from '../support/api-client.js';
import { agreementMadeAt, buildMarket, requestPayload } from '../support/builders/requests.js';
import { planSpray, sprayInput } from '../support/builders/sprays.js';

/** Unfolds RFC 5545 content lines (CRLF followed by a space continues the line). */
const unfold = (ics: string) => ics.replace(/\r\n[ \t]/g, '').split('\r\n');

describe('calendar feed and exports', () => {
  let t: TestApp;
  let m: Awaited<ReturnType<typeof buildMarket>>;
  let grower: ApiClient, keeper: ApiClient, crew: ApiClient, viewer: ApiClient;
  let agreementId: string;

  beforeAll(async () => {
    t = await startTestApp();
    m = await buildMarket();
    grower = await signedInClient(t.app, m.people.grower.email);
    keeper = await signedInClient(t.app, m.people.keeper.email);
    crew = await signedInClient(t.app, m.people.crew.email);
    viewer = await signedInClient(t.app, m.people.farmViewer.email);
    const r = (await grower.post('/api/requests', requestPayload(m.block.id, { title: 'Feed galas, "north"' }, m)).expect(201)).body.request;
    await grower.post(`/api/requests/${r.id}/publish`).expect(200);
    const c = (await keeper.post(`/api/requests/${r.id}/commitments`, { colonies: 40 }).expect(201)).body.commitment;
    agreementId = c.agreementId;
    await grower.post(`/api/agreements/${agreementId}/confirm`).expect(200);
    await keeper.post(`/api/agreements/${agreementId}/confirm`).expect(200);
    await agreementMadeAt({ id: agreementId }, new Date('2026-11-23T15:30:00.000Z')); // before the drop-off below
    const placement = (await crew.get(`/api/placements?agreementId=${agreementId}`)).body.placements[0];
    await crew.post(`/api/placements/${placement.id}/delivery`, { coloniesDelivered: 36, deliveredAt: '2026-11-30T15:30:00.000Z' }).expect(201);
  });
  afterAll(async () => { await t?.stop(); });

  it('puts spray windows in the farm\'s feed and, when the spray raised an alert for it, in the beekeeper\'s', async () => {
    const startsAt = new Date(Date.now() + 3 * 86_400_000);
    await planSpray(t.context, m.people.grower, sprayInput({ blockIds: [m.block.id], startsAt, productName: 'Feed Test 4F' }));
    const feedOf = async (client: ApiClient) => {
      const { url } = (await client.post('/api/calendar/token')).body;
      return unfold((await (await apiClient(t.app)).get(new URL(url).pathname).expect(200)).text);
    };
    const sprayLine = /^SUMMARY:Spray planned: Feed Test 4F · North Galas/;
    expect((await feedOf(grower)).some((l) => sprayLine.test(l))).toBe(true);
    expect((await feedOf(keeper)).some((l) => sprayLine.test(l))).toBe(true);
    await t.context.sequelize.query("UPDATE spray_plans SET state = 'cancelled' WHERE product_name = 'Feed Test 4F'");
    expect((await feedOf(grower)).some((l) => sprayLine.test(l))).toBe(false);
  });

  it('gives each user a private feed URL that works without a session and can be replaced', async () => {
    expect((await crew.get('/api/calendar')).body.url).toBeNull();
    const { url } = (await crew.post('/api/calendar/token')).body;
    expect(url).toMatch(/\/api\/calendar\/feed\/[A-Za-z0-9_-]{32}\.ics$/);
    const path = new URL(url).pathname;
    const anonymous = await apiClient(t.app);
    const res = await anonymous.get(path);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/^text\/calendar/);
    const lines = unfold(res.text);
    // RFC 5545 §3.4, §3.6.1, §3.7: a VCALENDAR with VERSION 2.0 and PRODID, each VEVENT with UID, DTSTAMP, DTSTART.
    expect(lines[0]).toBe('BEGIN:VCALENDAR');
    expect(lines).toContain('VERSION:2.0');
    expect(lines.some((l) => l.startsWith('PRODID:'))).toBe(true);
    const events = res.text.split('BEGIN:VEVENT').slice(1);
    expect(events.length).toBe(3); // expected drop-off, expected pickup, the confirmed delivery
    for (const e of events) for (const prop of ['UID:', 'DTSTAMP:', 'DTSTART']) expect(e).toContain(prop);
    const summaries = lines.filter((l) => l.startsWith('SUMMARY:'));
    expect(summaries).toEqual(expect.arrayContaining([
      expect.stringMatching(/^SUMMARY:Expected drop-off: 40 colonies · Feed galas/),
      expect.stringMatching(/^SUMMARY:Expected pickup: 40 colonies/),
      'SUMMARY:Dropped off: 36 colonies at North lane',
    ]));
    // The delivery at 15:30 UTC, as a UTC date-time (RFC 5545 §3.3.5, form 2: trailing Z).
    expect(lines).toContain('DTSTART:20261130T153000Z');

    const renewed = (await crew.post('/api/calendar/token')).body.url;
    expect(renewed).not.toBe(url);
    expect((await anonymous.get(path)).status).toBe(404);
    expect((await anonymous.get(new URL(renewed).pathname)).status).toBe(200);
    expect((await anonymous.get('/api/calendar/feed/short.ics')).status).toBe(400);
    expect((await anonymous.get('/api/calendar')).status).toBe(401);
  });

  it('exports requests, agreements and placements as CSV that a CSV parser reads back', async () => {
    const requests = await grower.get('/api/exports/requests.csv');
    expect(requests.status).toBe(200);
    expect(requests.headers['content-type']).toMatch(/^text\/csv/);
    const rows = parse(requests.text, { columns: true }) as Array<Record<string, string>>;
    const row = rows.find((r) => r.title === 'Feed galas, "north"')!;
    expect(row).toMatchObject({ state: 'Open for commitments', colonies_requested: '60', colonies_committed: '40', price_per_colony: '70.00', crops: 'Apple' });

    const agreements = parse((await keeper.get('/api/exports/agreements.csv')).text, { columns: true }) as Array<Record<string, string>>;
    expect(agreements).toHaveLength(1);
    expect(agreements[0]).toMatchObject({ id: agreementId, state: 'Confirmed by both', colonies: '40' });

    const placements = parse((await grower.get('/api/exports/placements.csv')).text, { columns: true }) as Array<Record<string, string>>;
    expect(placements.map((p) => [p.drop_site, p.state, p.colonies_dropped_off])).toEqual([['South gate', 'Not yet dropped off', ''], ['North lane', 'On site', '36']]);

    expect((await viewer.get('/api/exports/requests.csv')).status).toBe(403);
    expect((await crew.get('/api/exports/placements.csv')).status).toBe(403);
  });
});
