// Members of an organization and invitations to join it.
import { z } from 'zod';
import { emailSchema } from './common.js';
import { emailedTokenSchema, passwordSchema } from './auth.js';
import { memberRoleSet } from '../labels/organizations.js';

/** Every role a member can hold; the server checks it fits the organization's kind. */
const memberRoleValues = ['owner', 'manager', 'applicator', 'crew', 'viewer'] as const;
// The message names the roles as people read them, not their stored codes.
export const memberRoleSchema = z.enum(memberRoleValues, { message: `must be one of ${memberRoleValues.map((r) => memberRoleSet.labels[r]).join(', ')}` });
export type MemberRoleValue = z.infer<typeof memberRoleSchema>;

export const inviteBody = z.object({ email: emailSchema, role: memberRoleSchema });
export type InviteBody = z.infer<typeof inviteBody>;

export const roleChangeBody = z.object({ role: memberRoleSchema });
export type RoleChangeBody = z.infer<typeof roleChangeBody>;

export const invitationTokenBody = z.object({ token: emailedTokenSchema });
export type InvitationTokenBody = z.infer<typeof invitationTokenBody>;

export const acceptInvitationBody = z.object({
  token: emailedTokenSchema,
  name: z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters'),
  password: passwordSchema,
});
export type AcceptInvitationBody = z.infer<typeof acceptInvitationBody>;

export interface MemberDto {
  id: string;
  email: string;
  name: string;
  role: MemberRoleValue;
  joinedAt: string;
}

export interface InvitationDto {
  id: string;
  email: string;
  role: MemberRoleValue;
  invitedByName: string | null;
  expiresAt: string;
  createdAt: string;
}

/** What the invitation page shows before the invitee sets a password. */
export interface InvitationPreview {
  email: string;
  role: MemberRoleValue;
  organization: { name: string; kind: 'farm' | 'apiary' };
  expiresAt: string;
}
