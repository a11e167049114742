// The invitee's side of an invitation (no sign-in needed, the e-mailed token is the
// proof): see what the invitation is for, then set a name and password to join. A token
// works once and only before it expires. A person removed earlier from an organization
// keeps their account row (disabled); accepting a new invitation brings it back.
import type { Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import { conflict, notFound } from '../../errors/http-errors.js';
import { hashEmailedToken } from '../auth/emailed-tokens.js';
import { hashPassword } from '../auth/passwords.js';
import { assertAcceptablePassword } from '../auth/auth.service.js';
import { findActiveUser } from '../auth/passport.js';
import { toAuthUser, type AuthUser } from '../auth/auth-user.js';
import type { AcceptInvitationBody, InvitationPreview } from '../../../../shared/schemas/organization.js';

const invalidInvitation = () => notFound('This invitation (it may have expired, been used or been withdrawn)');

export function createInvitationAcceptanceService(ctx: AppContext) {
  const { Invitation, Organization, User } = ctx.models;
  async function findOpen(token: string, transaction?: Transaction) {
    const invitation = await Invitation.findOne({
      where: { tokenHash: hashEmailedToken(token) },
      include: [{ model: Organization, as: 'organization' }],
      transaction,
      lock: transaction ? { level: transaction.LOCK.UPDATE, of: Invitation } : undefined,
    });
    const open = invitation && !invitation.acceptedAt && !invitation.revokedAt && invitation.expiresAt.getTime() > ctx.now().getTime();
    if (!open) throw invalidInvitation();
    return invitation;
  }

  return {
    async preview(token: string): Promise<InvitationPreview> {
      const invitation = await findOpen(token);
      return {
        email: invitation.email,
        role: invitation.role,
        organization: { name: invitation.organization!.name, kind: invitation.organization!.kind },
        expiresAt: invitation.expiresAt.toISOString(),
      };
    },

    async accept({ token, name, password }: AcceptInvitationBody): Promise<AuthUser> {
      assertAcceptablePassword(password);
      const passwordHash = await hashPassword(password);
      const userId = await ctx.sequelize.transaction(async (transaction) => {
        const invitation = await findOpen(token, transaction);
        const existing = await User.findOne({ where: { email: invitation.email }, transaction, lock: transaction.LOCK.UPDATE });
        if (existing && !existing.disabledAt) throw conflict('That e-mail already has an active Pollenpact account; sign in instead.', { email: 'already has an account' });
        const fields = { organizationId: invitation.organizationId, name, passwordHash, role: invitation.role, disabledAt: null };
        const user = existing
          ? await existing.update(fields, { transaction })
          : await User.create({ ...fields, email: invitation.email, timeZone: null, calendarToken: null }, { transaction });
        await invitation.update({ acceptedAt: ctx.now() }, { transaction });
        return user.id;
      });
      return toAuthUser((await findActiveUser(ctx.models, { id: userId }))!);
    },
  };
}

export type InvitationAcceptanceService = ReturnType<typeof createInvitationAcceptanceService>;
