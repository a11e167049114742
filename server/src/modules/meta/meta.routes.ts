// /api/meta: public settings the client needs before sign-in (the map tile server; an
// empty URL means maps are drawn without a base layer).
import { Router } from 'express';
import type { AppContext } from '../../context.js';

export interface MetaDto {
  mapTileUrl: string;
  mapAttribution: string;
}

export function metaRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    const meta: MetaDto = { mapTileUrl: ctx.config.mapTileUrl, mapAttribution: ctx.config.mapAttribution };
    res.json(meta);
  });
  return router;
}
