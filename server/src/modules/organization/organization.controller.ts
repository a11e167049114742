// /api/organization handlers: a few lines each; the rules live in the services.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import { signIn } from '../auth/auth.controller.js';
import type { Csrf } from '../auth/csrf.js';
import type { OrganizationService } from './organization.service.js';
import type { InvitationAcceptanceService } from './invitation-acceptance.service.js';

export function createOrganizationController(csrf: Csrf, now: () => Date, service: OrganizationService, acceptance: InvitationAcceptanceService) {
  return {
    async listMembers(req: Request, res: Response) {
      res.json({ members: await service.listMembers(currentUser(req)) });
    },
    async changeRole(req: Request, res: Response) {
      res.json({ member: await service.changeRole(currentUser(req), String(req.params.id), req.body) });
    },
    async removeMember(req: Request, res: Response) {
      await service.removeMember(currentUser(req), String(req.params.id));
      res.json({ ok: true });
    },
    async listInvitations(req: Request, res: Response) {
      res.json({ invitations: await service.listInvitations(currentUser(req)) });
    },
    async invite(req: Request, res: Response) {
      res.status(201).json({ invitation: await service.invite(currentUser(req), req.body) });
    },
    async revokeInvitation(req: Request, res: Response) {
      await service.revokeInvitation(currentUser(req), String(req.params.id));
      res.json({ ok: true });
    },
    async previewInvitation(req: Request, res: Response) {
      res.json({ invitation: await acceptance.preview(req.body.token) });
    },
    async acceptInvitation(req: Request, res: Response) {
      await signIn(req, res, csrf, now, await acceptance.accept(req.body), 201);
    },
  };
}
