// The runner of the table-driven authorization test: every row of the named row files is
// sent by every caller (each role of a farm and an apiary business, the admin, the owner of
// another farm and of another apiary business, and nobody signed in), and each must get
// exactly the status the row names. The row files are split into groups, one test file a
// group, so the groups run side by side; tests/api/authorization.test.ts checks the groups
// cover every row file and that the rows agree with the policy tables.
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { readdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { startTestApp, type TestApp } from '../../support/test-app.js';
import { apiClient, signedInClient, type ApiClient } from '../../support/api-client.js';
import { buildRoleCast } from '../../support/builders/accounts.js';
import { callers, type AuthzRow, type AuthzRowFile, type AuthzWorld, type Caller, type RowContext } from './authz-row.js';

/** Which row files each test file sends (every row file in exactly one group). */
export const rowFileGroups = {
  accounts: ['auth.rows.ts', 'organization.rows.ts'],
  season: ['blocks.rows.ts', 'dashboard.rows.ts', 'sprays.rows.ts'],
  deals: ['requests.rows.ts', 'invoices.rows.ts'],
} as const;
export type RowFileGroup = keyof typeof rowFileGroups;

const rowsDir = resolve('tests/api/authz');

export const rowFileNames = () => readdirSync(rowsDir).filter((file) => file.endsWith('.rows.ts')).sort();

export async function loadRowFiles(names: readonly string[]) {
  return Promise.all(names.map(async (file) => ({ file, module: (await import(pathToFileURL(join(rowsDir, file)).href)) as AuthzRowFile })));
}

/** A caller the row expects to succeed uses up what it acts on; refused callers use nothing up. */
const succeeds = (row: AuthzRow<unknown>, caller: Caller) => row.expect[caller] < 300;

export async function describeAuthorizationTable(group: RowFileGroup) {
  const rowFiles = await loadRowFiles(rowFileGroups[group]);

  describe(`authorization table: ${group}`, () => {
    let t: TestApp;
    let world: AuthzWorld;
    const clients = new Map<Caller, ApiClient>();
    const fixturesByFile = new Map<string, unknown>();

    const newClientFor = async (caller: Caller) => {
      const user = world.userOf(caller);
      return user ? signedInClient(t.app, user.email) : apiClient(t.app);
    };

    beforeAll(async () => {
      // Every caller signs in, some rows sign in again: keep the sign-in limits out of the way here.
      t = await startTestApp({ config: { loginRateLimit: { perAccount: 10_000, perAddress: 10_000 } } });
      const own = await buildRoleCast('own');
      const other = await buildRoleCast('other');
      world = {
        own,
        other,
        userOf(caller) {
          if (caller === 'signed-out') return null;
          if (caller === 'other-farm') return other.members['farm:owner'];
          if (caller === 'other-apiary') return other.members['apiary:owner'];
          return own.members[caller];
        },
      };
      const signedIn = await Promise.all(callers.map((caller) => newClientFor(caller)));
      callers.forEach((caller, i) => clients.set(caller, signedIn[i]));
      for (const { file, module } of rowFiles) fixturesByFile.set(file, module.setup ? await module.setup(world) : undefined);
    }, 180_000);
    afterAll(async () => { await t?.stop(); });

    /**
     * Fresh fixtures: one set of its own for each caller the row expects to succeed, one set
     * shared by the refused callers (a refused caller that wrongly succeeded would change its
     * own status, and the row fails on it).
     */
    async function sharedFreshFor(row: AuthzRow<unknown>, fixtures: unknown) {
      const refused = callers.find((caller) => !succeeds(row, caller));
      return row.fresh && refused ? row.fresh({ world, fixtures, caller: refused }) : {};
    }

    async function send(row: AuthzRow<unknown>, caller: Caller, fixtures: unknown, sharedFresh: Record<string, string>) {
      const base = { world, fixtures, caller };
      const fresh = row.fresh && succeeds(row, caller) ? await row.fresh(base) : sharedFresh;
      const ctx: RowContext<unknown> = { ...base, fresh };
      const client = row.ownClient ? await newClientFor(caller) : clients.get(caller)!;
      const path = typeof row.path === 'function' ? row.path(ctx) : row.path;
      const body = typeof row.body === 'function' ? row.body(ctx) : row.body;
      const method = row.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
      const res = method === 'get' || method === 'delete' ? await client[method](path) : await client[method](path, body ?? {});
      // As the browser client does: a new CSRF token in an answer replaces the old one.
      if (typeof res.body?.csrfToken === 'string') client.csrfToken = res.body.csrfToken;
      return { status: res.status, unknownRoute: String(res.body?.error?.message ?? '').startsWith('No such API route') };
    }

    for (const { file, module } of rowFiles) {
      describe(file, () => {
        for (const row of module.rows) {
          it(`${row.method} ${typeof row.path === 'string' ? row.path : '(built path)'}: ${row.title}`, async () => {
            // Callers are independent (a caller that succeeds gets fresh fixtures of its own), so they go at once.
            const fixtures = fixturesByFile.get(file);
            const sharedFresh = await sharedFreshFor(row, fixtures);
            const answers = await Promise.all(callers.map((caller) => send(row, caller, fixtures, sharedFresh)));
            const actual = Object.fromEntries(callers.map((caller, i) => [caller, answers[i].status])) as Record<Caller, number>;
            const unknownRoutes = callers.filter((_, i) => answers[i].unknownRoute);
            expect(unknownRoutes, 'the row names a route that does not exist').toEqual([]);
            expect(actual).toEqual(row.expect);
          });
        }
      });
    }
  });
}
