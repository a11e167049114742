// What every request knows of its signed-in user, loaded from the database per request
// so a changed role or a removed member takes effect at once.
import type { MemberRole, OrganizationKind, RoleKey } from '../../../../shared/roles.js';
import type { SessionUser } from '../../../../shared/schemas/auth.js';
import type { User } from '../../db/models/user.model.js';

export interface AuthUser {
  id: string;
  email: string;
  name: string;
  role: MemberRole;
  roleKey: RoleKey;
  organizationId: string | null;
  organizationKind: OrganizationKind | null;
  organizationName: string | null;
  organizationTimeZone: string | null;
  units: 'imperial' | 'metric';
  timeZone: string | null;
}

/** The user's columns a request needs, from a model instance or a raw row. */
export type AuthUserSource = Pick<User, 'id' | 'email' | 'name' | 'role' | 'units' | 'timeZone'> & {
  organization?: { id: string | null; kind: OrganizationKind; name: string; timeZone: string } | null;
};

export function toAuthUser(user: AuthUserSource): AuthUser {
  // A raw row joined to no organization carries one with every column null.
  const org = user.organization?.id ? user.organization : null;
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    roleKey: user.role === 'admin' || !org ? 'admin' : (`${org.kind}:${user.role}` as RoleKey),
    organizationId: org?.id ?? null,
    organizationKind: org?.kind ?? null,
    organizationName: org?.name ?? null,
    organizationTimeZone: org?.timeZone ?? null,
    units: user.units,
    timeZone: user.timeZone,
  };
}

export function toSessionUser(user: AuthUser): SessionUser {
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    role: user.role,
    units: user.units,
    timeZone: user.timeZone,
    organization: user.organizationId
      ? { id: user.organizationId, name: user.organizationName!, kind: user.organizationKind!, timeZone: user.organizationTimeZone! }
      : null,
  };
}
