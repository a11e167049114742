// Thin handlers for the admin's read-only views.
import type { Request, Response } from 'express';
import type { AdminService } from './admin.service.js';

export function createAdminController(service: AdminService) {
  return {
    async organizations(_req: Request, res: Response) {
      res.json({ organizations: await service.organizations() });
    },
    async users(_req: Request, res: Response) {
      res.json({ users: await service.users() });
    },
    async emails(_req: Request, res: Response) {
      res.json({ emails: await service.emails() });
    },
    async queues(_req: Request, res: Response) {
      res.json(await service.queues());
    },
  };
}
