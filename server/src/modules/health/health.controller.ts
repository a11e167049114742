// GET /api/health: 200 only when the database answers a query, else 503.
import type { Request, Response } from 'express';
import type { HealthService } from './health.service.js';

export function createHealthController(service: HealthService) {
  return {
    async health(_req: Request, res: Response) {
      if (await service.databaseAnswers()) res.json({ status: 'ok', database: 'ok' });
      else res.status(503).json({ status: 'degraded', database: 'unreachable' });
    },
  };
}
