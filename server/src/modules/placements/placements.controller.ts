// Thin handlers for /api/placements. A field step refused because the placement moved on
// answers 409 with the placement as recorded (withRecordedOnConflict), for a phone's outbox.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import { parseOrThrow } from '../../middleware/validate.js';
import { photoStepBody } from '../../../../shared/schemas/placements.js';
import type { PlacementsService } from './placements.service.js';
import { withRecordedOnConflict } from './field-step-conflict.js';

const id = (req: Request) => String(req.params.id);

export function createPlacementsController(service: PlacementsService) {
  const recorded = (req: Request) => () => service.get(currentUser(req), id(req)).then((placement) => ({ placement }));
  return {
    async list(req: Request, res: Response) {
      res.json({ placements: await service.list(currentUser(req), req.query as { agreementId?: string }) });
    },
    async get(req: Request, res: Response) {
      res.json({ placement: await service.get(currentUser(req), id(req)) });
    },
    async deliver(req: Request, res: Response) {
      res.status(201).json({ placement: await withRecordedOnConflict(() => service.deliver(currentUser(req), id(req), req.body), recorded(req)) });
    },
    async pickup(req: Request, res: Response) {
      res.status(201).json({ placement: await withRecordedOnConflict(() => service.pickup(currentUser(req), id(req), req.body), recorded(req)) });
    },
    async strengthCheck(req: Request, res: Response) {
      res.status(201).json({ placement: await withRecordedOnConflict(() => service.recordStrengthCheck(currentUser(req), id(req), req.body), recorded(req)) });
    },
    async dispute(req: Request, res: Response) {
      res.json({ placement: await service.dispute(currentUser(req), id(req), req.body) });
    },
    async addPhoto(req: Request, res: Response) {
      const { step, recordedAt } = parseOrThrow(photoStepBody, req.body ?? {});
      res.status(201).json({ placement: await withRecordedOnConflict(() => service.addPhoto(currentUser(req), id(req), step, req.file, recordedAt), recorded(req)) });
    },
    async photo(req: Request, res: Response) {
      const photo = await service.photo(currentUser(req), id(req), String(req.params.photoId));
      res.type(photo.contentType).set('Cache-Control', 'private, max-age=3600').send(photo.data);
    },
  };
}
