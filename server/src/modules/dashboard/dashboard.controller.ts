// Thin handlers for the overview routes: parsed input in, the service's answer out.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { DashboardService } from './dashboard.service.js';
import type { BeekeeperDashboardQuery, ColoniesOwnedBody, SeasonQuery } from '../../../../shared/schemas/dashboard.js';

export function createDashboardController(service: DashboardService) {
  const season = (req: Request) => (req.query as unknown as SeasonQuery).season;
  return {
    async grower(req: Request, res: Response) {
      res.json(await service.grower(currentUser(req), season(req)));
    },
    async beekeeper(req: Request, res: Response) {
      const query = req.query as unknown as BeekeeperDashboardQuery & SeasonQuery;
      res.json(await service.beekeeper(currentUser(req), query.days, query.season));
    },
    async setColoniesOwned(req: Request, res: Response) {
      res.json(await service.setColoniesOwned(currentUser(req), (req.body as ColoniesOwnedBody).coloniesOwned));
    },
    async timeline(req: Request, res: Response) {
      res.json(await service.timeline(currentUser(req), season(req)));
    },
    async map(req: Request, res: Response) {
      res.json(await service.map(currentUser(req), season(req)));
    },
  };
}
