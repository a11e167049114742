// /api/meta: public settings the client needs before sign-in.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { createMetaService } from './meta.service.js';
import { createMetaController } from './meta.controller.js';

export type { MetaDto } from './meta.service.js';

export function metaRoutes(ctx: AppContext): Router {
  const c = createMetaController(createMetaService(ctx));
  const router = Router();
  router.get('/', c.settings);
  return router;
}
