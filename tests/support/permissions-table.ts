// Renders every policy table (server/src/modules/policies.ts) as the Markdown table in the
// "Permissions" section of DEVELOPERS.md. Print it with
//   node --import tsx tests/support/permissions-table.ts
// and paste it between the permissions markers; tests/domain/permissions-doc.test.ts checks they match.
import { pathToFileURL } from 'node:url';
import { policyTables } from '../../server/src/modules/policies.js';
import { isAllowed } from '../../server/src/middleware/authenticate.js';
import { allRoleKeys, type RoleKey } from '../../shared/roles.js';
import { memberRoleSet } from '../../shared/labels/organizations.js';

export const permissionsStart = '<!-- permissions:start (generated from server/src/modules/policies.ts) -->';
export const permissionsEnd = '<!-- permissions:end -->';

const columnLabel = (role: RoleKey) => (role === 'admin' ? 'admin' : `${role.split(':')[0]} ${memberRoleSet.labels[role.split(':')[1] as keyof typeof memberRoleSet.labels].toLowerCase()}`);

export function renderPermissionsTable(): string {
  const header = `| feature · action | ${allRoleKeys.map(columnLabel).join(' | ')} |`;
  const rule = `|---|${allRoleKeys.map(() => ':-:').join('|')}|`;
  const rows = Object.entries(policyTables).flatMap(([feature, table]) =>
    Object.keys(table).map((action) => `| ${feature} · ${action} | ${allRoleKeys.map((role) => (isAllowed(table, action, role) ? '✓' : '')).join(' | ')} |`),
  );
  return [permissionsStart, header, rule, ...rows, permissionsEnd].join('\n');
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) console.log(renderPermissionsTable());
