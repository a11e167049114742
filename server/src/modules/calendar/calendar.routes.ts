// /api/calendar: the user's private feed URL (read, renew) and the feed itself, which is
// fetched by calendar apps without a session: the secret token in the URL is the key.
import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../../context.js';
import { allow } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { calendarPolicy } from './calendar.policy.js';
import { createCalendarService } from './calendar.service.js';
import { createCalendarController } from './calendar.controller.js';

const feedParams = z.object({ file: z.string().regex(/^[A-Za-z0-9_-]{20,64}\.ics$/, 'must be a calendar token ending in .ics') });

export function calendarRoutes(ctx: AppContext): Router {
  const controller = createCalendarController(createCalendarService(ctx));
  const router = Router();
  router.get('/', allow(calendarPolicy, 'manage'), controller.current);
  router.post('/token', allow(calendarPolicy, 'manage'), controller.renew);
  router.get('/feed/:file', validate({ params: feedParams }), controller.feed);
  return router;
}
