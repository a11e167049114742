// Hostile and careless input on every mounted route, read from the app's own router (a new
// route is covered without editing this file): wrong types per field, missing and non-JSON
// bodies, 100k-character strings, deep nesting, arrays for objects, NaN / Infinity / 1e309 /
// -1 / 2^53, impossible and out-of-range dates, odd ids and SQL fragments, invalid GeoJSON,
// binary, cut-short and oversized uploads, repeated query keys. Signed in as a role that can
// reach the route, and signed out. No answer may be a 5xx, and every 400 names the field.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { randomUUID } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import type request from 'supertest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { apiClient, signedInClient, type ApiClient } from '../support/api-client.js';
import { buildUser } from '../support/builders/accounts.js';
import { buildInvitation } from '../support/builders/invitations.js';
import { seedScenario } from '../../seed/scenario.js';
import { fillPath, mountedRoutes, type MountedRoute } from '../support/route-inventory.js';
import { kindOfField, kindOfParam, ownedIds, type OwnedIds } from '../support/tenant-ids.js';
import { fieldPaths, mainOption, sample, squareRing, toJsonSchema, withField, type FieldPath, type JsonSchema } from '../support/schema-sample.js';
import type { RoleKey } from '../../shared/roles.js';

const today = new Date('2026-12-02T15:00:00Z');
const yesterday = '2026-12-01';
const site = { lon: -120.5, lat: 46.6 };
const RAW = (token: string) => `__raw__${token}__`;
const long = 'x'.repeat(100_000);
const deep = (levels: number) => JSON.parse('{"a":'.repeat(levels) + '1' + '}'.repeat(levels));

/** Replacement values by what a field holds. RAW(...) values are written into the JSON text as they are. */
function hostileValues(node: JsonSchema): unknown[] {
  const main = mainOption(node);
  const all = allHostileValues(node);
  // Dates and shapes get every value (that is where the database refuses); other fields a
  // wrong type and one more value, rotating over the fields so each value is still sent.
  if (main.format === 'date' || main.format === 'date-time' || main.properties?.type?.const) return [null, ...all];
  const [wrongType, ...others] = all;
  return [null, wrongType, ...(others.length ? [others[rotation++ % others.length]] : [])];
}
let rotation = 0;

function allHostileValues(node: JsonSchema): unknown[] {
  const main = mainOption(node);
  const type = Array.isArray(main.type) ? main.type[0] : main.type;
  const values: unknown[] = [];
  if (main.properties?.type?.const === 'Polygon') {
    return [...values, 'Polygon',
      { type: 'Polygon', coordinates: [[[0, 0], [1, 1], [1, 0], [0, 1], [0, 0]]] }, // self-intersecting (a bow tie)
      { type: 'Polygon', coordinates: [[[site.lon, site.lat]]] }, // one point
      { type: 'Polygon', coordinates: [[[200, 95], [201, 95], [201, 96], [200, 95]]] }, // out of range
      { type: 'Polygon', coordinates: [[[-180, -90], [180, -90], [180, 90], [-180, 90], [-180, -90]]] }, // the whole world
      { type: 'Polygon', coordinates: [squareRing(site.lon, site.lat, 2)] }, // a square of about 150 km a side
      { type: 'Point', coordinates: [site.lon, site.lat] }];
  }
  if (main.properties?.type?.const === 'Point') {
    return [...values, [site.lon, site.lat], { type: 'Point', coordinates: [190, 100] }, { type: 'Point', coordinates: [1] },
      { type: 'Point', coordinates: [RAW('NaN'), 0] }, { type: 'Point', coordinates: [RAW('1e309'), 0] }];
  }
  switch (type) {
    case 'string':
      if (main.format === 'uuid') return [...values, 42, 'abc', '-1', '0', '12345678901234567890', "1' OR '1'='1", randomUUID()];
      if (main.format === 'date') return [...values, 20260101, '0000-01-01', '2026-02-30', '9999-12-31'];
      if (main.format === 'date-time') return [...values, 1e12, '0000-01-01T00:00:00Z', '2026-02-30T08:00:00Z', '9999-12-31T23:59:59Z', '2026-04-12 08:00'];
      return [...values, 12345, { nested: ['x'] }, long, 'before\u0000after', "'; DROP TABLE blocks; --"];
    case 'number': case 'integer':
      return [...values, '12', -1, 0.5, 2 ** 53, RAW('1e309'), RAW('-1e309')];
    case 'boolean':
      return [...values, 'true'];
    case 'array':
      return [...values, 'not a list', Array.from({ length: 5000 }, () => 1), [[[]]]];
    case 'object':
      return [...values, 'text', [{}], deep(200)];
    default:
      return [...values, long, 'before\u0000after'];
  }
}

