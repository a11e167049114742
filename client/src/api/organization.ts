// Members and invitations of the signed-in user's organization, and accepting an invitation.
import { http } from './http';
import type { SessionUser } from '@shared/schemas/auth';
import type { AcceptInvitationBody, InvitationDto, InvitationPreview, InviteBody, MemberDto, MemberRoleValue } from '@shared/schemas/organization';

export const organizationApi = {
  members: () => http.get<{ members: MemberDto[] }>('/organization/members'),
  changeRole: (memberId: string, role: MemberRoleValue) => http.patch<{ member: MemberDto }>(`/organization/members/${memberId}`, { role }),
  removeMember: (memberId: string) => http.delete<{ ok: true }>(`/organization/members/${memberId}`),
  invitations: () => http.get<{ invitations: InvitationDto[] }>('/organization/invitations'),
  invite: (body: InviteBody) => http.post<{ invitation: InvitationDto }>('/organization/invitations', body),
  revokeInvitation: (invitationId: string) => http.delete<{ ok: true }>(`/organization/invitations/${invitationId}`),
  previewInvitation: (token: string) => http.post<{ invitation: InvitationPreview }>('/organization/invitations/preview', { token }),
  acceptInvitation: (body: AcceptInvitationBody) => http.post<{ user: SessionUser }>('/organization/invitations/accept', body),
};
