// /api/placements: the field steps for each drop site.
import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../../context.js';
import { allow, currentUser } from '../../middleware/authenticate.js';
import { parseOrThrow, validate } from '../../middleware/validate.js';
import { idParams, idSchema } from '../../../../shared/schemas/common.js';
import { deliveryBody, disputeBody, photoParams, photoStepBody, pickupBody, strengthCheckBody } from '../../../../shared/schemas/placements.js';
import { placementsPolicy } from './placements.policy.js';
import { createPlacementsService } from './placements.service.js';
import { photoUpload } from './placement-photos.js';

const listQuery = z.object({ agreementId: idSchema.optional() });

export function placementsRoutes(ctx: AppContext): Router {
  const service = createPlacementsService(ctx);
  const router = Router();
  const id = (req: { params: Record<string, unknown> }) => String(req.params.id);
  router.get('/', allow(placementsPolicy, 'read'), validate({ query: listQuery }), async (req, res) => {
    res.json({ placements: await service.list(currentUser(req), req.query as { agreementId?: string }) });
  });
  router.get('/:id', allow(placementsPolicy, 'read'), validate({ params: idParams }), async (req, res) => {
    res.json({ placement: await service.get(currentUser(req), id(req)) });
  });
  router.post('/:id/delivery', allow(placementsPolicy, 'fieldStep'), validate({ params: idParams, body: deliveryBody }), async (req, res) => {
    res.json({ placement: await service.deliver(currentUser(req), id(req), req.body) });
  });
  router.post('/:id/pickup', allow(placementsPolicy, 'fieldStep'), validate({ params: idParams, body: pickupBody }), async (req, res) => {
    res.json({ placement: await service.pickup(currentUser(req), id(req), req.body) });
  });
  router.post('/:id/strength-checks', allow(placementsPolicy, 'strengthCheck'), validate({ params: idParams, body: strengthCheckBody }), async (req, res) => {
    res.status(201).json({ placement: await service.recordStrengthCheck(currentUser(req), id(req), req.body) });
  });
  router.post('/:id/dispute', allow(placementsPolicy, 'dispute'), validate({ params: idParams, body: disputeBody }), async (req, res) => {
    res.json({ placement: await service.dispute(currentUser(req), id(req), req.body) });
  });
  router.post('/:id/photos', allow(placementsPolicy, 'strengthCheck'), validate({ params: idParams }), photoUpload, async (req, res) => {
    const { step } = parseOrThrow(photoStepBody, req.body ?? {});
    res.status(201).json({ placement: await service.addPhoto(currentUser(req), id(req), step, req.file) });
  });
  router.get('/:id/photos/:photoId', allow(placementsPolicy, 'read'), validate({ params: photoParams }), async (req, res) => {
    const photo = await service.photo(currentUser(req), id(req), String(req.params.photoId));
    res.type(photo.content_type).set('Cache-Control', 'private, max-age=3600').send(photo.data);
  });
  return router;
}