const paramValues = (name: string) =>
  ['abc', '-1', '0', '12345678901234567890', "1' OR '1'='1", ...(name === 'day' ? ['0000-01-01', '2026-02-30', '9999-12-31'] : ['%00', 'a'.repeat(2000)])];

const queryValues = ['0000-01-01', '9999-12-31', '2026-02-30', '-1', '1e309', "' OR 1=1 --", 'a\u0000b', 'x'.repeat(4000)];

interface Sent { route: MountedRoute; what: string; field?: string; strict?: boolean; status: number; ms: number; body: { error?: { code?: string; message?: string; fields?: Record<string, string> } } }

describe('fuzz over every mounted route', () => {
  let t: TestApp;
  let routes: MountedRoute[];
  const clients = new Map<RoleKey, ApiClient>();
  const ids = new Map<RoleKey, OwnedIds>();
  const sent: Sent[] = [];

  beforeAll(async () => {
    t = await startTestApp({ now: () => today, config: { loginRateLimit: { perAccount: 100_000, perAddress: 100_000 } } });
    await seedScenario(today);
    routes = mountedRoutes(t.app);
    const [farm] = await t.context.sequelize.query<{ id: string; apiary: string }>(
      "SELECT organization_id AS id, (SELECT organization_id FROM users WHERE email = 'keeper@apiary.test') AS apiary FROM users WHERE email = 'grower@orchard.test'",
      { type: QueryTypes.SELECT },
    );
    const org = (kind: 'farm' | 'apiary') => ({ id: kind === 'farm' ? farm.id : farm.apiary }) as never;
    const emails: Record<RoleKey, string> = {
      'farm:owner': 'grower@orchard.test',
      'farm:manager': (await buildUser({ organization: org('farm'), role: 'manager', email: 'fuzz-farm-manager@example.test' })).email,
      'farm:applicator': 'applicator@orchard.test',
      'farm:viewer': (await buildUser({ organization: org('farm'), role: 'viewer', email: 'fuzz-farm-viewer@example.test' })).email,
      'apiary:owner': 'keeper@apiary.test',
      'apiary:manager': (await buildUser({ organization: org('apiary'), role: 'manager', email: 'fuzz-apiary-manager@example.test' })).email,
      'apiary:crew': 'crew@apiary.test',
      'apiary:viewer': (await buildUser({ organization: org('apiary'), role: 'viewer', email: 'fuzz-apiary-viewer@example.test' })).email,
      admin: 'admin@pollenpact.test',
    };
    // Members and invitations the fuzz may change or remove, so the callers keep their own accounts.
    const spareFarmMember = await buildUser({ organization: org('farm'), role: 'viewer', email: 'fuzz-spare-farm@example.test' });
    const spareApiaryMember = await buildUser({ organization: org('apiary'), role: 'viewer', email: 'fuzz-spare-apiary@example.test' });
    const farmInvitation = await buildInvitation({ organization: org('farm'), email: 'fuzz-invited-farm@example.test' });
    const apiaryInvitation = await buildInvitation({ organization: org('apiary'), email: 'fuzz-invited-apiary@example.test' });
    const farmIds = await ownedIds(t.context.sequelize, farm.id);
    const apiaryIds = await ownedIds(t.context.sequelize, farm.apiary);
    farmIds.members = [spareFarmMember.id];
    apiaryIds.members = [spareApiaryMember.id];
    farmIds.invitations = [farmInvitation.invitation.id];
    apiaryIds.invitations = [apiaryInvitation.invitation.id];
    const [feed] = await t.context.sequelize.query<{ token: string | null }>("SELECT calendar_token AS token FROM users WHERE email = 'keeper@apiary.test'", { type: QueryTypes.SELECT });
    for (const [role, email] of Object.entries(emails) as Array<[RoleKey, string]>) {
      clients.set(role, await signedInClient(t.app, email));
      const own = role.startsWith('farm:') ? farmIds : role.startsWith('apiary:') ? apiaryIds : await ownedIds(t.context.sequelize, randomUUID());
      ids.set(role, { ...own, feeds: feed?.token ? [`${feed.token}.ics`] : [] });
    }
  }, 180_000);
  afterAll(async () => { await t?.stop(); });

  const idFor = (role: RoleKey | null, kind: string | null) => (role && kind ? ids.get(role)?.[kind]?.[0] : undefined);

  function paramsFor(route: MountedRoute, role: RoleKey | null): Record<string, string> {
    return Object.fromEntries(route.params.map((p) => {
      if (p === 'day') return [p, '2027-04-12'];
      if (p === 'file') return [p, idFor(role, 'feeds') ?? `${'a'.repeat(32)}.ics`];
      return [p, idFor(role, kindOfParam(route.path, p)) ?? randomUUID()];
    }));
  }

  function baseBody(route: MountedRoute, role: RoleKey | null): unknown {
    if (!route.schemas.body) return {};
    return sample(toJsonSchema(route.schemas.body), '', { idFor: (field) => idFor(role, kindOfField(field)), site, yesterday });
  }

  function baseQuery(route: MountedRoute, role: RoleKey | null): Record<string, string> {
    if (!route.schemas.query) return {};
    const node = mainOption(toJsonSchema(route.schemas.query));
    const out: Record<string, string> = {};
    for (const [key, child] of Object.entries(node.properties ?? {})) {
      if (!(node.required ?? []).includes(key)) continue;
      const value = sample(child, key, { idFor: (field) => idFor(role, kindOfField(field)), site, yesterday });
      out[key] = String(value);
    }
    return out;
  }

  /** Sends one request; body is a value (sent as JSON), a raw string with a content type, or a multipart builder. */
  async function send(
    client: ApiClient,
    route: MountedRoute,
    what: string,
    opts: { params?: Record<string, string>; query?: string; body?: unknown; raw?: { type: string; text: string | Buffer }; multipart?: (req: request.Test) => request.Test; field?: string; strict?: boolean },
  ) {
    const url = fillPath(route, opts.params ?? {}) + (opts.query ? `?${opts.query}` : '');
    let req = client.agent[route.method.toLowerCase() as 'get'](url).set('X-CSRF-Token', client.csrfToken);
    if (opts.multipart) req = opts.multipart(req);
    else if (opts.raw) req = req.set('Content-Type', opts.raw.type).send(opts.raw.text as string);
    else if (opts.body !== undefined) {
      let text = JSON.stringify(opts.body);
      text = text.replace(/"__raw__(.+?)__"/g, '$1');
      req = req.set('Content-Type', 'application/json').send(text);
    }
    const started = Date.now();
    const res = await req;
    // As the browser client does: a new CSRF token in an answer replaces the old one.
    if (typeof res.body?.csrfToken === 'string') client.csrfToken = res.body.csrfToken;
    sent.push({ route, what, field: opts.field, strict: opts.strict, status: res.status, ms: Date.now() - started, body: res.body ?? {} });
    return res;
  }

  async function pool<T>(items: T[], width: number, work: (item: T) => Promise<unknown>) {
    let next = 0;
    await Promise.all(Array.from({ length: width }, async () => {
      while (next < items.length) await work(items[next++]);
    }));
  }

  /** The first role that gets past the route's guard (403 and 401 mean it does not), or null for a public route. */
  async function reachingRole(route: MountedRoute, signedOut: ApiClient): Promise<RoleKey | null | 'none'> {
    const probe = await send(signedOut, route, 'probe signed out', { params: paramsFor(route, null), body: route.method === 'GET' ? undefined : {} });
    if (probe.status !== 401) return null;
    for (const role of ['farm:owner', 'apiary:owner', 'admin', 'farm:manager', 'farm:applicator', 'apiary:manager', 'apiary:crew', 'farm:viewer', 'apiary:viewer'] as RoleKey[]) {
      const res = await send(clients.get(role)!, route, `probe as ${role}`, { params: paramsFor(route, role), body: route.method === 'GET' ? undefined : {} });
      if (res.body?.error?.code !== 'forbidden' && res.status !== 401) return role;
    }
    return 'none';
  }

  function uploads(route: MountedRoute): Array<{ what: string; build: (r: request.Test) => request.Test }> {
    const fileField = /photo/.test(route.path) ? 'photo' : 'file';
    const csv = (text: string) => (r: request.Test) => r.field('unit', 'C').field('step', 'delivery').attach(fileField, Buffer.from(text), { filename: 'fuzz.csv', contentType: 'text/csv' });
    const boundary = '----fuzzboundary';
    const head = `--${boundary}\r\nContent-Disposition: form-data; name="${fileField}"; filename="f.csv"\r\nContent-Type: text/csv\r\n\r\ndate,min,max\r\n2027-04-01,1,`;
    return [
      { what: 'binary file', build: (r) => r.attach(fileField, Buffer.from(Array.from({ length: 4096 }, (_, i) => (i * 97) % 256)), { filename: 'noise.bin', contentType: 'application/octet-stream' }) },
      { what: 'binary file named as an image', build: (r) => r.field('step', 'delivery').attach(fileField, Buffer.from([0, 1, 2, 3, 255, 254]), { filename: 'x.jpg', contentType: 'image/jpeg' }) },
      { what: 'oversized file', build: (r) => r.attach(fileField, Buffer.alloc(9 * 1024 * 1024, 0x41), { filename: 'big.csv', contentType: 'text/csv' }) },
      { what: 'two files', build: (r) => r.attach(fileField, Buffer.from('a'), 'a.csv').attach(fileField, Buffer.from('b'), 'b.csv') },
      { what: 'file under another field name', build: (r) => r.attach('other', Buffer.from('a'), 'a.csv') },
      { what: 'no file', build: (r) => r.field('unit', 'C') },
      { what: 'multipart without a boundary', build: (r) => r.set('Content-Type', 'multipart/form-data').send('--x\r\nContent-Disposition: form-data; name="file"\r\n\r\nabc\r\n--x--') },
      { what: 'multipart cut short', build: (r) => r.set('Content-Type', `multipart/form-data; boundary=${boundary}`).send(head) },
      { what: 'multipart with a broken header', build: (r) => r.set('Content-Type', `multipart/form-data; boundary=${boundary}`).send(`--${boundary}\r\nContent-Disposition: form-data\r\n\r\nabc\r\n--${boundary}--\r\n`) },
      { what: 'CSV line in year 0000', build: csv('date,min,max,low\n0000-01-01,1,10,1\n2027-03-01,1,10,1\n') },
      { what: 'CSV line in year 9999', build: csv('date,min,max,low\n9999-12-31,1,10,1\n') },
      { what: 'CSV with a NUL', build: csv('date,min,max,low\n2027-03-01,1\u0000,10,1\n') },
      { what: 'CSV of 1e309 readings', build: csv('date,min,max,low\n2027-03-01,1e309,1e309,1e309\n') },
      { what: 'CSV of no lines', build: csv('') },
      { what: 'CSV unit wrong', build: (r) => r.field('unit', 'kelvin\u0000').attach(fileField, Buffer.from('date,min,max,low\n2027-03-01,1,2,1\n'), 'a.csv') },
    ];
  }

  async function fuzzRoute(route: MountedRoute, role: RoleKey | null, client: () => Promise<ApiClient>, deepFields: boolean) {
    const params = paramsFor(route, role);
    const query = new URLSearchParams(baseQuery(route, role)).toString();
    const body = baseBody(route, role);
    const jobs: Array<() => Promise<unknown>> = [];
    const add = (what: string, opts: Parameters<typeof send>[3]) => jobs.push(async () => send(await client(), route, what, { params, query, ...opts }));

    const hasBody = route.method !== 'GET' && route.method !== 'DELETE';
    add('the base request', { body: hasBody ? body : undefined });
    if (!deepFields) {
      // Signed out: the guard answers first, whatever the input.
      for (const param of route.params) add(`path ${param}=abc`, { params: { ...params, [param]: 'abc' }, field: param });
      if (hasBody) add('broken JSON', { raw: { type: 'application/json', text: '{"name": "a",' } });
      if (route.upload) add('upload: multipart cut short', { multipart: uploads(route).find((u) => u.what === 'multipart cut short')!.build });
      return pool(jobs, 6, (job) => job());
    }
    for (const param of route.params) for (const value of paramValues(param)) add(`path ${param}=${value.slice(0, 40)}`, { params: { ...params, [param]: value }, body: hasBody ? body : undefined, field: param });
    add('repeated query keys', { query: `${query}&${query || 'x=1'}&x=1&x=2` });
    if (route.schemas.query) {
      const node = mainOption(toJsonSchema(route.schemas.query));
      for (const key of Object.keys(node.properties ?? {})) {
        for (const value of queryValues) {
          const q = new URLSearchParams(baseQuery(route, role));
          q.set(key, value);
          add(`query ${key}=${value.slice(0, 30)}`, { query: q.toString(), field: key });
        }
        add(`query ${key} repeated`, { query: `${query}&${key}=1&${key}=2`, field: key });
      }
    }
    if (hasBody) {
      add('no body', {});
      add('not JSON', { raw: { type: 'text/plain', text: 'colonies=5&hello' } });
      add('broken JSON', { raw: { type: 'application/json', text: '{"name": "a",' } });
      add('NaN in JSON', { raw: { type: 'application/json', text: '{"value": NaN}' } });
      add('Infinity in JSON', { raw: { type: 'application/json', text: '[Infinity]' } });
      add('JSON null', { raw: { type: 'application/json', text: 'null' } });
      add('array for the body', { body: [body] });
      add('string for the body', { body: 'body' });
      add('deeply nested body', { raw: { type: 'application/json', text: '{"a":'.repeat(5000) + '1' + '}'.repeat(5000) } });
      add('deeply nested list', { raw: { type: 'application/json', text: '['.repeat(100_000) + ']'.repeat(100_000) } });
      add('NUL in a key', { body: { ...(body as object), 'na\u0000me': 'x' } });
      if (deepFields && route.schemas.body) {
        for (const { path, node } of fieldPaths(toJsonSchema(route.schemas.body))) {
          for (const [index, value] of hostileValues(node).entries()) {
            // The first two are null and a value of the wrong JSON type: their 400 must name this very field.
            add(`body ${path.join('.')}=${JSON.stringify(value)?.slice(0, 40)}`, { body: withField(body, path, value), field: String(path[0]), strict: index < 2 });
          }
          add(`body ${path.join('.')} missing`, { body: withField(body, path, undefined), field: String(path[0]) });
        }
      }
    }
    if (route.upload) for (const u of uploads(route)) add(`upload: ${u.what}`, { multipart: u.build });
    await pool(jobs, 6, (job) => job());
  }

  it('finds the routes of every feature in the router', () => {
    const prefixes = new Set(routes.map((r) => r.path.split('/')[2]));
    expect([...prefixes]).toEqual(expect.arrayContaining(['auth', 'blocks', 'weather', 'requests', 'placements', 'sprays', 'alerts', 'invoices', 'payments', 'organization']));
    expect(routes.length).toBeGreaterThan(100);
  });

  it('answers hostile input on every route without a server error, and names the field of every 400', async () => {
    const signedOut = await apiClient(t.app);
    // Routes that take something away run last, so the rest see the demo's objects.
    const ordered = [...routes].sort((a, b) => Number(a.method === 'DELETE') - Number(b.method === 'DELETE'));
    const unreachable: string[] = [];
    for (const route of ordered) {
      if (route.path === '/api/auth/logout') continue; // fuzzed signed out below: it would end the caller's session
      const role = await reachingRole(route, signedOut);
      if (role === 'none') { unreachable.push(`${route.method} ${route.path}`); continue; }
      if (role === null) {
        // A public route: a fresh client each time, as a request may sign it in.
        await fuzzRoute(route, null, () => apiClient(t.app), true);
      } else {
        await fuzzRoute(route, role, async () => clients.get(role)!, true);
        await fuzzRoute(route, null, async () => signedOut, false);
      }
    }
    await fuzzRoute(routes.find((r) => r.path === '/api/auth/logout')!, null, () => apiClient(t.app), true);

    if (process.env.FUZZ_DUMP) (await import('node:fs')).writeFileSync(process.env.FUZZ_DUMP, JSON.stringify(sent.map((s) => ({ ...s, route: `${s.route.method} ${s.route.path}` }))));
    const label = (s: Sent) => `${s.route.method} ${s.route.path} [${s.what}] -> ${s.status} ${JSON.stringify(s.body).slice(0, 200)}`;
    const serverErrors = sent.filter((s) => s.status >= 500);
    expect(serverErrors.map(label)).toEqual([]);

    // The payment webhook is called by the payment service, not by a form: its 400 says the signature failed.
    const unnamed = sent.filter((s) => s.status === 400 && !s.route.path.startsWith('/api/webhooks/')).filter((s) => {
      const fields = Object.keys(s.body.error?.fields ?? {});
      return fields.length === 0 && !(s.field && s.body.error?.message?.includes(s.field));
    });
    expect(unnamed.map(label)).toEqual([]);

    // Where the unspoiled request (signed in: the first sent) got past validation, a 400 after
    // giving one field null or a value of the wrong type names that field.
    const baseStatus = new Map<string, Sent>();
    for (const s of sent) if (s.what === 'the base request' && !baseStatus.has(`${s.route.method} ${s.route.path}`)) baseStatus.set(`${s.route.method} ${s.route.path}`, s);
    const misnamed = sent.filter((s) => {
      if (s.status !== 400 || !s.field || !s.strict) return false;
      const base = baseStatus.get(`${s.route.method} ${s.route.path}`);
      if (!base || base.status === 400) return false;
      const fields = Object.keys(s.body.error?.fields ?? {});
      return !fields.some((f) => f === s.field || f.startsWith(`${s.field}.`)) && !s.body.error?.message?.includes(s.field);
    });
    expect(misnamed.map(label)).toEqual([]);

    expect(unreachable).toEqual([]);
    // Bounded: a few thousand requests.
    expect(sent.length).toBeGreaterThan(2000);
    expect(sent.length).toBeLessThan(12_000);
    console.info(`fuzz: ${sent.length} requests over ${routes.length} routes; ${[...baseStatus.values()].filter((s) => s.status < 300).length} base requests passed`);
    // About 25 s for some 3,300 requests on a quiet two-core machine; the limit leaves room for one busy with other suites.
  }, 600_000);
});
