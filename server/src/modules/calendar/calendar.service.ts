// The iCalendar feed (RFC 5545, built with ical-generator) behind each user's private
// URL: expected drop-offs and pickups of their organization's agreements and open
// requests, and each confirmed delivery and pickup. The token is the only key, so it is
// long, random, and can be replaced at any time.
import { randomBytes } from 'node:crypto';
import ical from 'ical-generator';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { notFound } from '../../errors/http-errors.js';
import { feedAgreements, feedOpenRequests, feedPlacements, feedSprays } from './calendar.queries.js';

const HOUR = 3_600_000;

export type CalendarService = ReturnType<typeof createCalendarService>;

export function createCalendarService(ctx: AppContext) {
  const urlFor = (token: string) => `${ctx.config.publicUrl}/api/calendar/feed/${token}.ics`;
  return {
    async current(user: AuthUser): Promise<{ url: string | null }> {
      const row = await ctx.models.User.findByPk(user.id, { attributes: ['calendarToken'] });
      return { url: row?.calendarToken ? urlFor(row.calendarToken) : null };
    },

    async renew(user: AuthUser): Promise<{ url: string }> {
      const token = randomBytes(24).toString('base64url');
      await ctx.models.User.update({ calendarToken: token }, { where: { id: user.id } });
      return { url: urlFor(token) };
    },

    async feed(token: string): Promise<string> {
      const user = await ctx.models.User.findOne({
        attributes: ['id', 'organizationId'], where: { calendarToken: token, disabledAt: null },
        include: [{ model: ctx.models.Organization, as: 'organization', attributes: ['kind', 'name'] }],
      });
      if (!user || !user.organizationId || !user.organization) throw notFound('That calendar');
      // Times go out in UTC (RFC 5545 §3.3.5, form 2), which every calendar app shows in its own zone.
      const calendar = ical({ name: `Pollenpact · ${user.organization.name}`, prodId: { company: 'Pollenpact', product: 'season-calendar' } });
      const org = user.organizationId;
      for (const a of await feedAgreements(ctx.sequelize, org)) {
        if (!a.from || !a.to) continue;
        const note = a.state === 'awaiting-signatures' ? ' (agreement not yet confirmed by both)' : '';
        calendar.createEvent({ id: `agreement-${a.id}-dropoff@pollenpact`, start: a.from, end: new Date(a.from.getTime() + HOUR), summary: `Expected drop-off: ${a.colonies} colonies · ${a.title}`, description: `With ${a.other}${note}` });
        calendar.createEvent({ id: `agreement-${a.id}-pickup@pollenpact`, start: new Date(a.to.getTime() - HOUR), end: a.to, summary: `Expected pickup: ${a.colonies} colonies · ${a.title}`, description: `With ${a.other}${note}` });
      }
      if (user.organization.kind === 'farm') {
        for (const r of await feedOpenRequests(ctx.sequelize, org)) {
          if (!r.from || !r.to) continue;
          calendar.createEvent({ id: `request-${r.id}@pollenpact`, start: r.from, end: r.to, summary: `Hive request: ${r.colonies_requested} colonies · ${r.title}`, description: 'Hive request still open for commitments' });
        }
      }
      for (const p of await feedPlacements(ctx.sequelize, org)) {
        const geo = { title: p.site, geo: { lat: p.lat, lon: p.lon } };
        calendar.createEvent({ id: `placement-${p.id}-delivered@pollenpact`, start: p.delivered_at!, end: new Date(p.delivered_at!.getTime() + HOUR), summary: `Dropped off: ${p.colonies_delivered} colonies at ${p.site}`, location: geo });
        if (p.picked_up_at) calendar.createEvent({ id: `placement-${p.id}-picked-up@pollenpact`, start: p.picked_up_at, end: new Date(p.picked_up_at.getTime() + HOUR), summary: `Picked up: ${p.colonies_picked_up} colonies at ${p.site}`, location: geo });
      }
      for (const spray of await feedSprays(ctx.sequelize, org)) {
        if (!spray.from || !spray.to) continue;
        calendar.createEvent({
          id: `spray-${spray.id}@pollenpact`, start: spray.from, end: spray.to,
          summary: `Spray ${spray.state === 'applied' ? 'applied' : 'planned'}: ${spray.product_name} · ${spray.blocks ?? ''}`,
          description: 'Spray window with its residual time. The product label is the law; local regulations and licensed applicators decide.',
        });
      }
      return calendar.toString();
    },
  };
}
