// Builders for invitations and password reset tokens: they return the plain token the
// e-mail would carry, with only its hash stored, as the app does.
import { newEmailedToken } from '../../../server/src/modules/auth/emailed-tokens.js';
import type { MemberRoleValue } from '../../../shared/schemas/organization.js';
import { builderModels } from './builder-database.js';

let counter = 0;
const unique = () => `${Date.now().toString(36)}${(counter++).toString(36)}`;

export async function buildInvitation(attrs: { organization: { id: string }; role?: MemberRoleValue; email?: string; invitedBy?: { id: string } | null; expiresAt?: Date }) {
  const { token, tokenHash } = newEmailedToken();
  const invitation = await builderModels().Invitation.create({
    organizationId: attrs.organization.id,
    email: (attrs.email ?? `invitee-${unique()}@example.test`).toLowerCase(),
    role: attrs.role ?? 'viewer',
    invitedBy: attrs.invitedBy?.id ?? null,
    tokenHash,
    expiresAt: attrs.expiresAt ?? new Date(Date.now() + 7 * 24 * 3_600_000),
    acceptedAt: null,
    revokedAt: null,
  });
  return { invitation, token };
}

export async function buildPasswordResetToken(attrs: { user: { id: string }; expiresAt?: Date }) {
  const { token, tokenHash } = newEmailedToken();
  const row = await builderModels().PasswordResetToken.create({ userId: attrs.user.id, tokenHash, expiresAt: attrs.expiresAt ?? new Date(Date.now() + 3_600_000), usedAt: null });
  return { row, token };
}
