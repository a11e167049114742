// /api/admin: organizations, users, sent e-mails and queue health, for the platform admin only.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { adminPolicy } from './admin.policy.js';
import { createAdminService } from './admin.service.js';
import { createAdminController } from './admin.controller.js';

export function adminRoutes(ctx: AppContext): Router {
  const controller = createAdminController(createAdminService(ctx));
  const router = Router();
  router.get('/organizations', allow(adminPolicy, 'viewOrganizations'), controller.organizations);
  router.get('/users', allow(adminPolicy, 'viewUsers'), controller.users);
  router.get('/emails', allow(adminPolicy, 'viewEmails'), controller.emails);
  router.get('/queues', allow(adminPolicy, 'viewQueues'), controller.queues);
  return router;
}
