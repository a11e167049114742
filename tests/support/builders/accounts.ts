// Builders for organizations and their members, used by tests and by the demo seed.
import type { Organization } from '../../../server/src/db/models/organization.model.js';
import type { User } from '../../../server/src/db/models/user.model.js';
import { hashPassword, passwordCost } from '../../../server/src/modules/auth/passwords.js';
import type { MemberRole, OrganizationKind } from '../../../shared/roles.js';
import { builderModels, builderSequelize } from './builder-database.js';

let counter = 0;
const unique = () => `${Date.now().toString(36)}${(counter++).toString(36)}`;

export const defaultTestPassword = 'pollen-demo-2026';
/**
 * Accounts built inside the test runner are hashed at a low scrypt cost: the server verifies
 * each hash at the cost stored in it, so the suite's many sign-ins stay cheap, while every
 * hash the server makes (sign-up, reset, invitation) and the demo seed keep the full cost.
 */
const builderCost = process.env.VITEST ? { ...passwordCost, N: 2 ** 10 } : passwordCost;
let cachedDefaultHash: Promise<string> | null = null;
const hashFor = (password: string) =>
  password === defaultTestPassword ? (cachedDefaultHash ??= hashPassword(defaultTestPassword, builderCost)) : hashPassword(password, builderCost);

export async function buildOrganization(attrs: { kind: OrganizationKind; name?: string; timeZone?: string; coloniesOwned?: number | null; billingEmail?: string | null; taxRateBp?: number }) {
  return builderModels().Organization.create({
    kind: attrs.kind,
    name: attrs.name ?? `${attrs.kind === 'farm' ? 'Farm' : 'Apiary'} ${unique()}`,
    timeZone: attrs.timeZone ?? 'America/Los_Angeles',
    billingEmail: attrs.billingEmail ?? null,
    coloniesOwned: attrs.coloniesOwned ?? null,
    taxRateBp: attrs.taxRateBp ?? 0,
  });
}

export async function buildUser(attrs: { organization: Organization | null; role: MemberRole; email?: string; name?: string; password?: string; units?: 'imperial' | 'metric' }) {
  return builderModels().User.create({
    organizationId: attrs.organization?.id ?? null,
    email: (attrs.email ?? `${attrs.role}-${unique()}@example.test`).toLowerCase(),
    name: attrs.name ?? `Test ${attrs.role}`,
    passwordHash: await hashFor(attrs.password ?? defaultTestPassword),
    role: attrs.role,
    units: attrs.units ?? 'imperial',
    timeZone: null,
    calendarToken: null,
    disabledAt: null,
  });
}

/** A farm and an apiary business with one member of every role each, plus an admin. */
export async function buildRoleCast(prefix = unique()) {
  const farm = await buildOrganization({ kind: 'farm', name: `Farm ${prefix}` });
  const apiary = await buildOrganization({ kind: 'apiary', name: `Apiary ${prefix}` });
  const members = {
    'farm:owner': await buildUser({ organization: farm, role: 'owner', email: `farm-owner-${prefix}@example.test` }),
    'farm:manager': await buildUser({ organization: farm, role: 'manager', email: `farm-manager-${prefix}@example.test` }),
    'farm:applicator': await buildUser({ organization: farm, role: 'applicator', email: `farm-applicator-${prefix}@example.test` }),
    'farm:viewer': await buildUser({ organization: farm, role: 'viewer', email: `farm-viewer-${prefix}@example.test` }),
    'apiary:owner': await buildUser({ organization: apiary, role: 'owner', email: `apiary-owner-${prefix}@example.test` }),
    'apiary:manager': await buildUser({ organization: apiary, role: 'manager', email: `apiary-manager-${prefix}@example.test` }),
    'apiary:crew': await buildUser({ organization: apiary, role: 'crew', email: `apiary-crew-${prefix}@example.test` }),
    'apiary:viewer': await buildUser({ organization: apiary, role: 'viewer', email: `apiary-viewer-${prefix}@example.test` }),
    admin: await buildUser({ organization: null, role: 'admin', email: `admin-${prefix}@example.test` }),
  };
  return { farm, apiary, members };
}
