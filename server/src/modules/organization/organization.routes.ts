// /api/organization: members and invitations of the signed-in user's organization, and
// the public steps of accepting an invitation (the token travels in the body, never in
// the URL, so it stays out of request logs).
import { Router } from 'express';
import { validate } from '../../middleware/validate.js';
import { allow } from '../../middleware/authenticate.js';
import { idParams } from '../../../../shared/schemas/common.js';
import { acceptInvitationBody, invitationTokenBody, inviteBody, roleChangeBody } from '../../../../shared/schemas/organization.js';
import { organizationPolicy as policy } from './organization.policy.js';
import { createOrganizationController } from './organization.controller.js';
import { createOrganizationService } from './organization.service.js';
import { createInvitationAcceptanceService } from './invitation-acceptance.service.js';
import type { Csrf } from '../auth/csrf.js';
import type { AppContext } from '../../context.js';

export function organizationRoutes(ctx: AppContext, csrf: Csrf): Router {
  const controller = createOrganizationController(csrf, ctx.now, createOrganizationService(ctx), createInvitationAcceptanceService(ctx));
  const router = Router();
  router.get('/members', allow(policy, 'listMembers'), controller.listMembers);
  router.patch('/members/:id', allow(policy, 'changeRole'), validate({ params: idParams, body: roleChangeBody }), controller.changeRole);
  router.delete('/members/:id', allow(policy, 'removeMember'), validate({ params: idParams }), controller.removeMember);
  router.get('/invitations', allow(policy, 'listInvitations'), controller.listInvitations);
  router.post('/invitations', allow(policy, 'invite'), validate({ body: inviteBody }), controller.invite);
  router.post('/invitations/preview', validate({ body: invitationTokenBody }), controller.previewInvitation);
  router.post('/invitations/accept', validate({ body: acceptInvitationBody }), controller.acceptInvitation);
  router.delete('/invitations/:id', allow(policy, 'revokeInvitation'), validate({ params: idParams }), controller.revokeInvitation);
  return router;
}
