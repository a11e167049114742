// Another organization's objects answer exactly like missing ones, on every mounted route
// that takes an id (read from the app's own router, so a new route is covered without
// editing this file), PDFs and photos included: another farm, another apiary business and
// each weaker role of the owning organization send every read, change and action on ids
// of the demo's first farm and apiary, and each answer must equal the answer for a random
// id (404, or 403 where the role, not the tenant, is wrong) and name nothing of the object.
// Lists, CSV exports and calendar feeds of the other organizations hold none of its ids.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type request from 'supertest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { apiClient, signedInClient, type ApiClient } from '../support/api-client.js';
import { buildUser } from '../support/builders/accounts.js';
import { buildInvitation } from '../support/builders/invitations.js';
import { buildBlock, buildRequest } from '../support/builders/season.js';
import { seedScenario } from '../../seed/scenario.js';
import { fillPath, mountedRoutes, type MountedRoute } from '../support/route-inventory.js';
import { kindOfField, kindOfParam, ownedIds, type OwnedIds } from '../support/tenant-ids.js';
import { sample, toJsonSchema } from '../support/schema-sample.js';

const today = new Date('2026-12-02T15:00:00Z');
const site = { lon: -120.5, lat: 46.6 };
const weakerFarmRoles = ['farm:manager', 'farm:applicator', 'farm:viewer'] as const;
const weakerApiaryRoles = ['apiary:manager', 'apiary:crew', 'apiary:viewer'] as const;
type Caller = 'farm:owner' | 'apiary:owner' | (typeof weakerFarmRoles)[number] | (typeof weakerApiaryRoles)[number] | 'other-farm' | 'other-apiary';
const onePixelPng = Buffer.from('89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d49444154789c6360000002000154a24f5d0000000049454e44ae426082', 'hex');

/** Parents of objects reached under another object's path (/agreements/:id/amendments/:amendmentId). */
const parentOf: Record<string, string> = {
  amendments: 'SELECT agreement_id AS id FROM agreement_amendments WHERE id = :id',
  photos: 'SELECT placement_id AS id FROM placement_photos WHERE id = :id',
};

interface Answer { status: number; code?: string; message?: string; fields?: Record<string, string>; text: string }

