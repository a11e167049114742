// Organization kinds and member roles, shared by the server's policy tables and the
// client's navigation.
export const organizationKinds = ['farm', 'apiary'] as const;
export type OrganizationKind = (typeof organizationKinds)[number];

export const farmRoles = ['owner', 'manager', 'applicator', 'viewer'] as const;
export const apiaryRoles = ['owner', 'manager', 'crew', 'viewer'] as const;
export type FarmRole = (typeof farmRoles)[number];
export type ApiaryRole = (typeof apiaryRoles)[number];
export type MemberRole = FarmRole | ApiaryRole | 'admin';

/** A role as the policy tables name it: the organization kind and the role, or the platform admin. */
export type RoleKey = `farm:${FarmRole}` | `apiary:${ApiaryRole}` | 'admin';

export const allRoleKeys: RoleKey[] = [
  ...farmRoles.map((r) => `farm:${r}` as const),
  ...apiaryRoles.map((r) => `apiary:${r}` as const),
  'admin',
];

export function roleKey(kind: OrganizationKind | null, role: MemberRole): RoleKey {
  if (role === 'admin' || !kind) return 'admin';
  return `${kind}:${role}` as RoleKey;
}

export function rolesForKind(kind: OrganizationKind): readonly MemberRole[] {
  return kind === 'farm' ? farmRoles : apiaryRoles;
}

