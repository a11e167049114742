// GET /api/meta: the client's public settings.
import type { Request, Response } from 'express';
import type { MetaService } from './meta.service.js';

export function createMetaController(service: MetaService) {
  return {
    settings(_req: Request, res: Response) {
      res.json(service.settings());
    },
  };
}
