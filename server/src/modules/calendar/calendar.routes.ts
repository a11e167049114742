// /api/calendar: the user's private feed URL (read, renew) and the feed itself, which is
// fetched by calendar apps without a session: the secret token in the URL is the key.
import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../../context.js';
import { allow, currentUser } from '../../middleware/authenticate.js';
import { validate } from '../../middleware/validate.js';
import { calendarPolicy } from './calendar.policy.js';
import { createCalendarService } from './calendar.service.js';

const feedParams = z.object({ file: z.string().regex(/^[A-Za-z0-9_-]{20,64}\.ics$/, 'must be a calendar token ending in .ics') });

export function calendarRoutes(ctx: AppContext): Router {
  const service = createCalendarService(ctx);
  const router = Router();
  router.get('/', allow(calendarPolicy, 'manage'), async (req, res) => {
    res.json(await service.current(currentUser(req)));
  });
  router.post('/token', allow(calendarPolicy, 'manage'), async (req, res) => {
    res.status(201).json(await service.renew(currentUser(req)));
  });
  router.get('/feed/:file', validate({ params: feedParams }), async (req, res) => {
    const body = await service.feed(String(req.params.file).replace(/\.ics$/, ''));
    res.type('text/calendar; charset=utf-8').set('Cache-Control', 'private, no-store').send(body);
  });
  return router;
}
