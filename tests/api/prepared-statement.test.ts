// The prepared-statement path of the raw-SQL helper (server/src/db/query-rows.ts): named
// parameters become positional ones, the rows match those of an ordinary query, a missing
// value is refused before anything is sent, and inside a transaction it runs on the
// transaction's own connection (it sees the transaction's uncommitted rows).
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { startTestApp, type TestApp } from '../support/test-app.js';
import { prepareStatement, queryPrepared, queryRows } from '../../server/src/db/query-rows.js';
import { buildOrganization } from '../support/builders/accounts.js';

describe('prepared statements', () => {
  let t: TestApp;
  beforeAll(async () => { t = await startTestApp({ env: { JOBS_ENABLED: 'false' } }); });
  afterAll(async () => { await t?.stop(); });

  it('numbers named parameters in the order first met, reusing a repeated one', () => {
    const s = prepareStatement('numbering', 'SELECT $b::int + $a::int AS x, $b::int AS y, $a_b::text AS z');
    expect(s.text).toBe('SELECT $1::int + $2::int AS x, $1::int AS y, $3::text AS z');
    expect(s.params).toEqual(['b', 'a', 'a_b']);
  });

  it('gives the rows an ordinary query gives, on every call', async () => {
    const org = await buildOrganization({ kind: 'farm', name: 'Prepared farm' });
    const sql = 'SELECT id, name, $kinds::text[] AS kinds, created_at < $until AS before FROM organizations WHERE id = $id';
    const bind = { id: org.id, kinds: ['farm', 'apiary'], until: new Date(Date.now() + 60_000) };
    const statement = prepareStatement('prepared-test-rows', sql);
    const expected = await queryRows(t.context.sequelize, sql, { bind });
    expect(expected).toEqual([{ id: org.id, name: 'Prepared farm', kinds: ['farm', 'apiary'], before: true }]);
    for (let i = 0; i < 7; i += 1) expect(await queryPrepared(t.context.sequelize, statement, bind)).toEqual(expected);
  });

  it('refuses a missing value, naming it', async () => {
    const statement = prepareStatement('prepared-test-missing', 'SELECT $id::uuid AS id, $name::text AS name');
    await expect(queryPrepared(t.context.sequelize, statement, { id: null })).rejects.toThrow('prepared-test-missing: no value for $name');
  });

  it('runs on the transaction\'s connection', async () => {
    const statement = prepareStatement('prepared-test-tx', 'SELECT count(*)::int AS n FROM organizations WHERE name = $name');
    const seen = await t.context.sequelize.transaction(async (transaction) => {
      await t.context.models.Organization.create({ kind: 'apiary', name: 'Uncommitted apiary', timeZone: 'America/Los_Angeles', taxRateBp: 0 }, { transaction });
      return {
        inside: await queryPrepared<{ n: number }>(t.context.sequelize, statement, { name: 'Uncommitted apiary' }, transaction),
        outside: await queryPrepared<{ n: number }>(t.context.sequelize, statement, { name: 'Uncommitted apiary' }),
      };
    });
    expect(seen).toEqual({ inside: [{ n: 1 }], outside: [{ n: 0 }] });
  });
});
