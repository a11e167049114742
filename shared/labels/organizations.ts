// Organization kinds and member roles.
import { organizationKinds, type OrganizationKind, type MemberRole } from '../roles.js';
import { labelSet } from './label-set.js';

export const organizationKindSet = labelSet<OrganizationKind>('organization kinds', organizationKinds, {
  farm: 'Farm',
  apiary: 'Apiary business',
});

export const memberRoles = ['owner', 'manager', 'applicator', 'crew', 'viewer', 'admin'] as const satisfies readonly MemberRole[];

export const memberRoleSet = labelSet<MemberRole>('member roles', memberRoles, {
  owner: 'Owner',
  manager: 'Manager',
  applicator: 'Applicator',
  crew: 'Field crew',
  viewer: 'Viewer',
  admin: 'Platform admin',
});
