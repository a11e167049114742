// Thin handlers for /api/exports/*.csv: the file as a download.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { ExportsService } from './exports.service.js';

export function createExportsController(service: ExportsService) {
  return {
    download(kind: 'requests' | 'agreements' | 'placements') {
      return async (req: Request, res: Response) => {
        const csv = await service[kind](currentUser(req));
        res.type('text/csv; charset=utf-8').set('Content-Disposition', `attachment; filename="pollenpact-${kind}.csv"`).send(csv);
      };
    },
  };
}
