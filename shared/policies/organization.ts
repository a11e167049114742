// Who may do what with an organization's members and invitations. Every member may see
// who else belongs to their organization; only owners manage members. The platform admin
// belongs to no organization and manages none here.
import type { PolicyTable } from './policy-table.js';
import type { RoleKey } from '../roles.js';

const everyMember: RoleKey[] = ['farm:owner', 'farm:manager', 'farm:applicator', 'farm:viewer', 'apiary:owner', 'apiary:manager', 'apiary:crew', 'apiary:viewer'];
const owners: RoleKey[] = ['farm:owner', 'apiary:owner'];

export const organizationPolicy = {
  listMembers: everyMember,
  changeRole: owners,
  removeMember: owners,
  listInvitations: owners,
  invite: owners,
  revokeInvitation: owners,
} as const satisfies PolicyTable;
