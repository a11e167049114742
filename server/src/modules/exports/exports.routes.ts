// /api/exports/*.csv: downloads of requests, agreements and placements.
import { Router } from 'express';
import type { AppContext } from '../../context.js';
import { allow, currentUser } from '../../middleware/authenticate.js';
import { exportsPolicy } from './exports.policy.js';
import { createExportsService } from './exports.service.js';

export function exportsRoutes(ctx: AppContext): Router {
  const service = createExportsService(ctx);
  const router = Router();
  for (const kind of ['requests', 'agreements', 'placements'] as const) {
    router.get(`/${kind}.csv`, allow(exportsPolicy, 'export'), async (req, res) => {
      const csv = await service[kind](currentUser(req));
      res.type('text/csv; charset=utf-8').set('Content-Disposition', `attachment; filename="pollenpact-${kind}.csv"`).send(csv);
    });
  }
  return router;
}