describe('another organization’s objects on every route that takes an id', () => {
  let t: TestApp;
  let routes: MountedRoute[];
  const clients = new Map<Caller, ApiClient>();
  const org = { farm: '', apiary: '', otherFarm: '', otherApiary: '' };
  let owned: { farm: OwnedIds; apiary: OwnedIds; otherFarm: OwnedIds; otherApiary: OwnedIds };
  /** Words that name the first farm and apiary's objects (names, titles, e-mails), which no other organization may see. */
  const secretWords: string[] = [];
  const nameOf = new Map<string, string>();
  const stateOf = new Map<string, string>();

  const query = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) => t.context.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT });

  beforeAll(async () => {
    t = await startTestApp({ now: () => today, config: { loginRateLimit: { perAccount: 10_000, perAddress: 10_000 } } });
    await seedScenario(today);
    routes = mountedRoutes(t.app);
    const orgOf = async (email: string) => (await query<{ id: string }>('SELECT organization_id AS id FROM users WHERE email = :email', { email }))[0].id;
    org.farm = await orgOf('grower@orchard.test');
    org.apiary = await orgOf('keeper@apiary.test');
    org.otherFarm = await orgOf('grower2@ridge.test');
    org.otherApiary = await orgOf('keeper2@hives.test');
    const member = async (organization: string, role: 'manager' | 'viewer', email: string) => (await buildUser({ organization: { id: organization } as never, role, email })).email;
    const emails: Record<Caller, string> = {
      'farm:owner': 'grower@orchard.test',
      'farm:manager': await member(org.farm, 'manager', 'tenant-farm-manager@example.test'),
      'farm:applicator': 'applicator@orchard.test',
      'farm:viewer': await member(org.farm, 'viewer', 'tenant-farm-viewer@example.test'),
      'apiary:owner': 'keeper@apiary.test',
      'apiary:manager': await member(org.apiary, 'manager', 'tenant-apiary-manager@example.test'),
      'apiary:crew': 'crew@apiary.test',
      'apiary:viewer': await member(org.apiary, 'viewer', 'tenant-apiary-viewer@example.test'),
      'other-farm': 'grower2@ridge.test',
      'other-apiary': 'keeper2@hives.test',
    };
    for (const [caller, email] of Object.entries(emails) as Array<[Caller, string]>) clients.set(caller, await signedInClient(t.app, email));

    // What the demo lacks: a placement photo, an amendment waiting for an answer, invitations.
    const [placement] = await query<{ id: string }>(
      "SELECT p.id FROM placements p JOIN agreements a ON a.id = p.agreement_id WHERE a.farm_id = :farm AND a.apiary_id = :apiary AND p.state = 'delivered' ORDER BY p.id LIMIT 1",
      { farm: org.farm, apiary: org.apiary },
    );
    await clients.get('apiary:crew')!.post(`/api/placements/${placement.id}/photos`).field('step', 'delivery').attach('photo', onePixelPng, { filename: 'pallets.png', contentType: 'image/png' }).expect(201);
    const [inForce] = await query<{ id: string }>("SELECT id FROM agreements WHERE farm_id = :farm AND apiary_id = :apiary AND state = 'in-force' ORDER BY id LIMIT 1", { farm: org.farm, apiary: org.apiary });
    await clients.get('farm:owner')!.post(`/api/agreements/${inForce.id}/amendments`, { changes: { noticeHours: 60 }, reason: 'More notice before sprays' }).expect(201);
    await clients.get('farm:owner')!.post('/api/bloom/stage-thresholds', {
      crop: 'apple', variety: 'Honeycrisp', stage: 'king-bloom', label: 'King bloom', baseF: 43, ddLowF: 300, ddHighF: 340, source: 'own observation',
    }).expect(201);
    await buildInvitation({ organization: { id: org.farm }, email: 'tenant-invited-farm@example.test' });
    await buildInvitation({ organization: { id: org.apiary }, email: 'tenant-invited-apiary@example.test' });

    // A closed request of the first farm that no other organization took part in.
    const closedBlock = await buildBlock({ farm: { id: org.farm } as never, name: 'Hidden Bosc block' });
    await buildRequest({ farm: { id: org.farm } as never, blocks: [{ block: closedBlock, colonies: 12 }], state: 'closed', title: 'Hidden Bosc request', onSite: { from: new Date('2027-03-20T07:00:00Z'), to: new Date('2027-04-20T07:00:00Z') } });
    for (const table of ['hive_requests', 'commitments', 'agreements', 'placements', 'spray_plans', 'alerts', 'payments', 'agreement_amendments', 'invoices']) {
      const column = table === 'invoices' ? 'lifecycle' : 'state';
      for (const row of await query<{ id: string; state: string }>(`SELECT id, ${column} AS state FROM ${table}`)) stateOf.set(row.id, row.state);
    }
    owned = {
      farm: await ownedIds(t.context.sequelize, org.farm),
      apiary: await ownedIds(t.context.sequelize, org.apiary),
      otherFarm: await ownedIds(t.context.sequelize, org.otherFarm),
      otherApiary: await ownedIds(t.context.sequelize, org.otherApiary),
    };
    for (const [side, id] of [['farm', org.farm], ['apiary', org.apiary]] as const) {
      owned[side].members = (await query<{ id: string }>("SELECT id FROM users WHERE organization_id = :id AND email LIKE 'tenant-%'", { id })).map((r) => r.id);
    }
    // Every apiary sees open and fully committed requests: those are not the other apiary's foreign objects.
    const open = (await query<{ id: string }>("SELECT id FROM hive_requests WHERE state IN ('listed', 'filled')")).map((r) => r.id);
    owned.otherApiary.requests = [...owned.otherApiary.requests, ...open];

    for (const [sql, kind] of [
      ['SELECT id, name FROM blocks WHERE farm_id = :farm', 'blocks'], ['SELECT id, name FROM weather_stations WHERE farm_id = :farm', 'stations'],
      ['SELECT id, title AS name FROM hive_requests WHERE farm_id = :farm', 'requests'], ['SELECT id, name FROM yards WHERE apiary_id = :apiary', 'yards'],
      ['SELECT id, product_name AS name FROM spray_plans WHERE farm_id = :farm', 'sprays'], ['SELECT id, email AS name FROM users WHERE organization_id IN (:farm, :apiary)', 'members'],
    ] as const) {
      for (const row of await query<{ id: string; name: string }>(sql, { farm: org.farm, apiary: org.apiary })) nameOf.set(`${kind}:${row.id}`, row.name);
    }
    secretWords.push(
      ...(await query<{ name: string }>('SELECT name FROM yards WHERE apiary_id = :apiary', { apiary: org.apiary })).map((r) => r.name),
      ...(await query<{ name: string }>('SELECT name FROM weather_stations WHERE farm_id = :farm', { farm: org.farm })).map((r) => r.name),
      ...(await query<{ name: string }>("SELECT email AS name FROM users WHERE organization_id IN (:farm, :apiary)", { farm: org.farm, apiary: org.apiary })).map((r) => r.name),
    );
  }, 180_000);
  afterAll(async () => { await t?.stop(); });

  /**
   * Ids of the first farm or apiary that neither other organization takes part in, one for
   * each state such objects are in (a closed request may answer differently from an open
   * one), with the organization that owns them.
   */
  function foreignIds(kind: string): Array<{ id: string; side: 'farm' | 'apiary' }> {
    const seenByOthers = new Set([...(owned.otherFarm[kind] ?? []), ...(owned.otherApiary[kind] ?? [])]);
    const byState = new Map<string, { id: string; side: 'farm' | 'apiary' }>();
    for (const side of ['farm', 'apiary'] as const) {
      for (const id of owned[side][kind] ?? []) {
        const state = stateOf.get(id) ?? '';
        if (!seenByOthers.has(id) && !byState.has(state)) byState.set(state, { id, side });
      }
    }
    return [...byState.values()];
  }

  async function pathValues(route: MountedRoute): Promise<Array<{ values: Record<string, string>; kind: string; id: string; side: 'farm' | 'apiary' }>> {
    const idParams = route.params.filter((p) => p !== 'day');
    const last = idParams.at(-1)!;
    const kind = kindOfParam(route.path, last);
    return Promise.all(foreignIds(kind).map(async (found) => {
      const values: Record<string, string> = { day: '2027-04-12', [last]: found.id };
      if (idParams.length === 2) values[idParams[0]] = (await query<{ id: string }>(parentOf[kind], { id: found.id }))[0].id;
      return { values, kind, ...found };
    }));
  }

  const bodyFor = (route: MountedRoute) =>
    route.schemas.body ? sample(toJsonSchema(route.schemas.body), '', { idFor: (field) => owned.farm[kindOfField(field) ?? '']?.[0], site, yesterday: '2026-12-01' }) : undefined;

  async function send(caller: Caller, route: MountedRoute, values: Record<string, string>, body: unknown): Promise<Answer> {
    const client = clients.get(caller)!;
    let req: request.Test = client.agent[route.method.toLowerCase() as 'get'](fillPath(route, values)).set('X-CSRF-Token', client.csrfToken);
    if (route.upload) req = req.field('step', 'delivery').attach(/photo/.test(route.path) ? 'photo' : 'file', onePixelPng, { filename: 'x.png', contentType: 'image/png' });
    else if (body !== undefined && route.method !== 'GET' && route.method !== 'DELETE') req = req.send(body as object);
    const res = await req.buffer(true).parse((r, done) => { const chunks: Buffer[] = []; r.on('data', (c: Buffer) => chunks.push(c)); r.on('end', () => done(null, Buffer.concat(chunks))); });
    const text = (res.body as Buffer).toString('latin1');
    let json: { error?: { code?: string; message?: string; fields?: Record<string, string> } } = {};
    try { json = JSON.parse(text); } catch { /* a PDF, a photo, a CSV or a calendar */ }
    return { status: res.status, code: json.error?.code, message: json.error?.message, fields: json.error?.fields, text };
  }

  const same = (a: Answer, b: Answer, ids: string[]) => {
    const strip = (s?: string) => ids.reduce((out, id) => out?.split(id).join('<id>'), s);
    return a.status === b.status && a.code === b.code && strip(a.message) === strip(b.message) && JSON.stringify(a.fields) === JSON.stringify(b.fields);
  };

  it('answers another farm, another apiary and weaker roles on a foreign id exactly as on a missing one', async () => {
    // Published reference rows (frost critical temperatures) belong to no organization: the admin edits them for everyone.
    const idRoutes = routes.filter((r) => r.params.some((p) => p !== 'day' && p !== 'file') && !r.path.startsWith('/api/webhooks/') && !r.path.startsWith('/api/bloom/frost-critical/'));
    expect(idRoutes.length).toBeGreaterThan(50);
    const problems: string[] = [];
    const withoutIds: string[] = [];
    let foreignAnswers = 0;
    const ordered = [...idRoutes].sort((a, b) => Number(a.method === 'DELETE') - Number(b.method === 'DELETE'));
    for (const route of ordered) {
      const targets = await pathValues(route);
      if (!targets.length) withoutIds.push(`${route.method} ${route.path}`);
      for (const [index, target] of targets.entries()) {
        const label = `${route.method} ${route.path} (${stateOf.get(target.id) ?? target.kind})`;
        const body = bodyFor(route);
        const missing = Object.fromEntries(Object.entries(target.values).map(([k, v]) => [k, k === 'day' ? v : randomUUID()]));
        const words = [target.id, nameOf.get(`${target.kind}:${target.id}`)].filter((w): w is string => Boolean(w && w.length > 3));
        const weaker = target.side === 'farm' ? weakerFarmRoles : weakerApiaryRoles;
        const owner: Caller = target.side === 'farm' ? 'farm:owner' : 'apiary:owner';
        // Every state is sent by the other organizations; the owning organization's roles take the first.
        for (const caller of (index === 0 ? ['other-farm', 'other-apiary', owner, ...weaker] : ['other-farm', 'other-apiary']) as Caller[]) {
          if (caller === owner) {
            // The id is real: the owning organization's owner (or, for the other side's steps, its partner) reaches the object.
            const answer = await send(owner, route, target.values, body);
            const partner = answer.status === 403 ? await send(target.side === 'farm' ? 'apiary:owner' : 'farm:owner', route, target.values, body) : answer;
            if (answer.status === 404 && partner.status === 404) problems.push(`${label}: the owner gets 404 for its own id`);
            continue;
          }
          const [onForeign, onMissing] = [await send(caller, route, target.values, body), await send(caller, route, missing, body)];
          const foreignCaller = caller.startsWith('other-');
          if (onForeign.status >= 500 || onMissing.status >= 500) problems.push(`${label} as ${caller}: ${onForeign.status}/${onMissing.status}`);
          if (foreignCaller) {
            foreignAnswers++;
            if (!same(onForeign, onMissing, [target.id, ...Object.values(missing)])) problems.push(`${label} as ${caller}: foreign ${onForeign.status} ${onForeign.message} but missing ${onMissing.status} ${onMissing.message}`);
            if (![400, 403, 404].includes(onForeign.status)) problems.push(`${label} as ${caller}: foreign id answered ${onForeign.status}`);
          } else if (onMissing.status === 403) {
            // The role, not the tenant, is wrong: the answer cannot depend on the object.
            if (!same(onForeign, onMissing, [target.id, ...Object.values(missing)])) problems.push(`${label} as ${caller}: own ${onForeign.status} but missing ${onMissing.status}`);
          }
          if (foreignCaller || onForeign.status === 403) {
            for (const word of words) if (onForeign.text.includes(word)) problems.push(`${label} as ${caller}: the answer names "${word}"`);
          }
        }
      }
    }
    expect(problems).toEqual([]);
    expect(withoutIds).toEqual([]);
    expect(foreignAnswers).toBeGreaterThan(100);
  }, 240_000);

  it('keeps the first farm and apiary’s ids and names out of the other organizations’ lists, exports and calendar feed', async () => {
    const secretIds = new Map<string, string>();
    for (const kind of ['blocks', 'stations', 'yards', 'agreements', 'placements', 'photos', 'invoices', 'payments', 'invitations', 'members', 'amendments']) {
      for (const side of ['farm', 'apiary'] as const) for (const id of owned[side][kind] ?? []) secretIds.set(id, kind);
    }
    for (const other of [owned.otherFarm, owned.otherApiary]) for (const list of Object.values(other)) for (const id of list) secretIds.delete(id);
    // Blocks of requests open to every apiary, or that the other apiary took part in, are shown with the request.
    const sharedRequests = [...owned.otherApiary.requests, ...owned.otherFarm.requests];
    for (const r of await query<{ id: string }>('SELECT block_id AS id FROM hive_request_blocks WHERE request_id IN (:ids)', { ids: sharedRequests })) secretIds.delete(r.id);
    expect(secretIds.size).toBeGreaterThan(10);

    const feeds = new Map<Caller, string>();
    for (const caller of ['other-farm', 'other-apiary'] as const) {
      const url = (await clients.get(caller)!.post('/api/calendar/token').expect(201)).body.url as string;
      feeds.set(caller, new URL(url).pathname);
    }
    const lists = routes.filter((r) => r.method === 'GET' && r.params.length === 0);
    expect(lists.map((r) => r.path)).toEqual(expect.arrayContaining(['/api/exports/requests.csv', '/api/invoices/export.csv']));
    const leaks: string[] = [];
    let read = 0;
    for (const caller of ['other-farm', 'other-apiary'] as const) {
      for (const path of [...lists.map((r) => r.path), feeds.get(caller)!]) {
        const res = await clients.get(caller)!.agent.get(path).buffer(true).parse((r, done) => { const c: Buffer[] = []; r.on('data', (d: Buffer) => c.push(d)); r.on('end', () => done(null, Buffer.concat(c))); });
        if (res.status >= 500) leaks.push(`${path} as ${caller}: ${res.status}`);
        if (res.status !== 200) continue;
        read++;
        const text = (res.body as Buffer).toString('utf8');
        for (const [id, kind] of secretIds) if (text.includes(id)) leaks.push(`${path} as ${caller} holds ${kind} ${id}`);
        for (const word of secretWords) if (text.includes(word)) leaks.push(`${path} as ${caller} names "${word}"`);
      }
    }
    expect(leaks).toEqual([]);
    expect(read).toBeGreaterThan(20);
  }, 120_000);

  it('answers a retired or made-up calendar token like any unknown one', async () => {
    const keeper = clients.get('apiary:owner')!;
    const first = new URL((await keeper.post('/api/calendar/token').expect(201)).body.url).pathname;
    const fresh = await (await apiClient(t.app)).agent.get(first);
    expect(fresh.status).toBe(200);
    expect(fresh.text).toContain('BEGIN:VCALENDAR');
    await keeper.post('/api/calendar/token').expect(201);
    const anonymous = await apiClient(t.app);
    const retired = await anonymous.agent.get(first);
    const madeUp = await anonymous.agent.get(`/api/calendar/feed/${'Q'.repeat(32)}.ics`);
    expect(retired.status).toBe(404);
    expect({ status: retired.status, body: retired.body }).toEqual({ status: madeUp.status, body: madeUp.body });
  });
});
