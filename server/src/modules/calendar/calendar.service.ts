// The iCalendar feed (RFC 5545, built with ical-generator) behind each user's private
// URL: expected drop-offs and pickups of their organization's agreements and open
// requests, and each confirmed delivery and pickup. The token is the only key, so it is
// long, random, and can be replaced at any time.
import { randomBytes } from 'node:crypto';
import ical from 'ical-generator';
import type { AppContext } from '../../context.js';
import type { AuthUser } from '../auth/auth-user.js';
import { notFound } from '../../errors/http-errors.js';
import { execute, parseRange, selectOne, selectRows } from '../requests/sql.js';

const HOUR = 3_600_000;

export function createCalendarService(ctx: AppContext) {
  const urlFor = (token: string) => `${ctx.config.publicUrl}/api/calendar/feed/${token}.ics`;
  return {
    async current(user: AuthUser): Promise<{ url: string | null }> {
      const row = await selectOne<{ calendar_token: string | null }>(ctx, 'SELECT calendar_token FROM users WHERE id = :id', { id: user.id });
      return { url: row?.calendar_token ? urlFor(row.calendar_token) : null };
    },

    async renew(user: AuthUser): Promise<{ url: string }> {
      const token = randomBytes(24).toString('base64url');
      await execute(ctx, 'UPDATE users SET calendar_token = :token, updated_at = now() WHERE id = :id', { token, id: user.id });
      return { url: urlFor(token) };
    },

    async feed(token: string): Promise<string> {
      const user = await selectOne<{ id: string; organization_id: string | null; kind: string | null; org_name: string | null }>(
        ctx,
        `SELECT u.id, u.organization_id, o.kind, o.name AS org_name
         FROM users u LEFT JOIN organizations o ON o.id = u.organization_id WHERE u.calendar_token = :token AND u.disabled_at IS NULL`,
        { token },
      );
      if (!user || !user.organization_id) throw notFound('That calendar');
      // Times go out in UTC (RFC 5545 §3.3.5, form 2), which every calendar app shows in its own zone.
      const calendar = ical({ name: `Pollenpact · ${user.org_name}`, prodId: { company: 'Pollenpact', product: 'season-calendar' } });
      const org = user.organization_id;
      const agreements = await selectRows<{ id: string; title: string; other: string; colonies: number; window: string; state: string }>(
        ctx,
        `SELECT a.id, r.title, CASE WHEN a.farm_id = :org THEN ao.name ELSE fo.name END AS other, a.colonies, a.expected_on_site::text AS window, a.state
         FROM agreements a JOIN hive_requests r ON r.id = a.request_id JOIN organizations fo ON fo.id = a.farm_id JOIN organizations ao ON ao.id = a.apiary_id
         WHERE (a.farm_id = :org OR a.apiary_id = :org) AND a.state IN ('awaiting-signatures', 'in-force', 'completed')`,
        { org },
      );
      for (const a of agreements) {
        const w = parseRange(a.window);
        if (!w?.from || !w.to) continue;
        const note = a.state === 'awaiting-signatures' ? ' (agreement not yet confirmed by both)' : '';
        calendar.createEvent({ id: `agreement-${a.id}-dropoff@pollenpact`, start: new Date(w.from), end: new Date(Date.parse(w.from) + HOUR), summary: `Expected drop-off: ${a.colonies} colonies · ${a.title}`, description: `With ${a.other}${note}` });
        calendar.createEvent({ id: `agreement-${a.id}-pickup@pollenpact`, start: new Date(Date.parse(w.to) - HOUR), end: new Date(w.to), summary: `Expected pickup: ${a.colonies} colonies · ${a.title}`, description: `With ${a.other}${note}` });
      }
      if (user.kind === 'farm') {
        const requests = await selectRows<{ id: string; title: string; colonies_requested: number; window: string }>(
          ctx,
          "SELECT id, title, colonies_requested, expected_on_site::text AS window FROM hive_requests WHERE farm_id = :org AND state IN ('listed', 'filled') AND NOT EXISTS (SELECT 1 FROM agreements a WHERE a.request_id = hive_requests.id AND a.state <> 'cancelled')",
          { org },
        );
        for (const r of requests) {
          const w = parseRange(r.window);
          if (!w?.from || !w.to) continue;
          calendar.createEvent({ id: `request-${r.id}@pollenpact`, start: new Date(w.from), end: new Date(w.to), summary: `Colonies wanted: ${r.colonies_requested} · ${r.title}`, description: 'Request still open for commitments' });
        }
      }
      const placements = await selectRows<{ id: string; site: string; colonies_delivered: number | null; delivered_at: Date | null; colonies_picked_up: number | null; picked_up_at: Date | null; lon: number; lat: number }>(
        ctx,
        `SELECT p.id, d.name AS site, p.colonies_delivered, p.delivered_at, p.colonies_picked_up, p.picked_up_at, ST_X(d.location) AS lon, ST_Y(d.location) AS lat
         FROM placements p JOIN agreements a ON a.id = p.agreement_id JOIN drop_sites d ON d.id = p.drop_site_id
         WHERE (a.farm_id = :org OR a.apiary_id = :org) AND p.delivered_at IS NOT NULL`,
        { org },
      );
      for (const p of placements) {
        const geo = { title: p.site, geo: { lat: p.lat, lon: p.lon } };
        calendar.createEvent({ id: `placement-${p.id}-delivered@pollenpact`, start: new Date(p.delivered_at!), end: new Date(new Date(p.delivered_at!).getTime() + HOUR), summary: `Delivered: ${p.colonies_delivered} colonies at ${p.site}`, location: geo });
        if (p.picked_up_at) calendar.createEvent({ id: `placement-${p.id}-picked-up@pollenpact`, start: new Date(p.picked_up_at), end: new Date(new Date(p.picked_up_at).getTime() + HOUR), summary: `Picked up: ${p.colonies_picked_up} colonies at ${p.site}`, location: geo });
      }
      // Spray windows (with their residual time): a farm's own, and for an apiary business
      // those that raised an alert for it and are not resolved.
      const sprays = await selectRows<{ id: string; product_name: string; state: string; exposure: string; blocks: string }>(
        ctx,
        `SELECT s.id, s.product_name, s.state, s.exposure_window::text AS exposure,
           (SELECT string_agg(b.name, ', ' ORDER BY b.name) FROM spray_plan_blocks sb JOIN blocks b ON b.id = sb.block_id WHERE sb.spray_plan_id = s.id) AS blocks
         FROM spray_plans s
         WHERE s.state <> 'cancelled' AND (s.farm_id = :org
           OR EXISTS (SELECT 1 FROM alerts al WHERE al.spray_plan_id = s.id AND al.apiary_id = :org AND al.state <> 'resolved'))`,
        { org },
      );
      for (const spray of sprays) {
        const w = parseRange(spray.exposure);
        if (!w?.from || !w.to) continue;
        calendar.createEvent({
          id: `spray-${spray.id}@pollenpact`, start: new Date(w.from), end: new Date(w.to),
          summary: `Spray ${spray.state === 'applied' ? 'applied' : 'planned'}: ${spray.product_name} · ${spray.blocks ?? ''}`,
          description: 'Spray window with its residual time. The product label is the law; local regulations and licensed applicators decide.',
        });
      }
      return calendar.toString();
    },
  };
}
