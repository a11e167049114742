// The table-driven authorization test (the runner is tests/api/authz/authorization-table.ts):
// this file sends the account and organization rows, and checks the whole table: the row
// file groups cover every row file once, rows naming a policy action agree with the policy
// table, and every action of every policy table has a row. The season and deals groups are
// sent by authorization-season.test.ts and authorization-deals.test.ts.
import { describe, it, expect } from 'vitest';
import { policyTables } from '../../server/src/modules/policies.js';
import { isAllowed } from '../../server/src/middleware/authenticate.js';
import { allRoleKeys } from '../../shared/roles.js';
import { describeAuthorizationTable, loadRowFiles, rowFileGroups, rowFileNames } from './authz/authorization-table.js';

await describeAuthorizationTable('accounts');

const allRows = (await loadRowFiles(rowFileNames())).flatMap(({ module }) => module.rows);

describe('authorization table: the whole table', () => {
  it('sends every row file in exactly one group', () => {
    const grouped = Object.values(rowFileGroups).flat().sort();
    expect(grouped).toEqual(rowFileNames());
    expect(grouped).toEqual(expect.arrayContaining(['auth.rows.ts', 'organization.rows.ts']));
  });

  it('has rows that agree with the policy tables: 403 exactly for the roles an action leaves out', () => {
    const disagreements: string[] = [];
    for (const row of allRows) {
      if (!row.policy) continue;
      const table = policyTables[row.policy.table];
      if (!(row.policy.action in table)) {
        disagreements.push(`${row.title}: no action ${row.policy.table}.${row.policy.action}`);
        continue;
      }
      for (const role of allRoleKeys) {
        const allowed = isAllowed(table, row.policy.action, role);
        if (allowed === (row.expect[role] === 403)) disagreements.push(`${row.title}: ${role} is ${allowed ? 'allowed' : 'not allowed'} but the row expects ${row.expect[role]}`);
      }
    }
    expect(disagreements).toEqual([]);
  });

  it('has a row for every action of every policy table', () => {
    const covered = new Set(allRows.flatMap((row) => (row.policy ? [`${row.policy.table}.${row.policy.action}`] : [])));
    const missing = Object.entries(policyTables).flatMap(([name, table]) => Object.keys(table).map((action) => `${name}.${action}`)).filter((key) => !covered.has(key));
    expect(missing).toEqual([]);
  });
});
