// Members and invitations of the signed-in user's organization. Every query is scoped to
// that organization: another organization's member or invitation answers 404. An
// organization always keeps at least one owner. A removed member is disabled (so the
// history they wrote keeps its author) and their sessions end at once.
import { Op, type Transaction } from 'sequelize';
import type { AppContext } from '../../context.js';
import type { Models } from '../../db/models/index.js';
import type { Invitation } from '../../db/models/invitation.model.js';
import type { User } from '../../db/models/user.model.js';
import { badRequest, conflict, notFound } from '../../errors/http-errors.js';
import { enqueueEmail } from '../../jobs/send-email.job.js';
import { endSessionsOf } from '../auth/end-sessions.js';
import { emailedLink, newEmailedToken } from '../auth/emailed-tokens.js';
import type { AuthUser } from '../auth/auth-user.js';
import { rolesForKind } from '../../../../shared/roles.js';
import { memberRoleSet } from '../../../../shared/labels/organizations.js';
import { labelOf } from '../../../../shared/labels/label-set.js';
import type { InvitationDto, InviteBody, MemberDto, MemberRoleValue, RoleChangeBody } from '../../../../shared/schemas/organization.js';

export const invitationLifetimeMs = 7 * 24 * 3_600_000;

const memberNotFound = () => notFound('That member');
const invitationNotFound = () => notFound('That invitation');

export function toMemberDto(user: User): MemberDto {
  return { id: user.id, email: user.email, name: user.name, role: user.role as MemberRoleValue, joinedAt: user.createdAt.toISOString() };
}

export function toInvitationDto(invitation: Invitation, invitedByName: string | null): InvitationDto {
  return {
    id: invitation.id,
    email: invitation.email,
    role: invitation.role,
    invitedByName,
    expiresAt: invitation.expiresAt.toISOString(),
    createdAt: invitation.createdAt.toISOString(),
  };
}

function organizationOf(user: AuthUser): { id: string; kind: 'farm' | 'apiary'; name: string } {
  // The policy table admits only organization members, so these are always set here.
  return { id: user.organizationId!, kind: user.organizationKind!, name: user.organizationName! };
}

function assertRoleFitsKind(role: MemberRoleValue, kind: 'farm' | 'apiary') {
  const allowed = rolesForKind(kind);
  if (!allowed.includes(role)) {
    const roleName = (code: string) => labelOf(memberRoleSet, code);
    throw badRequest(`A ${kind === 'farm' ? 'farm' : 'apiary business'} has no role "${roleName(role)}".`, { role: `must be one of ${allowed.map(roleName).join(', ')}` });
  }
}

/** Locks the organization row so two owners changing roles at once cannot leave it without an owner. */
async function assertAnotherOwnerRemains({ Organization, User }: Models, organizationId: string, member: User, transaction: Transaction) {
  if (member.role !== 'owner') return;
  await Organization.findByPk(organizationId, { transaction, lock: transaction.LOCK.UPDATE });
  const owners = await User.count({ where: { organizationId, role: 'owner', disabledAt: null }, transaction });
  if (owners <= 1) throw conflict('An organization needs at least one owner: make another member an owner first.', { role: 'the last owner cannot give up the role' });
}

