// Thin handlers for /api/calendar: the user's feed URL (read, renew) and the feed itself.
import type { Request, Response } from 'express';
import { currentUser } from '../../middleware/authenticate.js';
import type { CalendarService } from './calendar.service.js';

export function createCalendarController(service: CalendarService) {
  return {
    async current(req: Request, res: Response) {
      res.json(await service.current(currentUser(req)));
    },
    async renew(req: Request, res: Response) {
      res.status(201).json(await service.renew(currentUser(req)));
    },
    async feed(req: Request, res: Response) {
      const body = await service.feed(String(req.params.file).replace(/\.ics$/, ''));
      res.type('text/calendar; charset=utf-8').set('Cache-Control', 'private, no-store').send(body);
    },
  };
}
