// /api/placements: the field steps for each drop site.
import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { idParams, idSchema } from '../../../../shared/schemas/common.js';
import { deliveryBody, disputeBody, photoParams, pickupBody, strengthCheckBody } from '../../../../shared/schemas/placements.js';
import { placementsPolicy } from './placements.policy.js';
import { createPlacementsService } from './placements.service.js';
import { createPlacementsController } from './placements.controller.js';
import { photoUpload } from './placement-photos.js';
import { idempotent } from './field-records-once.js';

const listQuery = z.object({ agreementId: idSchema.optional() });

export function placementsRoutes(ctx: AppContext): Router {
  const controller = createPlacementsController(createPlacementsService(ctx));
  const router = Router();
  // Field steps take an Idempotency-Key (a phone's outbox may send a record twice); a 409 carries what is recorded.
  const once = idempotent(ctx);
  router.get('/', allow(placementsPolicy, 'read'), validate({ query: listQuery }), controller.list);
  router.get('/:id', allow(placementsPolicy, 'read'), validate({ params: idParams }), controller.get);
  router.post('/:id/delivery', allow(placementsPolicy, 'fieldStep'), validate({ params: idParams, body: deliveryBody }), once, controller.deliver);
  router.post('/:id/pickup', allow(placementsPolicy, 'fieldStep'), validate({ params: idParams, body: pickupBody }), once, controller.pickup);
  router.post('/:id/strength-checks', allow(placementsPolicy, 'strengthCheck'), validate({ params: idParams, body: strengthCheckBody }), once, controller.strengthCheck);
  router.post('/:id/dispute', allow(placementsPolicy, 'dispute'), validate({ params: idParams, body: disputeBody }), controller.dispute);
  router.post('/:id/photos', allow(placementsPolicy, 'strengthCheck'), validate({ params: idParams }), photoUpload, once, controller.addPhoto);
  router.get('/:id/photos/:photoId', allow(placementsPolicy, 'read'), validate({ params: photoParams }), controller.photo);
  return router;
}