export function createOrganizationService(ctx: AppContext) {
  const { Invitation, User } = ctx.models;
  const openInvitation = (organizationId: string) => ({
    organizationId,
    acceptedAt: { [Op.is]: null },
    revokedAt: { [Op.is]: null },
    expiresAt: { [Op.gt]: ctx.now() },
  });

  async function findMember(user: AuthUser, memberId: string, transaction?: Transaction) {
    const member = await User.findOne({ where: { id: memberId, organizationId: organizationOf(user).id, disabledAt: null }, transaction, lock: transaction?.LOCK.UPDATE });
    if (!member) throw memberNotFound();
    return member;
  }

  return {
    async listMembers(user: AuthUser): Promise<MemberDto[]> {
      const members = await User.findAll({ where: { organizationId: organizationOf(user).id, disabledAt: null }, order: [['name', 'ASC'], ['email', 'ASC']] });
      return members.map(toMemberDto);
    },

    async changeRole(user: AuthUser, memberId: string, { role }: RoleChangeBody): Promise<MemberDto> {
      const org = organizationOf(user);
      return ctx.sequelize.transaction(async (transaction) => {
        const member = await findMember(user, memberId, transaction);
        assertRoleFitsKind(role, org.kind);
        if (member.role === role) return toMemberDto(member);
        if (role !== 'owner') await assertAnotherOwnerRemains(ctx.models, org.id, member, transaction);
        await member.update({ role }, { transaction });
        return toMemberDto(member);
      });
    },

    async removeMember(user: AuthUser, memberId: string): Promise<void> {
      const org = organizationOf(user);
      const removedId = await ctx.sequelize.transaction(async (transaction) => {
        const member = await findMember(user, memberId, transaction);
        await assertAnotherOwnerRemains(ctx.models, org.id, member, transaction);
        await member.update({ disabledAt: ctx.now() }, { transaction });
        return member.id;
      });
      await endSessionsOf(ctx, removedId);
    },

    async listInvitations(user: AuthUser): Promise<InvitationDto[]> {
      const invitations = await Invitation.findAll({
        where: openInvitation(organizationOf(user).id),
        include: [{ model: User, as: 'inviter', attributes: ['name'] }],
        order: [['createdAt', 'DESC']],
      });
      return invitations.map((i) => toInvitationDto(i, i.inviter?.name ?? null));
    },

    /** Inviting an address again replaces its open invitation (and sends a new link). */
    async invite(user: AuthUser, { email, role }: InviteBody): Promise<InvitationDto> {
      const org = organizationOf(user);
      assertRoleFitsKind(role, org.kind);
      const existing = await User.findOne({ where: { email, disabledAt: null } });
      if (existing) {
        throw conflict(
          existing.organizationId === org.id ? 'That person is already a member.' : 'That e-mail already has a Pollenpact account with another organization.',
          { email: existing.organizationId === org.id ? 'is already a member' : 'already belongs to another organization' },
        );
      }
      const { token, tokenHash } = newEmailedToken();
      const invitation = await ctx.sequelize.transaction(async (transaction) => {
        await Invitation.update(
          { revokedAt: ctx.now() },
          { where: { organizationId: org.id, email, acceptedAt: { [Op.is]: null }, revokedAt: { [Op.is]: null } }, transaction },
        );
        return Invitation.create(
          { organizationId: org.id, email, role, invitedBy: user.id, tokenHash, expiresAt: new Date(ctx.now().getTime() + invitationLifetimeMs), acceptedAt: null, revokedAt: null },
          { transaction },
        );
      });
      const link = emailedLink(ctx.config.publicUrl, 'invitation', token);
      await enqueueEmail(ctx.jobs, {
        to: email,
        subject: `${user.name} invited you to ${org.name} on Pollenpact`,
        text: [
          'Hello,',
          '',
          `${user.name} invited you to join ${org.name} on Pollenpact as ${memberRoleSet.labels[role]}.`,
          `Set your password and sign in here: ${link}`,
          '',
          'The link works once and expires in 7 days. If you did not expect this, ignore this e-mail.',
        ].join('\n'),
      });
      return toInvitationDto(invitation, user.name);
    },

    async revokeInvitation(user: AuthUser, invitationId: string): Promise<void> {
      const [revoked] = await Invitation.update({ revokedAt: ctx.now() }, { where: { id: invitationId, ...openInvitation(organizationOf(user).id) } });
      if (revoked !== 1) throw invitationNotFound();
    },
  };
}

export type OrganizationService = ReturnType<typeof createOrganizationService>;
