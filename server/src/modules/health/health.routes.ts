// GET /api/health: 200 only when the database answers a query, else 503.
import { Router } from 'express';
import type { AppContext } from '../../context.js';

export function healthRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      await ctx.sequelize.query('SELECT 1', { plain: true });
      res.json({ status: 'ok', database: 'ok' });
    } catch {
      res.status(503).json({ status: 'degraded', database: 'unreachable' });
    }
  });
  return router;
}
