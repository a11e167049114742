// Inviting a person into the organization by e-mail with a role (useSubmit's saving, error,
// fieldErrors and submit); the answer is the open invitation.
import { organizationApi } from '@/api/organization';
import { useSubmit } from './useSubmit';
import type { InviteBody } from '@shared/schemas/organization';

export function useInviteMember() {
  return useSubmit(async (body: InviteBody) => (await organizationApi.invite(body)).invitation);
}
